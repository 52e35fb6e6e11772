import { isRouteErrorResponse } from "react-router";

export const ORIGIN = "http://localhost:3000";

/** The people every guard matrix runs as: nobody, the demo shop's three roles, and another shop's owner. */
export type Who = "anonymous" | "viewer" | "builder" | "owner" | "otherTeam";
export const WHO: Who[] = ["anonymous", "viewer", "builder", "owner", "otherTeam"];
export const EMAIL: Record<Exclude<Who, "anonymous">, string> = {
  viewer: "viewer@example.com",
  builder: "builder@example.com",
  owner: "owner@example.com",
  otherTeam: "other-owner@example.com",
};
export const DEMO_PASSWORD = "sealwright-demo";

export interface Outcome {
  status: number;
  location: string | null;
  setCookie: string | null;
  body: unknown;
}

// Loose on purpose: each route's generated argument type differs; call() passes what the router would.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Handler = (args: any) => unknown;

// Runs a loader or action the way the router would and folds returned or thrown results into one shape.
export async function call(handler: Handler, request: Request, params: Record<string, string> = {}): Promise<Outcome> {
  try {
    return await fold(await handler({ request, params, context: undefined, url: new URL(request.url), pattern: "" }));
  } catch (thrown) {
    return fold(thrown, true);
  }
}

async function fold(value: unknown, thrown = false): Promise<Outcome> {
  if (value instanceof Response) {
    const type = value.headers.get("Content-Type") ?? "";
    return {
      status: value.status,
      location: value.headers.get("Location"),
      setCookie: value.headers.get("Set-Cookie"),
      body: type.includes("json") ? await value.json() : await value.text(),
    };
  }
  // data(…, init) returns or throws a DataWithResponseInit.
  if (value && typeof value === "object" && (value as { type?: string }).type === "DataWithResponseInit") {
    const d = value as unknown as { data: unknown; init?: ResponseInit };
    const headers = new Headers(d.init?.headers);
    return { status: d.init?.status ?? 200, location: headers.get("Location"), setCookie: headers.get("Set-Cookie"), body: d.data };
  }
  if (isRouteErrorResponse(value)) return { status: value.status, location: null, setCookie: null, body: value.data };
  if (thrown) throw value;
  return { status: 200, location: null, setCookie: null, body: value };
}

export function get(path: string, cookie?: string | null): Request {
  return new Request(ORIGIN + path, { headers: cookie ? { Cookie: cookie } : {} });
}

export function post(path: string, fields: Record<string, string>, cookie?: string | null): Request {
  const headers: Record<string, string> = { Origin: ORIGIN, "Content-Type": "application/x-www-form-urlencoded" };
  if (cookie) headers.Cookie = cookie;
  return new Request(ORIGIN + path, { method: "POST", headers, body: new URLSearchParams(fields).toString() });
}

/** The cookie pair ("name=value") out of a Set-Cookie header. */
export function cookiePair(setCookie: string | null): string {
  if (!setCookie) throw new Error("no Set-Cookie header");
  return setCookie.split(";")[0]!;
}

export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const login = await import("~/routes/auth/login");
  const out = await call(login.action as Handler, post("/login", { email, password }));
  if (out.status !== 302) throw new Error(`sign-in of ${email} failed: ${out.status} ${JSON.stringify(out.body)}`);
  return cookiePair(out.setCookie);
}

export type { Handler };

/** Who is asking, for calling the engine queries directly: the whole team, as a builder or owner sees it. */
export function teamWide(teamId: number): { teamId: number; userId: number; role: "owner" } {
  return { teamId, userId: 0, role: "owner" };
}
