import { RouterContextProvider } from "react-router";
import { createToken } from "~/models/api-token.server";
import type { Role } from "~/models/user.server";
import { clientAddressContext } from "~/utils/client-address.server";
import { ORIGIN } from "./helpers";
import { through, type Answer } from "./pipeline";
import { appRoutes, type RouteInfo } from "./routes-list";
import { ownerDb } from "../setup/db-roles";

// Calls the JSON API the way a script or the browser would: the path is matched against app/routes.ts,
// the request runs behind the root middleware, with a bearer token or a cookie, from an address.

let routes: RouteInfo[] | undefined;

async function match(pathname: string): Promise<{ route: RouteInfo; params: Record<string, string> }> {
  routes ??= await appRoutes();
  for (const route of routes) {
    const names: string[] = [];
    const re = new RegExp(`^${route.path.replace(/\./g, "\\.").replace(/:(\w+)/g, (_, n: string) => (names.push(n), "([^/]+)"))}$`);
    const m = re.exec(pathname);
    if (m) return { route, params: Object.fromEntries(names.map((n, i) => [n, decodeURIComponent(m[i + 1]!)])) };
  }
  throw new Error(`no route for ${pathname}`);
}

export interface ApiCall {
  token?: string;
  cookie?: string;
  /** A value to send as JSON, or the raw body text. */
  body?: unknown;
  raw?: string;
  type?: string;
  origin?: string | null;
  address?: string;
  headers?: Record<string, string>;
}

export async function api(method: "GET" | "POST" | "PUT" | "DELETE", path: string, o: ApiCall = {}): Promise<Answer> {
  const url = new URL(ORIGIN + path);
  const { route, params } = await match(url.pathname);
  const headers = new Headers(o.headers);
  if (o.token) headers.set("Authorization", `Bearer ${o.token}`);
  if (o.cookie) headers.set("Cookie", o.cookie);
  if (o.origin !== null && (o.cookie || o.origin)) headers.set("Origin", o.origin ?? ORIGIN);
  let body: string | undefined;
  if (method !== "GET") {
    body = o.raw ?? JSON.stringify(o.body ?? {});
    headers.set("Content-Type", o.type ?? "application/json");
  }
  const context = new RouterContextProvider();
  context.set(clientAddressContext, o.address ?? "198.51.100.7");
  const handler = method === "GET" ? route.loader : route.action;
  const call = handler ? (args: Record<string, unknown>) => handler({ ...args, context }) : undefined;
  return through(call, new Request(url, { method, headers, body }), params);
}

export async function userId(email: string): Promise<number> {
  return (await ownerDb()("users").where({ email }).first("id")).id;
}

export async function teamId(name: string): Promise<number> {
  return (await ownerDb()("teams").where({ name }).first("id")).id;
}

export const DEMO_TEAM = "Harrow Lane Boost Works";
export const OTHER_TEAM = "Saltmarsh Dyno Cell";

/** A live token for the person in their (first) team at `role` (their own role when not given). */
export async function tokenFor(email: string, role?: Role): Promise<string> {
  const uid = await userId(email);
  const m = await ownerDb()("memberships").where({ user_id: uid }).orderBy("team_id").first();
  return (await createToken(m.team_id, uid, `test ${email}`, role ?? m.role)).token;
}

export async function rowCounts(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of ["runs", "api_tokens", "audit_events", "engines", "seal_plans"]) {
    if (await ownerDb().schema.hasTable(t)) out[t] = Number((await ownerDb()(t).count({ n: "*" }).first())!.n);
  }
  return out;
}

/** An engine of the other shop (the demo seed gives it none): a copy of one demo engine, on its own materials. */
export async function otherTeamEngine(): Promise<number> {
  const other = await teamId(OTHER_TEAM);
  const existing = await ownerDb()("engines").where({ team_id: other }).first("id");
  if (existing) return existing.id;
  const demo = await ownerDb()("engines")
    .where({ team_id: await teamId(DEMO_TEAM), cylinders: 4 })
    .first();
  const own = async (materialId: number | null) => {
    if (materialId === null) return null;
    const name = (await ownerDb()("materials").where({ id: materialId }).first("name")).name;
    return (await ownerDb()("materials").where({ team_id: other, name }).first("id")).id;
  };
  const { id: _id, ...row } = demo;
  const [made] = await ownerDb()("engines")
    .insert({
      ...row,
      team_id: other,
      name: "Other shop's test engine",
      chosen_plan_id: null,
      block_material_id: await own(demo.block_material_id),
      head_material_id: await own(demo.head_material_id),
      sleeve_material_id: await own(demo.sleeve_material_id),
    })
    .returning("id");
  return typeof made === "object" ? made.id : made;
}
