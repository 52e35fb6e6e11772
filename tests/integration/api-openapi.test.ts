import { dereference, validate } from "@readme/openapi-parser";
import { Ajv2020 } from "ajv/dist/2020.js";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { API_V1_PATHS, apiDocument } from "~/lib/api/openapi";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import { resetThrottles } from "~/utils/rate-limit.server";
import { api, DEMO_TEAM, teamId, tokenFor } from "./api-helpers";
import { EMAIL, teamWide } from "./helpers";
import { appRoutes } from "./routes-list";
import { ownerDb } from "../setup/db-roles";

// The OpenAPI document: valid OpenAPI 3.1 by a parser from the registry, naming exactly the /api/v1
// routes of app/routes.ts, and a real answer of every endpoint (and its refusals) fits the schema the
// document gives for it, checked by a JSON Schema 2020-12 validator.
// Loops of hundreds of requests on a shared two-core machine: generous limits (speed lives in npm run bench).
vi.setConfig({ testTimeout: 60_000 });

type Doc = {
  openapi: string;
  paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: object }> }> }>>;
};
let doc: Doc;

beforeAll(async () => {}, 60_000);
beforeEach(() => resetThrottles());

describe("the document", () => {
  it("validates as OpenAPI 3.1", async () => {
    const served = await api("GET", "/api/v1/openapi.json");
    expect(served.status).toBe(200);
    expect(served.headers.get("Cache-Control")).toBe("public, max-age=300");
    const result = await validate(structuredClone(served.body) as never);
    expect(result).toMatchObject({ valid: true, specification: "OpenAPI" });
    expect((served.body as Doc).openapi).toBe("3.1.0");
  });

  it("lists every /api/v1 route of app/routes.ts, and no other", async () => {
    const routed = (await appRoutes()).map((r) => r.path).filter((p) => p.startsWith("/api/v1/"));
    expect(routed.sort()).toEqual(Object.keys(API_V1_PATHS).sort());
    expect(Object.keys(apiDocument().paths ?? {}).sort()).toEqual(Object.values(API_V1_PATHS).sort());
  });

  it("documents, for each route, the methods the route module answers", async () => {
    const routes = await appRoutes();
    for (const [routerPath, docPath] of Object.entries(API_V1_PATHS)) {
      const route = routes.find((r) => r.path === routerPath)!;
      const methods = Object.keys(apiDocument().paths![docPath]!).sort();
      // an API module's loader with no GET in the document only answers 405
      const documentsGet = methods.includes("get");
      const documentsPost = methods.includes("post");
      expect(Boolean(route.action), `${routerPath} POST`).toBe(documentsPost);
      if (documentsGet) expect(route.loader, `${routerPath} GET`).toBeTypeOf("function");
    }
  });
});

describe("real answers fit their documented schemas", () => {
  let token = "";
  let builder = "";
  let engineId = 0;
  let planId = 0;
  let input: unknown;
  const ajv = new Ajv2020({ strict: false, allErrors: true });

  beforeAll(async () => {
    doc = (await dereference(structuredClone(apiDocument()) as never)) as unknown as Doc;
    token = await tokenFor(EMAIL.viewer);
    builder = await tokenFor(EMAIL.builder);
    const demo = await teamId(DEMO_TEAM);
    engineId = (await ownerDb()("engines").where({ team_id: demo, cylinders: 4 }).first("id")).id;
    const plan = (await listPlans(demo, engineId))[0]!;
    planId = plan.id;
    input = assemblePlanInput((await planParts(demo, (await getEngine(teamWide(demo), engineId))!, plan))!);
  }, 60_000);

  function check(docPath: string, method: string, status: number, body: unknown) {
    const schema = doc.paths[docPath]![method]!.responses[String(status)]?.content?.["application/json"]?.schema;
    expect(schema, `${method} ${docPath} documents ${status}`).toBeDefined();
    const valid = ajv.validate(schema!, body);
    expect(valid ? [] : ajv.errors, `${method} ${docPath} ${status}`).toEqual([]);
  }

  it("every endpoint's success answer", async () => {
    await api("POST", "/api/v1/runs", {
      token: builder,
      body: { engineId, ranOn: "2026-11-29", kind: "pass", outcome: "seeping", cylindersAffected: [2] },
    });
    const samples: [string, "get" | "post", () => Promise<{ status: number; body: unknown }>][] = [
      ["/api/v1/engines", "get", () => api("GET", "/api/v1/engines", { token })],
      ["/api/v1/engines/{engineId}", "get", () => api("GET", `/api/v1/engines/${engineId}`, { token })],
      ["/api/v1/engines/{engineId}/plans", "get", () => api("GET", `/api/v1/engines/${engineId}/plans`, { token })],
      ["/api/v1/engines/{engineId}/plans/{planId}", "get", () => api("GET", `/api/v1/engines/${engineId}/plans/${planId}`, { token })],
      ["/api/v1/estimate", "post", () => api("POST", "/api/v1/estimate", { token, body: { input } })],
      ["/api/v1/sweep", "post", () => api("POST", "/api/v1/sweep", { token, body: { input, fromNm: 30, toNm: 200, points: 9 } })],
      ["/api/v1/runs", "get", () => api("GET", "/api/v1/runs", { token })],
      [
        "/api/v1/runs",
        "post",
        () => api("POST", "/api/v1/runs", { token: builder, body: { engineId, ranOn: "2026-11-30", kind: "dyno", outcome: "held" } }),
      ],
    ];
    for (const [path, method, send] of samples) {
      const out = await send();
      expect(out.status, `${method} ${path}`).toBeLessThan(300);
      check(path, method, out.status, out.body);
    }
    expect(samples.map(([p]) => p).sort()).toEqual(
      Object.values(API_V1_PATHS)
        .filter((p) => p !== "/api/v1/openapi.json")
        .flatMap((p) => (p === "/api/v1/runs" ? [p, p] : [p]))
        .sort(),
    );
  });

  it("and a schema rejects what it should (the check can fail)", () => {
    const schema = doc.paths["/api/v1/engines/{engineId}"]!.get!.responses["200"]!.content!["application/json"]!.schema;
    expect(ajv.validate(schema, { id: "one" })).toBe(false);
  });

  it("the refusals: 400, 401, 403, 404 and 413 have the documented error body", async () => {
    const cases: [string, "get" | "post", number, () => Promise<{ status: number; body: unknown }>][] = [
      ["/api/v1/sweep", "post", 400, () => api("POST", "/api/v1/sweep", { token, body: { input, fromNm: -1, toNm: 1 } })],
      ["/api/v1/engines", "get", 401, () => api("GET", "/api/v1/engines")],
      [
        "/api/v1/runs",
        "post",
        403,
        () => api("POST", "/api/v1/runs", { token, body: { engineId, ranOn: "2026-11-30", kind: "dyno", outcome: "held" } }),
      ],
      ["/api/v1/engines/{engineId}", "get", 404, () => api("GET", "/api/v1/engines/999999", { token })],
      ["/api/v1/estimate", "post", 413, () => api("POST", "/api/v1/estimate", { token, body: { input, pad: "x".repeat(70_000) } })],
    ];
    for (const [path, method, status, send] of cases) {
      const out = await send();
      expect(out.status, `${method} ${path}`).toBe(status);
      check(path, method, status, out.body);
    }
  });
});
