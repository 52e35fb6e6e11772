import type { Knex } from "knex";
import { recordAudit } from "../../app/models/audit.server.ts";
import { defaultStudPattern } from "../../app/lib/clamp/pattern.ts";

// Three invented customer engines for the demo shop, each with two or three seal plans, so a newcomer
// sees a real comparison at once. Customers and crews are invented. Runs only while the shop has no engines.
// Friction: docs/references.md §2 gives K ≈ 0.12 with anti-seize/moly-type compound and 0.18 "lubricated"
// (Shigley & Mischke, after a fastener handbook); μ ≈ 0.10–0.14 with moly paste and 0.14–0.18 with
// engine oil is the usual reading of those K values (from memory).
const DEMO_TEAM = "Harrow Lane Boost Works";
const LBF_FT = 1.3558179; // N·m per lbf·ft (NIST SP 811)
const nm = (lbfFt: number) => Math.round(lbfFt * LBF_FT * 10) / 10;

interface PlanSeed {
  name: string;
  gasket: string;
  fastener: string;
  lubricant: string;
  thread_friction: number;
  bearing_friction: number;
  method: "torque-estimated-friction" | "torque-tested-friction" | "angle-or-yield" | "stretch-measured";
  stages: number[];
  wire_location: "none" | "head" | "block";
  wire_projection_mm: number;
  receiver_groove_depth_mm: number;
  sleeve_protrusion_mm: number | null;
  target_margin: number;
  notes: string;
  chosen?: boolean;
}

interface EngineSeed {
  engine: Record<string, unknown> & { cylinders: number; layout: "inline" | "V" };
  /** Studs per side of each bank; the default pattern's count when absent. */
  studsPerSide?: number;
  materials: { block: string; head: string; sleeve: string | null };
  plans: PlanSeed[];
}

// The stud makers' own lubricants, word for word as their library rows record them.
const MOLY = "The stud maker's thread lube (moly-based)";

const COPPER_WIRE = "Solid copper 1.1 mm, 87 mm bore, wire-ring groove";
const MLS_87 = "Multilayer steel 1.3 mm, 87 mm bore";
const STUD_916 = "9/16-18 chromoly head stud, full shank";
const STUD_716 = "7/16-20 chromoly head stud, full shank";
const OIL = "Clean engine oil on threads and washer face";
const STUD_12_FULL = "½-20 alloy steel head stud, full shank";
const plan = (p: Partial<PlanSeed> & Pick<PlanSeed, "name" | "gasket" | "fastener" | "stages" | "notes">): PlanSeed => ({
  lubricant: MOLY,
  thread_friction: 0.11,
  bearing_friction: 0.12,
  method: "stretch-measured",
  wire_location: "none",
  wire_projection_mm: 0,
  receiver_groove_depth_mm: 0,
  sleeve_protrusion_mm: null,
  target_margin: 1.5,
  ...p,
});

// The story the demo tells (every figure invented, checked by tests/integration/demo-seed.test.ts):
// - the four: copper + wire against multilayer steel at the stud maker's torque, and copper + wire at a
//   torque where more only squeezes the head;
// - the six: multilayer steel at the maker's torque with oil, and the same torque with a slicker
//   lubricant than the maker's — the stud decides;
// - the V8: an aluminium block whose thread decides, until the studs go into full-depth inserts.
export const DEMO_ENGINES: EngineSeed[] = [
  {
    engine: {
      name: "Fenwick-Oddy 2.0 four",
      customer: "R. Fenwick-Oddy",
      cylinders: 4,
      layout: "inline",
      bore_mm: 86,
      stroke_mm: 86,
      rod_length_mm: 145,
      head_thickness_at_stud_mm: 100,
      block_depth_to_thread_mm: 15,
      sleeve_kind: "wet-flange",
      sleeve_wall_mm: 6,
      sleeve_support_length_mm: 9,
      sleeve_protrusion_mm: 0.1,
      fuel: "E85",
      target_manifold_kpa: 350,
      peak_pressure_mpa: 14,
      peak_pressure_source: "measured",
      pressure_rise_factor: 3,
      running_head_c: 105,
      running_block_c: 90,
      chamber_cc: 48,
      piston_volume_cc: 6,
      deck_clearance_mm: 0,
      status: "in-build",
      notes:
        "Wet flanged ductile sleeves, 9/16 studs, seven a side. Peak pressure from the customer's last dyno day on the old short block.",
    },
    studsPerSide: 7,
    materials: { block: "Ductile iron 65-45-12", head: "A356.0-T6 cast aluminium", sleeve: "Ductile iron 65-45-12" },
    plans: [
      plan({
        name: "Copper + wire at the maker's 125 lbf·ft",
        gasket: COPPER_WIRE,
        fastener: STUD_916,
        stages: [nm(45), nm(90), nm(125)],
        wire_location: "block",
        wire_projection_mm: 0.11,
        receiver_groove_depth_mm: 0.05,
        notes: "Sleeves as machined (0.10 mm proud). Wire about 10 % of the copper thickness, receiver groove in the head.",
        chosen: true,
      }),
      plan({
        name: "MLS with stopper at the maker's 125 lbf·ft",
        gasket: MLS_87,
        fastener: STUD_916,
        stages: [nm(45), nm(90), nm(125)],
        sleeve_protrusion_mm: 0.02,
        notes: "The same studs and torque with a multilayer steel gasket; sleeves taken down to 0.02 mm proud for the MLS.",
      }),
      plan({
        name: "Copper + wire, 150 lbf·ft",
        gasket: COPPER_WIRE,
        fastener: STUD_916,
        stages: [nm(50), nm(100), nm(150)],
        wire_location: "block",
        wire_projection_mm: 0.11,
        receiver_groove_depth_mm: 0.05,
        notes: "What 25 lbf·ft over the maker's figure would buy. The maker's figure stands unless the maker agrees.",
      }),
    ],
  },
  {
    engine: {
      name: "Number 47 crew straight six",
      customer: "Number 47 crew",
      cylinders: 6,
      layout: "inline",
      bore_mm: 86,
      stroke_mm: 86,
      rod_length_mm: 143,
      head_thickness_at_stud_mm: 95,
      block_depth_to_thread_mm: 10,
      sleeve_kind: "none",
      sleeve_wall_mm: null,
      sleeve_support_length_mm: null,
      sleeve_protrusion_mm: 0,
      fuel: "Pump fuel + methanol injection",
      target_manifold_kpa: 250,
      peak_pressure_mpa: 9.5,
      peak_pressure_source: "measured",
      pressure_rise_factor: 3,
      running_head_c: 110,
      running_block_c: 95,
      chamber_cc: 52,
      piston_volume_cc: 8,
      deck_clearance_mm: -0.25,
      status: "running",
      notes: "Cast-iron block, no sleeves, seven studs a side. Peak pressure from the crew's in-cylinder sensor on the last dyno day.",
    },
    materials: { block: "Gray cast iron, class 30–40", head: "A356.0-T6 cast aluminium", sleeve: null },
    plans: [
      plan({
        name: "MLS, ½ studs at the maker's 85 lbf·ft",
        gasket: MLS_87,
        fastener: STUD_12_FULL,
        thread_friction: 0.12,
        bearing_friction: 0.12,
        lubricant: MOLY,
        method: "torque-tested-friction",
        stages: [nm(30), nm(60), nm(85)],
        notes: "As built and running since the ½-inch stud upgrade, on the maker's lube.",
        chosen: true,
      }),
      plan({
        name: "MLS, ½ studs at 85 lbf·ft on a slicker lube",
        gasket: MLS_87,
        fastener: STUD_12_FULL,
        thread_friction: 0.08,
        bearing_friction: 0.08,
        lubricant: "Low-friction assembly lube (not the maker's)",
        method: "torque-tested-friction",
        stages: [nm(30), nm(60), nm(85)],
        notes:
          "The maker's torque on a slicker lubricant than the maker's: the stud takes much more preload for the same torque. The maker's torque goes with the maker's lubricant.",
      }),
      plan({
        name: "MLS, the old 7/16 studs on engine oil",
        gasket: MLS_87,
        fastener: STUD_716,
        lubricant: OIL,
        thread_friction: 0.15,
        bearing_friction: 0.16,
        method: "torque-estimated-friction",
        stages: [nm(35), nm(65), nm(85)],
        notes: "The first build, before the stud upgrade, for the record.",
      }),
    ],
  },
  {
    engine: {
      name: "Saltings 6.5 V8",
      customer: "Saltings Road drag team",
      cylinders: 8,
      layout: "V",
      bore_mm: 106,
      stroke_mm: 92,
      rod_length_mm: 155,
      head_thickness_at_stud_mm: 105,
      block_depth_to_thread_mm: 25,
      sleeve_kind: "dry",
      sleeve_wall_mm: 4,
      sleeve_support_length_mm: null,
      sleeve_protrusion_mm: 0.02,
      fuel: "Methanol",
      target_manifold_kpa: 420,
      peak_pressure_mpa: null,
      peak_pressure_source: "estimated",
      pressure_rise_factor: 2.2,
      running_head_c: 95,
      running_block_c: 85,
      chamber_cc: 78,
      piston_volume_cc: 10,
      deck_clearance_mm: -0.3,
      status: "quoted",
      notes:
        "Aluminium block with dry ductile-iron sleeves; aluminium heads. Race block with an extra stud between each pair of bores (nine per side per bank). Quote covers both sealing options and thread inserts.",
    },
    studsPerSide: 9,
    materials: { block: "A356.0-T6 cast aluminium", head: "A356.0-T6 cast aluminium", sleeve: "Ductile iron 65-45-12" },
    plans: [
      plan({
        name: "MLS + sleeve ring, studs in full-depth inserts",
        gasket: "Multilayer steel 1.3 mm, 107 mm bore, ring in the sleeve",
        fastener: "½-20 chromoly head stud, reduced shank, long thread for inserts",
        stages: [nm(35), nm(70), nm(105)],
        notes: "Stainless ring in a groove in the sleeve top; studs in full-depth thread inserts.",
        chosen: true,
      }),
      plan({
        name: "MLS + sleeve ring, studs in the aluminium thread",
        gasket: "Multilayer steel 1.3 mm, 107 mm bore, ring in the sleeve",
        fastener: "½-20 chromoly head stud, reduced shank",
        stages: [nm(35), nm(70), nm(105)],
        notes: "Without inserts: 28 mm of thread in the block's own aluminium.",
      }),
      plan({
        name: "Fire-ring gasket, studs in full-depth inserts",
        gasket: "Fire-ring gasket 1.2 mm, 107 mm bore",
        fastener: "½-20 chromoly head stud, reduced shank, long thread for inserts",
        stages: [nm(35), nm(70), nm(105)],
        notes: "Steel fire ring in the gasket; no sleeve groove needed.",
      }),
    ],
  },
];

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ name: DEMO_TEAM }).first("id");
  if (!team) return;
  if (await knex("engines").where({ team_id: team.id }).first("id")) return;
  const at = new Date().toISOString();
  // Look-ups go through the transaction: SQLite has one connection, so the outer knex would wait forever.
  const lookup =
    (trx: Knex.Transaction) =>
    async (table: string, name: string): Promise<number> => {
      const row = await trx(table).where({ team_id: team.id, name }).first("id");
      if (!row) throw new Error(`demo seed: ${table} "${name}" missing for ${DEMO_TEAM}; run 02-libraries first`);
      return row.id;
    };
  await knex.transaction(async (trx) => {
    const idOf = lookup(trx);
    for (const e of DEMO_ENGINES) {
      const [{ id: engineId }] = await trx("engines")
        .insert({
          ...e.engine,
          team_id: team.id,
          block_material_id: await idOf("materials", e.materials.block),
          head_material_id: await idOf("materials", e.materials.head),
          sleeve_material_id: e.materials.sleeve ? await idOf("materials", e.materials.sleeve) : null,
          studs: JSON.stringify(defaultStudPattern(e.engine.layout, e.engine.cylinders, e.studsPerSide)),
          created_at: at,
          updated_at: at,
        })
        .returning("id");
      for (const { chosen, gasket, fastener, stages, ...p } of e.plans) {
        const [{ id: planId }] = await trx("seal_plans")
          .insert({
            ...p,
            team_id: team.id,
            engine_id: engineId,
            gasket_id: await idOf("gaskets", gasket),
            fastener_id: await idOf("fasteners", fastener),
            torque_nm: stages[stages.length - 1],
            stages: JSON.stringify(stages),
            created_at: at,
            updated_at: at,
          })
          .returning("id");
        if (chosen) await trx("engines").where({ id: engineId }).update({ chosen_plan_id: planId });
      }
    }
    await recordAudit(trx, team.id, null, "demo.engines-seeded", {}, at);
  });
}
