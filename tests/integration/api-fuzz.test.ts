import fc from "fast-check";
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import { EstimateRequestSchema, RunCreateSchema, SweepRequestSchema } from "~/lib/api/schemas";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import { resetThrottles } from "~/utils/rate-limit.server";
import { api, DEMO_TEAM, rowCounts, teamId, tokenFor } from "./api-helpers";
import { EMAIL, teamWide } from "./helpers";
import type { z } from "zod";
import { ownerDb } from "../setup/db-roles";

// Property: for 1,000 generated bodies per write endpoint of /api/v1 (API_FUZZ_RUNS to change it), sent
// with a builder's token behind the root middleware — no answer is a 5xx; a body the endpoint's own zod
// schema refuses gets 400 and leaves every table as it was; one it accepts is answered 200/201 (or 404,
// writing nothing, for a run on an engine that is not the team's; 400 for a cylinder it lacks).

const RUNS = Number(process.env.API_FUZZ_RUNS ?? 1000);
let token = "";
let engineId = 0;
let planInput: Record<string, unknown> = {};

beforeAll(async () => {
  token = await tokenFor(EMAIL.builder);
  const demo = await teamId(DEMO_TEAM);
  engineId = (await ownerDb()("engines").where({ team_id: demo, cylinders: 4 }).first("id")).id;
  const engine = (await getEngine(teamWide(demo), engineId))!;
  planInput = assemblePlanInput((await planParts(demo, engine, (await listPlans(demo, engineId))[0]!))!) as unknown as Record<
    string,
    unknown
  >;
}, 60_000);
beforeEach(() => resetThrottles());

const junk = fc.oneof(
  fc.jsonValue({ maxDepth: 2 }),
  fc.constantFrom(
    1e9,
    -1,
    0,
    1e308,
    -1e308,
    2 ** 53,
    null,
    "",
    [],
    {},
    "2026-02-30",
    "2026-12-01",
    "held",
    "dyno",
    "measured",
    [1, 1],
    [0],
    [17],
  ),
  fc.double({ noNaN: true }),
  fc.integer(),
  fc.string({ maxLength: 80 }),
);

function leaves(v: unknown, path: string[] = [], out: string[][] = []): string[][] {
  if (v && typeof v === "object") for (const [k, c] of Object.entries(v)) leaves(c, [...path, k], out);
  out.push(path);
  return out;
}

/** The valid body with some leaves replaced, removed or added, or arbitrary JSON. */
function bodies(valid: Record<string, unknown>) {
  const paths = leaves(valid).filter((p) => p.length > 0);
  const edit = fc.tuple(fc.constantFrom(...paths), fc.oneof(junk, fc.constant(undefined)));
  return fc.oneof(
    {
      weight: 6,
      arbitrary: fc.array(edit, { minLength: 0, maxLength: 3 }).map((edits) => {
        const copy = structuredClone(valid);
        for (const [path, value] of edits) {
          let at = copy as Record<string, unknown>;
          for (const k of path.slice(0, -1)) {
            if (!at[k] || typeof at[k] !== "object") break;
            at = at[k] as Record<string, unknown>;
          }
          if (value === undefined) delete at[path.at(-1)!];
          else at[path.at(-1)!] = value;
        }
        return JSON.stringify(copy);
      }),
    },
    {
      weight: 1,
      arbitrary: fc.tuple(fc.string({ minLength: 1, maxLength: 12 }), junk).map(([k, v]) => JSON.stringify({ ...valid, [k]: v })),
    },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 4 }).map((v) => JSON.stringify(v)) },
    { weight: 1, arbitrary: fc.string({ maxLength: 60 }) },
  );
}

const ENDPOINTS: [string, () => Record<string, unknown>, z.ZodType][] = [
  ["/api/v1/estimate", () => ({ input: planInput, units: "metric" }), EstimateRequestSchema],
  ["/api/v1/sweep", () => ({ input: planInput, fromNm: 40, toNm: 160, points: 5 }), SweepRequestSchema],
  [
    "/api/v1/runs",
    () => ({
      engineId,
      ranOn: "2026-11-30",
      kind: "dyno",
      manifoldPressureKpa: 250,
      fuel: "E85",
      peakCylinderPressureMpa: 13,
      peakPressureSource: "estimated",
      outcome: "held",
      cylindersAffected: [],
      notes: "",
    }),
    RunCreateSchema,
  ],
];

describe(`property: ${RUNS} generated bodies per write endpoint`, () => {
  for (const [path, valid, schema] of ENDPOINTS) {
    it(`${path}: no 5xx; a body its schema refuses is a 400 that writes nothing`, async () => {
      const statuses = new Map<number, number>();
      let n = 0;
      await fc.assert(
        fc.asyncProperty(bodies(valid()), async (raw) => {
          resetThrottles();
          const before = await rowCounts();
          const out = await api("POST", path, { token, raw, address: `fuzz-${n++}` });
          statuses.set(out.status, (statuses.get(out.status) ?? 0) + 1);
          expect(out.status, JSON.stringify(out.body)).toBeLessThan(500);
          let parsed: unknown;
          try {
            parsed = JSON.parse(raw);
          } catch {
            parsed = undefined;
          }
          const accepted =
            parsed !== undefined &&
            parsed !== null &&
            typeof parsed === "object" &&
            !Array.isArray(parsed) &&
            schema.safeParse(parsed).success;
          if (!accepted) {
            expect(out.status).toBe(400);
            expect(await rowCounts()).toEqual(before);
          } else {
            // a well-formed run on an engine that is not this team's (or none) is a 404, and one naming a
            // cylinder the (four-cylinder) engine lacks a 400: both write nothing
            const r = parsed as { engineId: number; cylindersAffected?: number[] };
            const isRun = path === "/api/v1/runs";
            const foreign = isRun && r.engineId !== engineId;
            const beyond = isRun && (r.cylindersAffected ?? []).some((c) => c > 4);
            expect(out.status, JSON.stringify(out.body)).toBe(foreign ? 404 : beyond ? 400 : isRun ? 201 : 200);
            if (foreign || beyond) expect(await rowCounts()).toEqual(before);
          }
        }),
        { numRuns: RUNS },
      );
      expect([...statuses.values()].reduce((a, b) => a + b, 0)).toBe(RUNS);
      // the generator reaches both sides: some bodies pass, most do not
      expect(statuses.get(400) ?? 0).toBeGreaterThan(RUNS / 4);
      expect([...statuses.keys()].some((s) => s < 300)).toBe(true);
      console.info(`${path}: ${JSON.stringify(Object.fromEntries(statuses))}`);
    }, 300_000);
  }
});
