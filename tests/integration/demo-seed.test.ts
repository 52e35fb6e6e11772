import { describe, expect, it } from "vitest";
import { compressionRatio } from "~/lib/chamber/compression";
import { evaluatePlan, PlanInputSchema, type PlanInputRaw } from "~/lib/clamp";
import { db } from "~/utils/db.server";

// Every seeded demo plan must be a plan the clamp model accepts and evaluates to finite numbers.
// app/lib/plan/assemble.ts (the lead's DB → PlanInput mapping) did not exist when this was written, so the
// mapping below is this test's own reading of the columns; swap it for assemble() once that lands.

type Row = Record<string, any>;

async function rows() {
  const team = await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
  const byId = async (table: string) => new Map((await db()(table).where({ team_id: team.id })).map((r: Row) => [r.id, r]));
  return {
    teamId: team.id as number,
    engines: (await db()("engines").where({ team_id: team.id })) as Row[],
    plans: (await db()("seal_plans").where({ team_id: team.id })) as Row[],
    materials: await byId("materials"),
    fasteners: await byId("fasteners"),
    gaskets: await byId("gaskets"),
  };
}

function toPlanInput(e: Row, p: Row, lib: Awaited<ReturnType<typeof rows>>): PlanInputRaw {
  const f = lib.fasteners.get(p.fastener_id)!;
  const g = lib.gaskets.get(p.gasket_id)!;
  const stud = lib.materials.get(f.material_id)!;
  const head = lib.materials.get(e.head_material_id)!;
  const block = lib.materials.get(e.block_material_id)!;
  const sleeveMat = e.sleeve_material_id ? lib.materials.get(e.sleeve_material_id)! : null;
  const cr = compressionRatio({
    boreMm: e.bore_mm,
    strokeMm: e.stroke_mm,
    chamberCc: e.chamber_cc,
    gasketBoreMm: g.bore_mm,
    gasketThicknessMm: g.compressed_thickness_mm,
    deckClearanceMm: e.deck_clearance_mm,
    pistonVolumeCc: e.piston_volume_cc,
  }).compressionRatio;
  const sleeve =
    e.sleeve_kind === "none"
      ? { kind: "none" as const }
      : e.sleeve_kind === "dry"
        ? { kind: "dry" as const, modulusMpa: sleeveMat!.modulus_mpa, wallMm: e.sleeve_wall_mm, yieldMpa: sleeveMat!.yield_mpa ?? undefined }
        : {
            kind: e.sleeve_kind,
            modulusMpa: sleeveMat!.modulus_mpa,
            wallMm: e.sleeve_wall_mm,
            supportLengthMm: e.sleeve_support_length_mm,
            yieldMpa: sleeveMat!.yield_mpa ?? undefined,
          };
  return {
    engine: { cylinders: e.cylinders, layout: e.layout, boreMm: e.bore_mm },
    studs: JSON.parse(e.studs),
    fastener: {
      diameterMm: f.diameter_mm,
      pitchMm: f.pitch_mm,
      reducedShankDiameterMm: f.reduced_shank_diameter_mm ?? undefined,
      reducedShankLengthMm: f.reduced_shank_length_mm,
      freeThreadLengthMm: f.free_thread_length_mm,
      engagementMm: f.engagement_mm,
      modulusMpa: stud.modulus_mpa,
      yieldMpa: stud.yield_mpa,
      expansionUmPerMC: stud.expansion_um_per_m_c,
      washerOdMm: f.washer_od_mm,
      washerHoleMm: f.washer_hole_mm,
      washerThicknessMm: f.washer_thickness_mm,
    },
    tightening: {
      target: { mode: "torque", torqueNm: p.torque_nm },
      threadFriction: p.thread_friction,
      bearingFriction: p.bearing_friction,
      method: p.method,
    },
    head: {
      thicknessAtStudMm: e.head_thickness_at_stud_mm,
      modulusMpa: head.modulus_mpa,
      expansionUmPerMC: head.expansion_um_per_m_c,
      limitingSurfacePressureMpa: head.limiting_surface_pressure_mpa,
      yieldMpa: head.yield_mpa ?? undefined,
    },
    gasket: {
      type: g.type,
      compressedThicknessMm: g.compressed_thickness_mm,
      sealDiameterMm: g.seal_diameter_mm,
      ringWidthMm: g.ring_width_mm,
      ringModulusMpa: g.ring_modulus_mpa,
      sealLineYieldMpa: g.seal_line_yield_mpa,
      bodyModulusMpa: g.body_modulus_mpa,
      bodyAreaPerBoreMm2: g.body_area_per_bore_mm2,
      expansionUmPerMC: g.expansion_um_per_m_c,
      m: g.m,
      yMpa: g.y_mpa,
      relaxationPercent: g.relaxation_percent,
    },
    block: {
      modulusMpa: block.modulus_mpa,
      expansionUmPerMC: block.expansion_um_per_m_c,
      clampedDepthMm: e.block_depth_to_thread_mm,
      yieldMpa: block.yield_mpa ?? undefined,
    },
    sleeve,
    sealing: {
      sleeveProtrusionMm: p.sleeve_protrusion_mm ?? e.sleeve_protrusion_mm,
      wireProjectionMm: p.wire_projection_mm,
      receiverGrooveDepthMm: p.receiver_groove_depth_mm,
    },
    firing:
      e.peak_pressure_mpa != null
        ? { mode: "entered", peakPressureMpa: e.peak_pressure_mpa }
        : { mode: "estimated", manifoldAbsKpa: e.target_manifold_kpa, compressionRatio: cr, pressureRiseFactor: e.pressure_rise_factor },
    temperatures: { assemblyC: 20, headC: e.running_head_c, blockC: e.running_block_c, studC: (e.running_head_c + e.running_block_c) / 2 },
  } as PlanInputRaw;
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
      const parsed = PlanInputSchema.safeParse(toPlanInput(engines.get(p.engine_id)!, p, lib));
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
