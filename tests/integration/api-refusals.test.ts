import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import * as tokens from "~/routes/shop/tokens";
import { resetThrottles } from "~/utils/rate-limit.server";
import { api, DEMO_TEAM, otherTeamEngine, rowCounts, teamId, tokenFor } from "./api-helpers";
import { call, EMAIL, get, post, signIn, type Handler, teamWide } from "./helpers";
import { answerError } from "./conform-answer";
import { ownerDb } from "../setup/db-roles";

// Refusals of the API: each bad request gets its documented status and error body and writes nothing;
// a revoked token is refused from the next request; cookie writes need our Origin; throttles answer 429.
// Loops of hundreds of requests on a shared two-core machine: generous limits (speed lives in npm run bench).
vi.setConfig({ testTimeout: 60_000 });

let builderToken = "";
let builderCookie = "";
let engineId = 0;
let planInput: Record<string, unknown> = {};

beforeAll(async () => {
  builderToken = await tokenFor(EMAIL.builder);
  builderCookie = await signIn(EMAIL.builder);
  const demo = await teamId(DEMO_TEAM);
  engineId = (await ownerDb()("engines").where({ team_id: demo, cylinders: 4 }).first("id")).id;
  const engine = (await getEngine(teamWide(demo), engineId))!;
  planInput = assemblePlanInput((await planParts(demo, engine, (await listPlans(demo, engineId))[0]!))!) as unknown as Record<
    string,
    unknown
  >;
}, 60_000);
beforeEach(() => resetThrottles());

const validRun = () => ({ engineId, ranOn: "2026-11-30", kind: "dyno", outcome: "held" });
const WRITES: [string, () => Record<string, unknown>][] = [
  ["/api/v1/estimate", () => ({ input: planInput })],
  ["/api/v1/sweep", () => ({ input: planInput, fromNm: 60, toNm: 140 })],
  ["/api/v1/runs", validRun],
];

type ErrorBody = { error: string; errors?: { path: string; message: string }[] };

describe("bad bodies: the documented status, the one error body, nothing written", () => {
  for (const [path, valid] of WRITES) {
    it(path, async () => {
      const before = await rowCounts();
      const cases: [string, Parameters<typeof api>[2], number, (b: ErrorBody) => void][] = [
        ["bad JSON", { raw: '{"input": ' }, 400, (b) => expect(b.error).toBe("The body is not valid JSON.")],
        ["an array", { raw: "[1,2]" }, 400, (b) => expect(b.error).toBe("Send a JSON object.")],
        [
          "wrong content type",
          { raw: JSON.stringify(valid()), type: "text/plain" },
          415,
          (b) => expect(b.error).toMatch(/application\/json/),
        ],
        [
          "oversized",
          { body: { ...valid(), notes: "x".repeat(70 * 1024) } },
          413,
          (b) => expect(b.error).toBe("The body is larger than 64 KiB."),
        ],
        [
          "an unknown field",
          { body: { ...valid(), colour: "red" } },
          400,
          (b) => expect(b.errors).toContainEqual({ path: "colour", message: 'Unrecognized key: "colour"' }),
        ],
      ];
      for (const [field] of Object.entries(valid())) {
        const { [field]: _gone, ...rest } = valid();
        cases.push([`missing ${field}`, { body: rest }, 400, (b) => expect(b.errors?.map((e) => e.path)).toContain(field)]);
        cases.push([
          `${field} of a wrong type`,
          { body: { ...valid(), [field]: [true] } },
          400,
          (b) => expect(b.errors?.some((e) => e.path === field || e.path.startsWith(`${field}.`))).toBe(true),
        ]);
      }
      for (const [what, o, status, check] of cases) {
        const out = await api("POST", path, { token: builderToken, ...o });
        expect(out.status, what).toBe(status);
        const body = out.body as ErrorBody;
        expect(
          Object.keys(body).every((k) => k === "error" || k === "errors"),
          what,
        ).toBe(true);
        check(body);
      }
      expect(await rowCounts()).toEqual(before);
    });
  }

  it("sweep ranges out of bounds are field errors", async () => {
    const out = await api("POST", "/api/v1/sweep", {
      token: builderToken,
      body: { input: planInput, fromNm: 200, toNm: 100, points: 500 },
    });
    expect(out.status).toBe(400);
    expect((out.body as ErrorBody).errors).toEqual([
      { path: "points", message: "points is at most 201" },
      { path: "toNm", message: "toNm must be above fromNm" },
    ]);
    const reversed = await api("POST", "/api/v1/sweep", { token: builderToken, body: { input: planInput, fromNm: 200, toNm: 100 } });
    expect((reversed.body as ErrorBody).errors).toEqual([{ path: "toNm", message: "toNm must be above fromNm" }]);
  });

  it("a run on another shop's engine is not found, and nothing is written", async () => {
    const otherEngine = await otherTeamEngine();
    const before = await rowCounts();
    const out = await api("POST", "/api/v1/runs", { token: builderToken, body: { ...validRun(), engineId: otherEngine } });
    expect(out.status).toBe(404);
    expect(await rowCounts()).toEqual(before);
  });

  it("wrong methods are 405 with Allow", async () => {
    const out = await api("GET", "/api/v1/sweep", { token: builderToken });
    expect(out.status).toBe(405);
    expect(out.headers.get("Allow")).toBe("POST");
  });
});

describe("tokens", () => {
  it("a revoked token is refused on the very next request", async () => {
    const cookie = await signIn(EMAIL.owner);
    const made = await call(
      tokens.action as Handler,
      post("/settings/tokens", { intent: "create", name: "dyno laptop", role: "builder" }, cookie),
    );
    const text = (made.body as { token: { text: string } }).token.text;
    expect(text).toMatch(/^swt_[\w-]{43}$/);
    expect((await api("GET", "/api/v1/engines", { token: text })).status).toBe(200);
    const row = await ownerDb()("api_tokens").orderBy("id", "desc").first();
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(text.slice(4));
    expect(row.last_used_at).not.toBeNull();
    const revoked = await call(tokens.action as Handler, post("/settings/tokens", { intent: "revoke", tokenId: String(row.id) }, cookie));
    expect(revoked.status).toBe(302);
    const after = await api("GET", "/api/v1/engines", { token: text });
    expect(after.status).toBe(401);
    expect(after.body).toEqual({ error: "This token is unknown or has been revoked." });
  });

  it("is shown once: the list afterwards names it by its first characters only", async () => {
    const cookie = await signIn(EMAIL.builder);
    const made = await call(
      tokens.action as Handler,
      post("/settings/tokens", { intent: "create", name: "spreadsheet", role: "viewer" }, cookie),
    );
    const text = (made.body as { token: { text: string } }).token.text;
    const page = await call(tokens.loader as Handler, get("/settings/tokens", cookie));
    expect(JSON.stringify(page.body)).not.toContain(text);
    expect((page.body as { tokens: { name: string; prefix: string }[] }).tokens).toContainEqual(
      expect.objectContaining({ name: "spreadsheet", prefix: text.slice(0, 10) }),
    );
  });

  it("cannot be made above the creator's role, nor revoked by someone else", async () => {
    const viewer = await signIn(EMAIL.viewer);
    const before = await rowCounts();
    const up = await call(tokens.action as Handler, post("/settings/tokens", { intent: "create", name: "sneaky", role: "owner" }, viewer));
    expect(up.status).toBe(400);
    expect(answerError(up.body, "role")).toBe("You are a viewer here; a token cannot do more.");
    expect(await rowCounts()).toEqual(before);
    const owners = await ownerDb()("api_tokens").whereNull("revoked_at").first("id");
    const other = await signIn(EMAIL.otherTeam);
    const out = await call(tokens.action as Handler, post("/settings/tokens", { intent: "revoke", tokenId: String(owners.id) }, other));
    expect(out.status).toBe(404);
    expect((await ownerDb()("api_tokens").where({ id: owners.id }).first()).revoked_at).toBeNull();
  });

  it("a malformed Authorization header is 401, not a cookie fallback", async () => {
    const out = await api("GET", "/api/v1/engines", { cookie: builderCookie, headers: { Authorization: "Basic abc" } });
    expect(out.status).toBe(401);
  });
});

describe("Origin: cookie writes must come from our pages, token writes need not", () => {
  it("a cookie write without Origin or from another site is 403 and writes nothing", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const before = await rowCounts();
    expect((await api("POST", "/api/v1/runs", { cookie: builderCookie, origin: null, body: validRun() })).status).toBe(403);
    expect((await api("POST", "/api/v1/runs", { cookie: builderCookie, origin: "http://evil.example", body: validRun() })).status).toBe(
      403,
    );
    expect(await rowCounts()).toEqual(before);
    warn.mockRestore();
    expect((await api("POST", "/api/v1/runs", { cookie: builderCookie, body: validRun() })).status).toBe(201);
  });

  it("a token write with no Origin at all is served", async () => {
    expect((await api("POST", "/api/v1/runs", { token: builderToken, origin: null, body: validRun() })).status).toBe(201);
  });
});

describe("rate limits", () => {
  it("one token: 240 a minute, then 429 with Retry-After", async () => {
    const t = await tokenFor(EMAIL.viewer);
    const statuses: number[] = [];
    for (let i = 0; i < 241; i++)
      statuses.push((await api("GET", "/api/v1/openapi.json", { token: t, address: `10.1.${i >> 8}.${i & 255}` })).status);
    // the document is public and never throttled: count with a read that authenticates
    resetThrottles();
    statuses.length = 0;
    for (let i = 0; i < 241; i++)
      statuses.push((await api("GET", `/api/v1/engines/${engineId}`, { token: t, address: `10.2.${i >> 8}.${i & 255}` })).status);
    expect(statuses.slice(0, 240).every((s) => s === 200)).toBe(true);
    const last = await api("GET", `/api/v1/engines/${engineId}`, { token: t, address: "10.3.0.1" });
    expect(statuses[240]).toBe(429);
    expect(last.status).toBe(429);
    expect(Number(last.headers.get("Retry-After"))).toBe(10);
    expect((last.body as ErrorBody).error).toBe("Too many requests; try again in 10 seconds.");
    // another token of the same person is its own budget
    expect((await api("GET", `/api/v1/engines/${engineId}`, { token: await tokenFor(EMAIL.viewer), address: "10.3.0.2" })).status).toBe(
      200,
    );
  });

  it("one address: 600 a minute, counted before any token is looked up", async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 601; i++)
      statuses.push((await api("GET", "/api/v1/engines", { token: `swt_guess${i}`, address: "203.0.113.50" })).status);
    expect(statuses.slice(0, 600).every((s) => s === 401)).toBe(true);
    expect(statuses[600]).toBe(429);
  });
});
