import type { Knex } from "knex";
import { recordAudit } from "../../app/models/audit.server.ts";

// The demo shop's records (every figure invented): assemblies on the four and the six, and the six's
// run history — it ran on its old 7/16 studs until a dyno day at higher boost blew the gasket between
// cylinders 5 and 6, then was rebuilt on ½ studs and has held since. The stretch readings on the ½
// studs sit a little under what the handbook friction predicts, as a shop's real readings often do, so
// three assemblies teach a friction of about 0.13 (checked by tests/integration/demo-seed.test.ts).
// Runs only while the demo shop has no assemblies; the four's machining sheet, while it has none.
const DEMO_TEAM = "Harrow Lane Boost Works";
const FOUR = "Fenwick-Oddy 2.0 four";
const SIX = "Number 47 crew straight six";
const FOUR_PLAN = "Copper + wire at the maker's 125 lbf·ft";
const OLD_PLAN = "MLS, the old 7/16 studs on engine oil";
const NEW_PLAN = "MLS, ½ studs at the maker's 85 lbf·ft";
const SIX_FUEL = "Pump fuel + methanol injection";

interface AssemblySeed {
  engine: string;
  plan: string;
  on: string;
  by: string;
  /** Reached torque per stage, N·m. */
  reached: number[];
  stretch: [label: string, mm: number][];
  protrusionMm: number | null;
  gasketMm: number | null;
  notes: string;
}

const ASSEMBLIES: AssemblySeed[] = [
  {
    engine: SIX,
    plan: OLD_PLAN,
    on: "2026-04-05",
    by: "Teo Vastrick",
    reached: [47.5, 88.1, 115.2],
    stretch: [],
    protrusionMm: null,
    gasketMm: 1.28,
    notes: "Demo record. Customer's old 7/16 studs reused at their request; no stretch gauge on this build.",
  },
  {
    engine: SIX,
    plan: NEW_PLAN,
    on: "2026-08-09",
    by: "Teo Vastrick",
    reached: [40.7, 81.3, 115.2],
    stretch: [
      ["A3", 0.298],
      ["A4", 0.305],
      ["B3", 0.301],
      ["B4", 0.309],
    ],
    protrusionMm: null,
    gasketMm: 1.27,
    notes: "Demo record. Rebuilt after the blown gasket: deck skimmed 0.05 mm, new ½ studs, stretch read on the four middle studs.",
  },
  {
    engine: SIX,
    plan: NEW_PLAN,
    on: "2026-09-27",
    by: "Mara Quillon",
    reached: [40.7, 81.3, 115.2],
    stretch: [
      ["A2", 0.303],
      ["A5", 0.297],
      ["B2", 0.306],
      ["B5", 0.3],
    ],
    protrusionMm: null,
    gasketMm: 1.27,
    notes: "Demo record. Head off to check the deck after the dyno day; gasket renewed.",
  },
  {
    engine: SIX,
    plan: NEW_PLAN,
    on: "2026-10-18",
    by: "Teo Vastrick",
    reached: [40.7, 81.3, 115.2],
    stretch: [
      ["A1", 0.3],
      ["A7", 0.304],
      ["B1", 0.299],
      ["B7", 0.307],
    ],
    protrusionMm: null,
    gasketMm: 1.27,
    notes: "Demo record. Re-torqued cold after three heat cycles, as the stud maker directs.",
  },
  {
    engine: FOUR,
    plan: FOUR_PLAN,
    on: "2026-11-20",
    by: "Teo Vastrick",
    reached: [61, 122, 169.5],
    stretch: [
      ["A4", 0.362],
      ["B4", 0.366],
      ["A3", 0.355],
      ["B3", 0.36],
    ],
    protrusionMm: 0.1,
    gasketMm: 1.08,
    notes: "Demo record. Sleeves measured 0.10 mm proud at all four; wire seated in the receiver groove.",
  },
];

interface RunSeed {
  plan: string;
  on: string;
  kind: "dyno" | "pass" | "street";
  kpa: number;
  peakMpa: number;
  source: "measured" | "estimated";
  outcome: string;
  cylinders: number[];
  notes: string;
  teardown: string;
}

// The street run's peak is the clamp model's estimate from 180 kPa on this engine (marked estimated).
const SIX_RUNS: RunSeed[] = [
  {
    plan: OLD_PLAN,
    on: "2026-04-26",
    kind: "dyno",
    kpa: 200,
    peakMpa: 8.1,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Break-in and first boost pulls; timing conservative.",
    teardown: "",
  },
  {
    plan: OLD_PLAN,
    on: "2026-05-17",
    kind: "pass",
    kpa: 230,
    peakMpa: 9.4,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Test-and-tune day, four passes.",
    teardown: "",
  },
  {
    plan: OLD_PLAN,
    on: "2026-06-07",
    kind: "pass",
    kpa: 250,
    peakMpa: 9.6,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Event, six passes.",
    teardown: "",
  },
  {
    plan: OLD_PLAN,
    on: "2026-07-12",
    kind: "dyno",
    kpa: 300,
    peakMpa: 12.6,
    source: "measured",
    outcome: "blown-gasket",
    cylinders: [5, 6],
    notes: "Demo run. Boost raised to 300 kPa; lost compression on 5 and 6 on the third pull.",
    teardown: "Fire ring collapsed on the bridge between 5 and 6; head and deck marked there; two 7/16 studs measured longer than new.",
  },
  {
    plan: NEW_PLAN,
    on: "2026-08-23",
    kind: "dyno",
    kpa: 250,
    peakMpa: 9.5,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. First session on the ½ studs.",
    teardown: "",
  },
  {
    plan: NEW_PLAN,
    on: "2026-09-13",
    kind: "dyno",
    kpa: 270,
    peakMpa: 10.6,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Boost stepped up; no coolant pressure rise.",
    teardown: "",
  },
  {
    plan: NEW_PLAN,
    on: "2026-10-25",
    kind: "street",
    kpa: 180,
    peakMpa: 8.773,
    source: "estimated",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Street use, no pressure sensor fitted.",
    teardown: "",
  },
  {
    plan: NEW_PLAN,
    on: "2026-11-08",
    kind: "pass",
    kpa: 280,
    peakMpa: 11.1,
    source: "measured",
    outcome: "held",
    cylinders: [],
    notes: "Demo run. Event, five passes.",
    teardown: "",
  },
];

// The four's sleeves as measured after the deck was cut (invented): three about as planned (0.10 mm
// proud), bore 1's sitting 0.06 mm under the deck, so only the wire gives its seal line a head start
// over the copper body and its margin falls from the plan's to thin.
const FOUR_MACHINING = {
  measured_on: "2026-11-20",
  measured_by: "Teo Vastrick",
  head_flatness_mm: 0.02,
  deck_flatness_mm: 0.015,
  head_finish_um: 0.8,
  deck_finish_um: 1.1,
  head_removed_mm: 0.1,
  deck_removed_mm: 0.05,
  sleeve_protrusion_mm: JSON.stringify([-0.06, 0.11, 0.12, 0.11]),
  wire_projection_mm: 0.12,
  receiver_groove_depth_mm: 0.05,
  gasket_compressed_mm: 1.07,
  notes: "Demo record. Sleeves read with a dial indicator at four points each, the lowest kept. Bore 1 to be shimmed before assembly.",
};

/** The four's machining sheet, while the demo shop has none (apart from the records below, so an older demo gets it). */
async function seedMachining(knex: Knex, teamId: number, at: string): Promise<void> {
  if (await knex("machining_records").where({ team_id: teamId }).first("id")) return;
  const engine = await knex("engines").where({ team_id: teamId, name: FOUR }).first("id");
  const plan = engine && (await knex("seal_plans").where({ team_id: teamId, engine_id: engine.id, name: FOUR_PLAN }).first("id"));
  if (!plan) return;
  const builder = await knex("users").where({ email: "builder@example.com" }).first("id");
  await knex("machining_records").insert({
    ...FOUR_MACHINING,
    team_id: teamId,
    engine_id: engine.id,
    plan_id: plan.id,
    created_by: builder?.id ?? null,
    created_at: at,
    updated_at: at,
  });
}

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ name: DEMO_TEAM }).first("id");
  if (!team) return;
  const at = new Date().toISOString();
  await seedMachining(knex, team.id, at);
  if (await knex("assemblies").where({ team_id: team.id }).first("id")) return;
  await knex.transaction(async (trx) => {
    const builder = await trx("users").where({ email: "builder@example.com" }).first("id");
    const engineId = async (name: string) => (await trx("engines").where({ team_id: team.id, name }).first("id"))?.id as number | undefined;
    const planOf = async (engine: number, name: string) => {
      const p = await trx("seal_plans").where({ team_id: team.id, engine_id: engine, name }).first("id", "stages", "lubricant");
      if (!p) throw new Error(`demo records: plan "${name}" missing; run 03-demo-engines first`);
      return p as { id: number; stages: string; lubricant: string };
    };
    for (const a of ASSEMBLIES) {
      const e = await engineId(a.engine);
      if (!e) return;
      const p = await planOf(e, a.plan);
      const stages = JSON.parse(p.stages) as number[];
      await trx("assemblies").insert({
        team_id: team.id,
        engine_id: e,
        plan_id: p.id,
        assembled_on: a.on,
        assembled_by: a.by,
        lubricant: p.lubricant,
        stages_done: JSON.stringify(stages.map((targetNm, i) => ({ targetNm, reachedNm: a.reached[i] ?? null, angleDeg: null }))),
        stud_stretch: JSON.stringify(a.stretch.map(([label, stretchMm]) => ({ label, stretchMm }))),
        final_torque_nm: a.reached.at(-1) ?? null,
        measured_protrusion_mm: a.protrusionMm,
        gasket_compressed_mm: a.gasketMm,
        notes: a.notes,
        created_by: builder?.id ?? null,
        created_at: at,
        updated_at: at,
      });
    }
    const six = await engineId(SIX);
    if (!six) return;
    for (const r of SIX_RUNS) {
      const p = await planOf(six, r.plan);
      await trx("runs").insert({
        team_id: team.id,
        engine_id: six,
        plan_id: p.id,
        ran_on: r.on,
        kind: r.kind,
        manifold_pressure_kpa: r.kpa,
        fuel: SIX_FUEL,
        peak_cylinder_pressure_mpa: r.peakMpa,
        peak_pressure_source: r.source,
        outcome: r.outcome,
        cylinders_affected: JSON.stringify(r.cylinders),
        notes: r.notes,
        teardown_findings: r.teardown,
        created_by: builder?.id ?? null,
        created_at: at,
        updated_at: at,
      });
    }
    await recordAudit(trx, team.id, null, "demo.records-seeded", {}, at);
  });
}
