import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { defaultStudPattern } from "~/lib/clamp/pattern";
import { studToRow } from "~/lib/engine";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import * as estimateApi from "~/routes/api/estimate";
import * as engineEdit from "~/routes/engines/edit";
import * as engineNew from "~/routes/engines/new";
import { call, ORIGIN, post, signIn, type Handler, teamWide } from "./helpers";
import { ownerDb } from "../setup/db-roles";

// Defect 1 of issue 9 through the routes: huge counts posted to the engine form and the estimate API
// are refused with 400 in bounded time, and nothing is written.

let builder = "";
let engineId = 0;
let teamId = 0;
let iron = 0;
let alu = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  engineId = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 4 }).first("id")).id;
  iron = (await ownerDb()("materials").where({ team_id: teamId, kind: "iron" }).first("id")).id;
  alu = (await ownerDb()("materials").where({ team_id: teamId, kind: "aluminium" }).first("id")).id;
});

const hugeText = fc.oneof(
  fc.constantFrom("1000000000", "100000000", "1e9", "1e308", "9007199254740993"),
  fc.integer({ min: 17, max: 2_000_000_000 }).map(String),
);

function engineForm(cylinders: string, serve: string): Record<string, string> {
  const fields: Record<string, string> = {
    intent: "save",
    name: "Huge",
    customer: "",
    status: "quoted",
    cylinders,
    layout: "inline",
    boreMm: "86",
    strokeMm: "86",
    headThicknessAtStudMm: "100",
    blockDepthToThreadMm: "15",
    blockMaterialId: String(iron),
    headMaterialId: String(alu),
    sleeveKind: "none",
    sleeveProtrusionMm: "0",
    fuel: "",
    targetManifoldKpa: "350",
    peakPressureSource: "estimated",
    pressureRiseFactor: "3",
    runningHeadC: "110",
    runningBlockC: "95",
    pistonVolumeCc: "0",
    deckClearanceMm: "0",
    notes: "",
  };
  defaultStudPattern("inline", 4).forEach((s, i) => {
    const row = studToRow(s);
    fields[`studs[${i}].label`] = row.label;
    fields[`studs[${i}].cylinders`] = i === 0 ? serve : row.cylinders;
    fields[`studs[${i}].shares`] = i === 0 ? "1" : row.shares;
  });
  return fields;
}

const counts = async () => {
  const [e, a] = await Promise.all([ownerDb()("engines").count({ n: "*" }), ownerDb()("audit_events").count({ n: "*" })]);
  return [Number(e[0]!.n), Number(a[0]!.n)];
};

describe("huge counts through the routes", () => {
  it("the engine form (new and edit) answers 400 within a second and writes nothing", async () => {
    const before = await counts();
    await fc.assert(
      fc.asyncProperty(hugeText, hugeText, fc.boolean(), async (cylinders, serve, editing) => {
        const t0 = performance.now();
        const out = editing
          ? await call(engineEdit.action as Handler, post(`/engines/${engineId}/edit`, engineForm(cylinders, serve), builder), {
              engineId: String(engineId),
            })
          : await call(engineNew.action as Handler, post("/engines/new", engineForm(cylinders, serve), builder));
        expect(performance.now() - t0).toBeLessThan(1000);
        expect(out.status).toBe(400);
        // zod calls a number past 2⁵³ not whole; either way the count's own messages, not one per cylinder
        const messages = (out.body as { result: { error: Record<string, string[]> } }).result.error.cylinders!;
        expect(messages[0]).toMatch(/^(At most 16 cylinders|Cylinder count is a whole number)$/);
        expect(messages.length).toBeLessThanOrEqual(2);
      }),
      { numRuns: 60 },
    );
    expect(await counts()).toEqual(before);
  });

  it("the estimate API answers 400 with the count's own message", async () => {
    const engine = (await getEngine(teamWide(teamId), engineId))!;
    const plan = (await listPlans(teamId, engineId))[0]!;
    const input = assemblePlanInput((await planParts(teamId, engine, plan))!);
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(fc.constantFrom(1e9, 1e8, 2 ** 31, Number.MAX_SAFE_INTEGER), fc.integer({ min: 17, max: 2_000_000_000 })),
        fc.constantFrom("inline", "V"),
        async (cylinders, layout) => {
          const body = JSON.stringify({ input: { ...input, engine: { ...input.engine, cylinders, layout } } });
          const request = new Request(`${ORIGIN}/api/v1/estimate`, {
            method: "POST",
            headers: { "Content-Type": "application/json", Origin: ORIGIN, Cookie: builder },
            body,
          });
          const t0 = performance.now();
          const out = await call(estimateApi.action as Handler, request);
          expect(performance.now() - t0).toBeLessThan(1000);
          expect(out.status).toBe(400);
          expect((out.body as { errors: { path: string; message: string }[] }).errors).toEqual([
            { path: "input.engine.cylinders", message: "At most 16 cylinders" },
          ]);
        },
      ),
      { numRuns: 60 },
    );
  });
});
