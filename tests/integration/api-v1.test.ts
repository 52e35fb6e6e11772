import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import { resetThrottles } from "~/utils/rate-limit.server";
import { api, DEMO_TEAM, OTHER_TEAM, otherTeamEngine, rowCounts, teamId, tokenFor } from "./api-helpers";
import { EMAIL, signIn, teamWide } from "./helpers";
import { ownerDb } from "../setup/db-roles";

// Every /api/v1 endpoint as each role of the demo shop and as another shop's owner, once with a
// personal token and once with the session cookie: the status each gets, and what a foreign team sees.
// Loops of hundreds of requests on a shared two-core machine: generous limits (speed lives in npm run bench).
vi.setConfig({ testTimeout: 60_000 });

type Person = "viewer" | "builder" | "owner" | "otherTeam";
const PEOPLE: Person[] = ["viewer", "builder", "owner", "otherTeam"];
const token: Partial<Record<Person, string>> = {};
const cookie: Partial<Record<Person, string>> = {};
let demoTeam = 0;
let otherTeam = 0;
let engineId = 0;
let planId = 0;
let planInput: unknown;

beforeAll(async () => {
  await otherTeamEngine();
  for (const p of PEOPLE) {
    token[p] = await tokenFor(EMAIL[p]);
    cookie[p] = await signIn(EMAIL[p]);
  }
  demoTeam = await teamId(DEMO_TEAM);
  otherTeam = await teamId(OTHER_TEAM);
  engineId = (await ownerDb()("engines").where({ team_id: demoTeam, cylinders: 4 }).first("id")).id;
  const engine = (await getEngine(teamWide(demoTeam), engineId))!;
  const plan = (await listPlans(demoTeam, engineId))[0]!;
  planId = plan.id;
  planInput = assemblePlanInput((await planParts(demoTeam, engine, plan))!);
}, 60_000);
beforeEach(() => resetThrottles());

const run = () => ({
  engineId,
  ranOn: "2026-11-30",
  kind: "dyno",
  manifoldPressureKpa: 260,
  fuel: "E85",
  outcome: "held",
  cylindersAffected: [],
  notes: "test pull",
});

// [method, path, body] → expected status for viewer, builder, owner, otherTeam
const ENDPOINTS: [string, () => [method: "GET" | "POST", path: string, body?: unknown], [number, number, number, number]][] = [
  ["engines", () => ["GET", "/api/v1/engines"], [200, 200, 200, 200]],
  ["engine", () => ["GET", `/api/v1/engines/${engineId}`], [200, 200, 200, 404]],
  ["plans", () => ["GET", `/api/v1/engines/${engineId}/plans`], [200, 200, 200, 404]],
  ["plan", () => ["GET", `/api/v1/engines/${engineId}/plans/${planId}`], [200, 200, 200, 404]],
  ["estimate", () => ["POST", "/api/v1/estimate", { input: planInput }], [200, 200, 200, 200]],
  ["sweep", () => ["POST", "/api/v1/sweep", { input: planInput, fromNm: 50, toNm: 150, points: 3 }], [200, 200, 200, 200]],
  ["runs list", () => ["GET", `/api/v1/runs?engineId=${engineId}`], [200, 200, 200, 200]],
  ["runs create", () => ["POST", "/api/v1/runs", run()], [403, 201, 201, 404]],
  ["openapi", () => ["GET", "/api/v1/openapi.json"], [200, 200, 200, 200]],
];

describe("every endpoint × role × credential", () => {
  for (const via of ["token", "cookie"] as const) {
    it(`with a ${via}: each answers as documented`, async () => {
      const wrong: string[] = [];
      for (const [name, make, want] of ENDPOINTS) {
        for (const [i, p] of PEOPLE.entries()) {
          const [method, path, body] = make();
          const out = await api(method, path, via === "token" ? { token: token[p], body } : { cookie: cookie[p], body });
          if (out.status !== want[i])
            wrong.push(`${name} as ${p}: ${out.status} ${JSON.stringify(out.body).slice(0, 120)}, expected ${want[i]}`);
        }
      }
      expect(wrong).toEqual([]);
    });
  }

  it("without credentials every endpoint but the document answers 401 with a Bearer challenge", async () => {
    for (const [name, make] of ENDPOINTS) {
      const [method, path, body] = make();
      const out = await api(method, path, { body });
      if (name === "openapi") expect(out.status).toBe(200);
      else {
        expect(out.status, name).toBe(401);
        expect(out.headers.get("WWW-Authenticate")).toMatch(/^Bearer/);
        expect(Object.keys(out.body as object)).toEqual(["error"]);
      }
    }
  });

  it("another team's owner lists only their own engines and runs", async () => {
    const demo = await api("GET", "/api/v1/engines?limit=100", { token: token.owner });
    const other = await api("GET", "/api/v1/engines?limit=100", { token: token.otherTeam });
    const demoIds = (demo.body as { items: { id: number }[] }).items.map((e) => e.id);
    const otherIds = (other.body as { items: { id: number }[] }).items.map((e) => e.id);
    const otherInDb = (await ownerDb()("engines").where({ team_id: otherTeam }).whereNull("archived_at").pluck("id")) as number[];
    expect(demoIds).toContain(engineId);
    expect(otherInDb).toHaveLength(1);
    expect(otherIds.sort()).toEqual(otherInDb.sort());
    expect(otherIds.filter((id) => demoIds.includes(id))).toEqual([]);
    await api("POST", "/api/v1/runs", { token: token.builder, body: run() });
    const runs = await api("GET", "/api/v1/runs", { token: token.otherTeam });
    expect((runs.body as { items: unknown[] }).items).toEqual([]);
  });

  it("a token acts with its own role, never its creator's higher one", async () => {
    const readOnly = await tokenFor(EMAIL.owner, "viewer");
    const out = await api("POST", "/api/v1/runs", { token: readOnly, body: run() });
    expect(out.status).toBe(403);
    expect((out.body as { error: string }).error).toBe(`This needs the builder role; this token acts as a viewer in ${DEMO_TEAM}.`);
  });

  it("a token falls to the person's role when their role in the team is lowered", async () => {
    const t = await tokenFor(EMAIL.builder, "builder");
    expect((await api("POST", "/api/v1/runs", { token: t, body: run() })).status).toBe(201);
    const uid = (await ownerDb()("users").where({ email: EMAIL.builder }).first("id")).id;
    await ownerDb()("memberships").where({ user_id: uid, team_id: demoTeam }).update({ role: "viewer" });
    try {
      expect((await api("POST", "/api/v1/runs", { token: t, body: run() })).status).toBe(403);
    } finally {
      await ownerDb()("memberships").where({ user_id: uid, team_id: demoTeam }).update({ role: "builder" });
    }
  });
});

describe("what the reads say", () => {
  it("an engine in SI, the plan with its input and the estimate the plan editor shows", async () => {
    const engine = await api("GET", `/api/v1/engines/${engineId}`, { token: token.viewer });
    const e = engine.body as { id: number; cylinders: number; boreMm: number; teamId?: number };
    const row = await ownerDb()("engines").where({ id: engineId }).first();
    expect(e).toMatchObject({ id: engineId, cylinders: 4, boreMm: row.bore_mm });
    expect(e.teamId).toBeUndefined();
    const plan = await api("GET", `/api/v1/engines/${engineId}/plans/${planId}`, { token: token.viewer });
    const p = plan.body as {
      plan: { torqueNm: number };
      input: unknown;
      estimate: { torqueNm: number; sweep: unknown[] };
      problems: string[];
    };
    expect(p.problems).toEqual([]);
    expect(p.input).toEqual(
      JSON.parse(
        JSON.stringify(
          (await import("~/lib/clamp")).parsePlan(planInput as never).ok
            ? ((await import("~/lib/clamp")).parsePlan(planInput as never) as { plan: unknown }).plan
            : null,
        ),
      ),
    );
    expect(p.estimate.torqueNm).toBeCloseTo(p.plan.torqueNm, 9);
    const direct = await api("POST", "/api/v1/estimate", { token: token.viewer, body: { input: p.input } });
    expect((direct.body as { estimate: { weakestMargin: number } }).estimate.weakestMargin).toBeCloseTo(
      (p.estimate as unknown as { estimate: { weakestMargin: number } }).estimate.weakestMargin,
      12,
    );
  });

  it("a sweep gives one point per step from fromNm to toNm", async () => {
    const out = await api("POST", "/api/v1/sweep", { token: token.viewer, body: { input: planInput, fromNm: 40, toNm: 160, points: 5 } });
    const points = (out.body as { points: { torqueNm: number; preloadN: number }[] }).points;
    expect(points.map((p) => p.torqueNm)).toEqual([40, 70, 100, 130, 160]);
    // preload grows in proportion to torque (ISO 16047: T = F·k), so 160 N·m gives 4 × the preload of 40
    expect(points[4]!.preloadN / points[0]!.preloadN).toBeCloseTo(4, 9);
  });

  it("reads carry an ETag and Cache-Control; the same ETag back is a bodiless 304", async () => {
    const first = await api("GET", `/api/v1/engines/${engineId}`, { token: token.viewer });
    const etag = first.headers.get("ETag")!;
    expect(etag).toMatch(/^"[\w-]{27}"$/);
    expect(first.headers.get("Cache-Control")).toBe("private, no-cache");
    const again = await api("GET", `/api/v1/engines/${engineId}`, { token: token.viewer, headers: { "If-None-Match": etag } });
    expect(again.status).toBe(304);
    expect(again.body).toBe("");
    await ownerDb()("engines").where({ id: engineId }).update({ notes: "changed by the ETag test" });
    const changed = await api("GET", `/api/v1/engines/${engineId}`, { token: token.viewer, headers: { "If-None-Match": etag } });
    expect(changed.status).toBe(200);
    expect(changed.headers.get("ETag")).not.toBe(etag);
  });

  it("engines page by page/limit with a stated maximum", async () => {
    const total = Number((await ownerDb()("engines").where({ team_id: demoTeam }).whereNull("archived_at").count({ n: "*" }).first())!.n);
    const one = await api("GET", "/api/v1/engines?limit=1", { token: token.builder });
    expect(one.body).toMatchObject({ page: 1, limit: 1, total, nextPage: total > 1 ? 2 : null });
    const last = await api("GET", `/api/v1/engines?limit=1&page=${total}`, { token: token.builder });
    expect((last.body as { items: unknown[]; nextPage: null }).nextPage).toBeNull();
    const tooMany = await api("GET", "/api/v1/engines?limit=101", { token: token.viewer });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body).toEqual({ error: "The query has problems.", errors: [{ path: "limit", message: "limit is at most 100" }] });
    expect((await api("GET", "/api/v1/engines?colour=red", { token: token.viewer })).status).toBe(400);
    expect((await api("GET", "/api/v1/engines?page=1&page=2", { token: token.viewer })).status).toBe(400);
  });

  it("runs page by cursor, newest first, and filter by outcome and date", async () => {
    await ownerDb()("runs").where({ team_id: demoTeam }).delete();
    for (const [ranOn, outcome] of [
      ["2026-10-01", "held"],
      ["2026-10-02", "seeping"],
      ["2026-10-03", "held"],
    ]) {
      expect((await api("POST", "/api/v1/runs", { token: token.builder, body: { ...run(), ranOn, outcome } })).status).toBe(201);
    }
    const first = await api("GET", "/api/v1/runs?limit=2", { token: token.viewer });
    const page1 = first.body as { items: { ranOn: string }[]; nextCursor: string };
    expect(page1.items.map((r) => r.ranOn)).toEqual(["2026-10-03", "2026-10-02"]);
    const second = await api("GET", `/api/v1/runs?limit=2&cursor=${page1.nextCursor}`, { token: token.viewer });
    expect(second.body).toMatchObject({ items: [{ ranOn: "2026-10-01" }], nextCursor: null });
    const held = await api("GET", "/api/v1/runs?outcome=held&from=2026-10-02", { token: token.viewer });
    expect((held.body as { items: { ranOn: string }[] }).items.map((r) => r.ranOn)).toEqual(["2026-10-03"]);
    expect((await api("GET", "/api/v1/runs?from=yesterday", { token: token.viewer })).status).toBe(400);
  });

  it("a logged run is stored as sent, with its audit row", async () => {
    const before = await rowCounts();
    const out = await api("POST", "/api/v1/runs", {
      token: token.builder,
      body: { ...run(), outcome: "lifted-head", cylindersAffected: [3, 4], peakCylinderPressureMpa: 14.5, peakPressureSource: "measured" },
    });
    expect(out.status).toBe(201);
    expect(out.body).toMatchObject({
      engineId,
      outcome: "lifted-head",
      cylindersAffected: [3, 4],
      peakCylinderPressureMpa: 14.5,
      peakPressureSource: "measured",
      manifoldPressureKpa: 260,
    });
    const after = await rowCounts();
    expect(after.runs).toBe(before.runs! + 1);
    expect(after.audit_events).toBe(before.audit_events! + 1);
  });
});

describe("the run's cylinders belong to its engine", () => {
  it("a cylinder above the engine's count is a 400 that writes nothing", async () => {
    const before = await rowCounts();
    const out = await api("POST", "/api/v1/runs", { token: token.builder, body: { ...run(), cylindersAffected: [5] } });
    expect(out.status).toBe(400);
    expect((out.body as { errors: unknown[] }).errors).toEqual([
      { path: "cylindersAffected", message: "the engine has 4 cylinders; there is no cylinder 5" },
    ]);
    expect(await rowCounts()).toEqual(before);
  });
});
