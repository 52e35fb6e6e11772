import { describe, expect, it } from "vitest";
import { evaluatePlan, PlanInputSchema } from "~/lib/clamp";
import { assemblePlanInput, type EngineRecord, type GasketRecord, type MaterialRecord, type PlanParts } from "~/lib/plan/assemble";
import { toEngine } from "~/models/engine.server";
import { getFastener, getGasket, getMaterial } from "~/models/library.server";
import { db } from "~/utils/db.server";

// Every seeded demo plan must be a plan the clamp model accepts and evaluates to finite numbers,
// assembled from the stored rows the way the app does it (app/lib/plan/assemble.ts).

type Row = Record<string, any>;

async function rows() {
  const team = await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
  return {
    teamId: team.id as number,
    engines: (await db()("engines").where({ team_id: team.id })) as Row[],
    plans: (await db()("seal_plans").where({ team_id: team.id })) as Row[],
  };
}

async function partsFor(teamId: number, e: Row, p: Row): Promise<PlanParts> {
  const engine = toEngine(e);
  const material = async (id: number | null) => (id ? ((await getMaterial(teamId, id)) as MaterialRecord) : null);
  const fastener = (await getFastener(teamId, p.fastener_id))!;
  const gasket = (await getGasket(teamId, p.gasket_id))!;
  return {
    engine: engine as unknown as EngineRecord,
    plan: {
      torqueNm: p.torque_nm,
      threadFriction: p.thread_friction,
      bearingFriction: p.bearing_friction,
      method: p.method,
      wireLocation: p.wire_location,
      wireProjectionMm: p.wire_projection_mm,
      receiverGrooveDepthMm: p.receiver_groove_depth_mm,
      sleeveProtrusionMm: p.sleeve_protrusion_mm,
    },
    fastener: { ...fastener, material: (await material(fastener.materialId))! },
    gasket: gasket as GasketRecord,
    head: (await material(engine.headMaterialId))!,
    block: (await material(engine.blockMaterialId))!,
    sleeve: await material(engine.sleeveMaterialId),
  };
}

function finiteEverywhere(value: unknown, path = "estimate"): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => finiteEverywhere(v, `${path}[${i}]`));
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => finiteEverywhere(v, `${path}.${k}`));
  return [];
}

describe("the demo seed", () => {
  it("gives the demo shop three engines with two or three plans each, one chosen per engine", async () => {
    const { engines, plans } = await rows();
    expect(engines.map((e) => [e.cylinders, e.layout, e.status]).sort()).toEqual([
      [4, "inline", "in-build"],
      [6, "inline", "running"],
      [8, "V", "quoted"],
    ]);
    for (const e of engines) {
      const own = plans.filter((p) => p.engine_id === e.id);
      expect(own.length).toBeGreaterThanOrEqual(2);
      expect(own.length).toBeLessThanOrEqual(3);
      expect(own.map((p) => p.id)).toContain(e.chosen_plan_id);
    }
  });

  it("keeps every plan's stages ending at its torque", async () => {
    const { plans } = await rows();
    for (const p of plans) {
      const stages = JSON.parse(p.stages) as number[];
      expect(stages.length).toBeGreaterThan(0);
      expect(stages.at(-1)).toBe(p.torque_nm);
      for (let i = 1; i < stages.length; i++) expect(stages[i]!).toBeGreaterThan(stages[i - 1]!);
    }
  });

  it("every seeded plan parses as a PlanInput and evaluates to finite numbers", async () => {
    const lib = await rows();
    const engines = new Map(lib.engines.map((e) => [e.id, e]));
    expect(lib.plans).toHaveLength(7);
    for (const p of lib.plans) {
      const parsed = PlanInputSchema.safeParse(assemblePlanInput(await partsFor(lib.teamId, engines.get(p.engine_id)!, p)));
      expect(parsed.success ? [] : parsed.error.issues.map((i) => `${p.name}: ${i.path.join(".")} ${i.message}`)).toEqual([]);
      if (!parsed.success) continue;
      const estimate = evaluatePlan(parsed.data);
      expect(finiteEverywhere(estimate), p.name).toEqual([]);
      expect(estimate.warnings.filter((w) => /NaN|Infinity/.test(w)), p.name).toEqual([]);
      expect(estimate.weakestMargin, p.name).toBeGreaterThan(0);
    }
  });

  it("every library source fits its column (300 characters) and every seeded row has one", async () => {
    for (const table of ["materials", "fasteners", "gaskets"]) {
      for (const r of await db()(table).whereNull("entered_by")) {
        expect(r.source, `${table}: ${r.name}`).toBeTruthy();
        expect(r.source.length, `${table}: ${r.name}`).toBeLessThanOrEqual(300);
      }
    }
  });

  it("the other team has the handbook library but no demo engines", async () => {
    const other = await db()("teams").where({ name: "Saltmarsh Dyno Cell" }).first("id");
    expect((await db()("materials").where({ team_id: other.id })).length).toBe(10);
    expect((await db()("engines").where({ team_id: other.id })).length).toBe(0);
  });
});
