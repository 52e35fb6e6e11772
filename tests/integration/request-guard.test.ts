import { createCookieSessionStorage } from "react-router";
import { beforeAll, describe, expect, it, vi } from "vitest";
import * as estimateApi from "~/routes/api/estimate";
import * as healthz from "~/routes/api/healthz";
import * as settings from "~/routes/shop/settings";
import * as team from "~/routes/shop/team";
import * as login from "~/routes/auth/login";
import * as logout from "~/routes/auth/logout";
import * as signup from "~/routes/auth/signup";
import * as engineEdit from "~/routes/engines/edit";
import * as engineList from "~/routes/engines/list";
import * as engineNew from "~/routes/engines/new";
import * as overview from "~/routes/engines/overview";
import * as libraryEdit from "~/routes/libraries/edit";
import * as compare from "~/routes/plans/compare";
import * as planEditor from "~/routes/plans/editor";
import * as planNew from "~/routes/plans/new";
import { handleError } from "~/entry.server";
import { MAX_FORM_BYTES } from "~/utils/request-guard.server";
import { flashToast, readToast } from "~/utils/toast.server";
import { call, get, ORIGIN, signIn, type Handler } from "./helpers";
import { through } from "./pipeline";
import { ownerDb } from "../setup/db-roles";

let builder = "";
let owner = "";
let engineId = 0;
let planId = 0;
let gasketId = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  owner = await signIn("owner@example.com");
  const teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  engineId = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 4 }).first("id")).id;
  planId = (await ownerDb()("seal_plans").where({ team_id: teamId, engine_id: engineId }).first("id")).id;
  gasketId = (await ownerDb()("gaskets").where({ team_id: teamId }).first("id")).id;
});

const h = (fn: unknown) => fn as Handler;

// Every form action of the app, with the params its URL gives it.
const ACTIONS = () =>
  [
    { path: "/login", action: login.action, params: {} },
    { path: "/signup", action: signup.action, params: {} },
    { path: "/logout", action: logout.action, params: {} },
    { path: "/settings", action: settings.action, params: {} },
    { path: "/team", action: team.action, params: {} },
    { path: "/engines/new", action: engineNew.action, params: {} },
    { path: `/engines/${engineId}/edit`, action: engineEdit.action, params: { engineId: String(engineId) } },
    { path: `/engines/${engineId}/plans/new`, action: planNew.action, params: { engineId: String(engineId) } },
    {
      path: `/engines/${engineId}/plans/${planId}`,
      action: planEditor.action,
      params: { engineId: String(engineId), planId: String(planId) },
    },
    { path: `/engines/${engineId}/compare`, action: compare.action, params: { engineId: String(engineId) } },
    { path: "/libraries/gaskets/new", action: libraryEdit.action, params: { kind: "gaskets" } },
    { path: `/libraries/gaskets/${gasketId}`, action: libraryEdit.action, params: { kind: "gaskets", itemId: String(gasketId) } },
  ] as const;

function raw(
  path: string,
  init: { type?: string | null; body?: BodyInit | null; cookie?: string; origin?: string | null; length?: string },
) {
  const headers = new Headers();
  if (init.type) headers.set("Content-Type", init.type);
  if (init.cookie) headers.set("Cookie", init.cookie);
  if (init.origin !== null) headers.set("Origin", init.origin ?? ORIGIN);
  if (init.length) headers.set("Content-Length", init.length);
  return new Request(ORIGIN + path, {
    method: "POST",
    headers,
    body: init.body ?? null,
    ...(init.body instanceof ReadableStream ? { duplex: "half" } : {}),
  } as RequestInit);
}

describe("defect 6: a wrong or missing Content-Type is answered 415/400, never 500", () => {
  const cases: { type: string | null; body: string; status: number }[] = [
    { type: "text/plain", body: "email=a", status: 415 },
    { type: "application/json", body: '{"email":"a"}', status: 415 },
    { type: null, body: "email=a", status: 415 },
    { type: "application/xml", body: "<a/>", status: 415 },
    { type: "multipart/form-data", body: "email=a", status: 400 },
    { type: "multipart/form-data; boundary=zzz", body: "not a multipart body", status: 400 },
  ];
  for (const c of cases) {
    it(`${c.type ?? "no Content-Type"} → ${c.status} on every form action`, async () => {
      for (const a of ACTIONS()) {
        const out = await through(h(a.action), raw(a.path, { type: c.type, body: c.body, cookie: builder }), a.params);
        expect(out.status, a.path).toBe(c.status);
      }
    });
  }

  it("the API answers a form post 415 in JSON", async () => {
    const out = await through(
      h(estimateApi.action),
      raw("/api/v1/estimate", { type: "application/x-www-form-urlencoded", body: "input=1", cookie: builder }),
    );
    expect(out.status).toBe(415);
    expect(out.body).toEqual({ error: "Send the body as JSON (Content-Type: application/json)." });
  });
});

describe("a NUL character in a form (PostgreSQL text cannot hold one)", () => {
  it("is refused 400 by the guard on both engines, before the action or the database sees it", async () => {
    for (const body of ["email=owner%40example.com&password=a%00b", "email=owner%40example.com%00&password=x"]) {
      const out = await through(h(login.action), raw("/login", { type: "application/x-www-form-urlencoded", body }));
      expect(out.status).toBe(400);
      expect(out.body).toBe("The form holds a NUL character, which no field accepts.");
    }
    // the text "%00" typed into a field arrives encoded as %2500: it reaches the action (a wrong password)
    const typed = await through(
      h(login.action),
      raw("/login", { type: "application/x-www-form-urlencoded", body: "email=owner%40example.com&password=%2500" }),
    );
    expect(JSON.stringify(typed.body)).not.toContain("NUL character");
    expect(JSON.stringify(typed.body)).toContain("password");
  });
});

describe("defect 12: form bodies are capped (413) before they are parsed", () => {
  it("a 50 MB sign-in body is refused by the guard, not parsed by the action", async () => {
    const body = "email=owner%40example.com&password=" + "x".repeat(50 * 1024 * 1024);
    const out = await through(h(login.action), raw("/login", { type: "application/x-www-form-urlencoded", body }));
    expect(out.status).toBe(413);
    expect(out.body).toBe(`The body is larger than ${MAX_FORM_BYTES / 1024} KiB.`);
  });

  it("a declared Content-Length over the cap is refused from the header alone", async () => {
    const out = await through(
      h(login.action),
      raw("/login", { type: "application/x-www-form-urlencoded", body: "email=a", length: String(MAX_FORM_BYTES + 1) }),
    );
    expect(out.status).toBe(413);
  });

  it("a chunked body with no length is cut off at the cap", async () => {
    let sent = 0;
    const chunk = new TextEncoder().encode("a".repeat(16 * 1024));
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        // endless unless the reader stops: 16 KiB at a time
        sent += chunk.byteLength;
        controller.enqueue(chunk);
        if (sent > 64 * 1024 * 1024) controller.close();
      },
    });
    const out = await through(h(login.action), raw("/login", { type: "application/x-www-form-urlencoded", body: stream }));
    expect(out.status).toBe(413);
    expect(sent).toBeLessThan(MAX_FORM_BYTES * 3);
  });

  it("a form just under the cap still reaches the action", async () => {
    const body = new URLSearchParams({ email: "nobody@example.com", password: "x".repeat(MAX_FORM_BYTES - 200) }).toString();
    const out = await through(h(login.action), raw("/login", { type: "application/x-www-form-urlencoded", body }));
    expect(out.status).toBe(400);
    expect(out.body).toMatchObject({ error: "Wrong e-mail or password." });
  });
});

const TABLE = [
  "Content-Security-Policy",
  "X-Content-Type-Options",
  "X-Frame-Options",
  "Referrer-Policy",
  "Permissions-Policy",
  "Cache-Control",
];

describe("defect 11: the header table on every response that passes the root middleware", () => {
  it("API JSON: the table, and Cache-Control no-store", async () => {
    const out = await through(h(estimateApi.action), raw("/api/v1/estimate", { type: "application/json", body: "{}", cookie: builder }));
    expect(out.status).toBe(400);
    for (const name of TABLE) expect(out.headers.get(name), name).toBeTruthy();
    expect(out.headers.get("Cache-Control")).toBe("no-store");
    expect(out.headers.get("Content-Security-Policy")).toBe(
      "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'",
    );
  });

  it("/healthz, a redirect and the API's cross-site refusal", async () => {
    const health = await through(h(healthz.loader), get("/healthz"));
    const redirect = await through(h(engineList.loader), get("/engines"));
    const refused = await through(
      h(estimateApi.action),
      raw("/api/v1/estimate", { type: "application/json", body: "{}", cookie: builder, origin: "http://evil.example" }),
    );
    expect([health.status, redirect.status, refused.status]).toEqual([200, 302, 403]);
    for (const out of [health, redirect, refused]) for (const name of TABLE) expect(out.headers.get(name), name).toBeTruthy();
  });
});

describe("defect 13: one log line for a cross-site refusal", () => {
  it("our own check: one console.warn line, no console.error, nothing written", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const before = await ownerDb()("teams").select("name");
    const out = await through(
      h(team.action),
      raw("/team", { type: "application/x-www-form-urlencoded", body: "name=Forged", cookie: owner, origin: "http://evil.example" }),
    );
    expect(out.status).toBe(403);
    expect(warn).toHaveBeenCalledTimes(1);
    expect(String(warn.mock.calls[0]![0])).toBe('refused cross-site POST /team from "http://evil.example"');
    expect(await ownerDb()("teams").select("name")).toEqual(before);
    warn.mockRestore();
  });

  it("React Router's own refusal, handed to handleError: one line, no stack", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const request = raw("/team", { type: "application/x-www-form-urlencoded", body: "name=x", origin: "http://evil.example" });
    const context = { request, params: {}, context: undefined } as unknown as Parameters<typeof handleError>[1];
    handleError(
      new Error("The `request.url` origin does not match `origin` header from a forwarded action request. Aborting the action."),
      context,
    );
    handleError(new Error("Bad Request"), context);
    expect(warn.mock.calls.map((c) => c.join(" "))).toEqual([
      'refused cross-site POST /team from "http://evil.example"',
      'refused cross-site POST /team from "http://evil.example"',
    ]);
    warn.mockRestore();
  });
});

describe("defect 13: ids are decimal integers only", () => {
  for (const bad of ["0x1", "1e0", "1.0", " 1", "+1", "01", "-1", "1_0", "Infinity"]) {
    it(`/engines/${bad} is not engine 1`, async () => {
      const real = await ownerDb()("engines").orderBy("id").first("id");
      const text = bad.replace("1", String(real.id));
      const direct = await call(h(overview.loader), get(`/engines/${encodeURIComponent(text)}`, builder), { engineId: text });
      expect(direct.status).toBe(404);
      const piped = await through(h(planEditor.loader), get(`/engines/${engineId}/plans/${encodeURIComponent(bad)}`, builder), {
        engineId: String(engineId),
        planId: bad,
      });
      expect(piped.status).toBe(404);
    });
  }

  it("a library item id in hex is not found", async () => {
    const out = await through(h(libraryEdit.loader), get(`/libraries/gaskets/0x${gasketId.toString(16)}`, builder), {
      kind: "gaskets",
      itemId: `0x${gasketId.toString(16)}`,
    });
    expect(out.status).toBe(404);
  });
});

describe("defect 9: sort takes only the table's own columns", () => {
  for (const sort of ["toString", "constructor", "__proto__", "hasOwnProperty", "valueOf"]) {
    it(`/engines?sort=${sort} → 200, sorted by updated`, async () => {
      const out = await call(h(engineList.loader), get(`/engines?sort=${sort}`, builder));
      expect(out.status).toBe(200);
      expect((out.body as { sort: string }).sort).toBe("updated");
    });
  }
  it("a page number past SQLite's integers is still a page", async () => {
    const out = await call(h(engineList.loader), get("/engines?page=368934881474191033", builder));
    expect(out.status).toBe(200);
    expect((out.body as { rows: unknown[] }).rows).toEqual([]);
  });
});

describe("defect 13: the toast cookie is signed with the session secret", () => {
  it("a toast signed with the old constant is not shown", async () => {
    const forged = createCookieSessionStorage({ cookie: { name: "sw_toast", secrets: ["toast-not-secret"] } });
    const session = await forged.getSession();
    session.flash("toast", { kind: "done", message: "Your account is suspended; call 555-0100" });
    const cookie = (await forged.commitSession(session)).split(";")[0]!;
    expect((await readToast(new Request(ORIGIN, { headers: { Cookie: cookie } }))).toast).toBeNull();
  });
  it("the app's own toast reads back", async () => {
    const cookie = (await flashToast(new Request(ORIGIN), { kind: "done", message: "Saved." })).split(";")[0]!;
    expect((await readToast(new Request(ORIGIN, { headers: { Cookie: cookie } }))).toast).toEqual({ kind: "done", message: "Saved." });
  });
});
