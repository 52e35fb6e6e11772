import crypto from "node:crypto";
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import { RouterContextProvider } from "react-router";
import { setEngineShare } from "~/models/engine-share.server";
import { getLibraryItem, updateLibraryItem } from "~/models/library.server";
import { listPlans } from "~/models/plan.server";
import { teamDataVersion } from "~/models/team-version.server";
import { middleware as rootMiddleware, loader as rootLoader } from "~/root";
import * as team from "~/routes/shop/team";
import * as settings from "~/routes/shop/settings";
import * as logout from "~/routes/auth/logout";
import * as shopLayout from "~/routes/shop/layout";
import * as engineLayout from "~/routes/engines/layout";
import * as editor from "~/routes/plans/editor";
import { ownerDb } from "../setup/db-roles";
import { documentRequestContext, PAGE_CACHE } from "~/utils/page-cache.server";
import { call, get, post, signIn, type Handler } from "./helpers";

// The editor page behind the root middleware and the page cache, as the server runs it. The "render" is a
// stand-in for React's: it runs the page's four loaders (root, shop layout, engine layout, editor) and
// writes their data into an HTML page with a script nonce, so a page from the cache and a fresh one can be
// told apart by how many times it ran and compared by what they show.

let renders = 0;
let teamId = 0;
let engineId = 0;
let planId = 0;
let path = "";
const cookies = { builder: "", owner: "", viewer: "", other: "" };

type Middleware = (
  args: { request: Request; params: Record<string, string>; context: unknown },
  next: () => Promise<Response>,
) => Promise<Response>;

async function render(request: Request, params: Record<string, string>): Promise<Response> {
  renders++;
  const args = { request, params, context: undefined, url: new URL(request.url), pattern: "" };
  try {
    const root = (await rootLoader(args as never)) as unknown as { data: unknown; init?: ResponseInit | null };
    const shop = await shopLayout.loader(args as never);
    const engine = await engineLayout.loader(args as never);
    const page = await editor.loader(args as never);
    const nonce = crypto.randomBytes(16).toString("base64");
    const headers = new Headers(root.init?.headers);
    headers.set("Content-Type", "text/html");
    headers.set("Content-Security-Policy", `script-src 'self' 'nonce-${nonce}'`);
    const body = `<!DOCTYPE html><html><body><script nonce="${nonce}">${JSON.stringify({ root: root.data, shop, engine, page })}</script></body></html>`;
    return new Response(body, { status: 200, headers });
  } catch (thrown) {
    if (thrown instanceof Response) return thrown;
    const d = thrown as { type?: string; init?: ResponseInit };
    if (d?.type === "DataWithResponseInit") return new Response(null, { status: d.init?.status ?? 500 });
    throw thrown;
  }
}

/** One page request; document false for a client navigation's .data request. */
async function page(cookie: string | null, opts: { document?: boolean; url?: string; extraCookie?: string } = {}) {
  const context = new RouterContextProvider();
  context.set(documentRequestContext, opts.document ?? true);
  const request = get(opts.url ?? path, [cookie, opts.extraCookie].filter(Boolean).join("; ") || null);
  const params = { engineId: String(engineId), planId: String(planId) };
  const chain = [...(rootMiddleware as unknown as Middleware[]), ...(editor.middleware as unknown as Middleware[])];
  const args = { request, params, context };
  const step = (i: number): Promise<Response> => (i < chain.length ? chain[i]!(args, () => step(i + 1)) : render(request, params));
  let response: Response;
  try {
    response = await step(0);
  } catch (thrown) {
    if (thrown instanceof Response) response = thrown;
    else throw thrown;
  }
  const body = await response.text();
  const nonce = /nonce="([^"]+)"/.exec(body)?.[1] ?? null;
  const shown = nonce ? JSON.parse(/<script nonce="[^"]+">(.*)<\/script>/.exec(body)![1]!) : null;
  return { status: response.status, headers: response.headers, body, nonce, shown };
}

/** The same page twice in a row: how many renders the second took, and both answers. */
async function twice(cookie: string) {
  const first = await page(cookie);
  const before = renders;
  const second = await page(cookie);
  return { first, second, rendered: renders - before };
}

beforeAll(async () => {
  cookies.builder = await signIn("builder@example.com");
  cookies.owner = await signIn("owner@example.com");
  cookies.viewer = await signIn("viewer@example.com");
  cookies.other = await signIn("other-owner@example.com");
  teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  engineId = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 4 }).first("id")).id;
  planId = (await listPlans(teamId, engineId))[0]!.id;
  path = `/engines/${engineId}/plans/${planId}`;
});

beforeEach(() => PAGE_CACHE.clear());

describe("plan editor page cache", () => {
  it("answers the same person's second request from the cache, with a fresh nonce in the body and the header", async () => {
    const { first, second, rendered } = await twice(cookies.builder);
    expect(first.status).toBe(200);
    expect(rendered).toBe(0);
    expect(second.status).toBe(200);
    expect(second.nonce).not.toBe(first.nonce);
    expect(second.headers.get("Content-Security-Policy")).toBe(`script-src 'self' 'nonce-${second.nonce}'`);
    expect(second.body.replaceAll(second.nonce!, "N")).toBe(first.body.replaceAll(first.nonce!, "N"));
    // the root middleware's header table is on the cached answer too
    expect(second.headers.get("X-Frame-Options")).toBe("DENY");
  });

  it("renders afresh after the plan is saved, and shows the saved plan", async () => {
    await page(cookies.builder);
    const row = await ownerDb()("seal_plans").where({ id: planId }).first();
    const form = {
      intent: "save",
      name: "Cache test: saved plan",
      gasketId: String(row.gasket_id),
      fastenerId: String(row.fastener_id),
      lubricant: "Moly paste",
      threadFriction: "0.12",
      bearingFriction: "0.12",
      method: "torque-estimated-friction",
      torque: "140",
      stages: "60, 100, 140",
      wireLocation: "block",
      wireProjection: "0.1",
      receiverGrooveDepth: "0",
      sleeveProtrusion: "",
      targetMargin: "1.5",
      notes: "",
    };
    const saved = await call(editor.action as Handler, post(path, form, cookies.builder), {
      engineId: String(engineId),
      planId: String(planId),
    });
    expect(saved.status).toBe(302);
    const before = renders;
    const after = await page(cookies.builder);
    expect(renders - before).toBe(1);
    expect(after.shown.page.plan.name).toBe("Cache test: saved plan");
    expect(after.shown.page.plan.torqueNm).toBeCloseTo(140, 6);
    // and the new page is the one kept
    expect((await twice(cookies.builder)).rendered).toBe(0);
  });

  it("renders afresh after an edit of the plan's fastener in the library", async () => {
    const first = await page(cookies.builder);
    const fastenerId = first.shown.page.plan.fastenerId as number;
    const item = (await getLibraryItem("fasteners", teamId, fastenerId))!;
    const builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
    const { id: _id, teamId: _t, ...input } = item as unknown as Record<string, unknown>;
    const renamed = { ...input, name: "Cache test: renamed stud" };
    expect(await updateLibraryItem("fasteners", teamId, fastenerId, builderId, renamed as never)).toBe(true);
    const before = renders;
    const after = await page(cookies.builder);
    expect(renders - before).toBe(1);
    const names = (after.shown.page.choices.fasteners as { id: number; name: string }[])
      .filter((f) => f.id === fastenerId)
      .map((f) => f.name);
    expect(names).toEqual(["Cache test: renamed stud"]);
  });

  it("renders afresh after the person changes their units, and shows the figures in the new units", async () => {
    const metric = await page(cookies.builder);
    expect(metric.shown.page.units).toBe("metric");
    const changed = await call(settings.action as Handler, post("/settings", { intent: "profile", units: "imperial" }, cookies.builder));
    expect(changed.status).toBe(302);
    try {
      const before = renders;
      const imperial = await page(cookies.builder);
      expect(renders - before).toBe(1);
      expect(imperial.shown.page.units).toBe("imperial");
      expect(imperial.body).not.toBe(metric.body);
    } finally {
      await call(settings.action as Handler, post("/settings", { intent: "profile", units: "metric" }, cookies.builder));
    }
  });

  it("never gives one person's page to another of the same shop and role: each renders their own", async () => {
    // a second builder of the demo shop (same role, same memberships as the first): only the person differs
    const builder = await ownerDb()("users").where({ email: "builder@example.com" }).first();
    const [second] = await ownerDb()("users")
      .insert({
        email: "second-builder@example.com",
        name: "Second Builder",
        password_hash: builder.password_hash,
        units: "metric",
        created_at: builder.created_at,
      })
      .returning("id");
    await ownerDb()("memberships").insert({
      user_id: (second as { id: number }).id,
      team_id: teamId,
      role: "builder",
      created_at: builder.created_at,
    });
    const secondCookie = await signIn("second-builder@example.com");
    await page(cookies.builder);
    const before = renders;
    const mine = await page(secondCookie);
    expect(renders - before).toBe(1);
    expect(mine.shown.shop.user.email).toBe("second-builder@example.com");
    expect(mine.body).not.toContain('"email":"builder@example.com"');
    const owner = await page(cookies.owner);
    expect(renders - before).toBe(2);
    expect(owner.shown.shop.user.email).toBe("owner@example.com");
  });

  it("never gives a page to another shop's owner; a viewer gets their own page, and none once the share is taken away", async () => {
    const kept = await page(cookies.builder);
    expect(kept.status).toBe(200);
    const other = await page(cookies.other);
    expect(other.status).toBe(404);
    expect(other.body).not.toContain(kept.shown.page.plan.name);
    let before = renders;
    const viewer = await page(cookies.viewer);
    expect(renders - before).toBe(1);
    expect(viewer.status).toBe(200);
    expect(viewer.shown.shop.user.email).toBe("viewer@example.com");
    expect(viewer.shown.page.canEdit).toBe(false);
    expect(viewer.body).not.toContain("builder@example.com");
    const ownerId = (await ownerDb()("users").where({ email: "owner@example.com" }).first("id")).id;
    const viewerId = (await ownerDb()("users").where({ email: "viewer@example.com" }).first("id")).id;
    await setEngineShare(teamId, ownerId, engineId, viewerId, false);
    try {
      before = renders;
      expect((await page(cookies.viewer)).status).toBe(404);
      expect(renders - before).toBe(1);
    } finally {
      await setEngineShare(teamId, ownerId, engineId, viewerId, true);
    }
    expect((await page(cookies.viewer)).status).toBe(200);
  });

  it("renders afresh after a role change (the write's audit row moves the version) and shows the new role", async () => {
    const first = await page(cookies.builder);
    expect(first.shown.page.canEdit).toBe(true);
    const builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
    const version = await teamDataVersion(teamId);
    const demoted = await call(
      team.action as Handler,
      post("/team", { intent: "role", userId: String(builderId), role: "viewer" }, cookies.owner),
    );
    expect(demoted.status).toBe(302);
    try {
      expect(await teamDataVersion(teamId)).toBeGreaterThan(version);
      // a viewer sees only engines shared with them: this one is not
      expect((await page(cookies.builder)).status).toBe(404);
    } finally {
      await call(team.action as Handler, post("/team", { intent: "role", userId: String(builderId), role: "builder" }, cookies.owner));
    }
    expect((await page(cookies.builder)).shown.page.canEdit).toBe(true);
  });

  it("sends a signed-out session to sign-in, not to the page it saw before", async () => {
    const cookie = await signIn("builder@example.com");
    expect((await page(cookie)).status).toBe(200);
    const out = await call(logout.action as Handler, post("/logout", {}, cookie));
    expect(out.status).toBe(302);
    const after = await page(cookie);
    expect(after.status).toBe(302);
    expect(after.headers.get("Location")).toMatch(/^\/login\?redirectTo=/);
    expect((await page(null)).status).toBe(302);
  });

  it("neither keeps nor serves a page while a toast is waiting, nor answers a .data request from the table", async () => {
    await page(cookies.builder);
    let before = renders;
    await page(cookies.builder, { extraCookie: "sw_toast=anything" });
    expect(renders - before).toBe(1);
    before = renders;
    await page(cookies.builder, { document: false });
    expect(renders - before).toBe(1);
    // another URL (a query) is another page
    before = renders;
    await page(cookies.builder, { url: `${path}?x=1` });
    expect(renders - before).toBe(1);
  });

  it("keeps no page that showed a toast, and the next page shows none", async () => {
    PAGE_CACHE.clear();
    const flash = await call(editor.action as Handler, post(path, { intent: "choose" }, cookies.builder), {
      engineId: String(engineId),
      planId: String(planId),
    });
    const toast = flash.setCookie!.split(";")[0]!;
    const withToast = await page(cookies.builder, { extraCookie: toast });
    expect(withToast.shown.root.toast.message).toMatch(/chosen plan/);
    expect(PAGE_CACHE.size).toBe(0);
    const plain = await page(cookies.builder);
    expect(plain.shown.root.toast).toBeNull();
  });
});
