import type { Knex } from "knex";
import { defaultStudPattern } from "../../app/lib/clamp/pattern.ts";

// Three invented customer engines for the demo shop, each with two or three seal plans, so a newcomer
// sees a real comparison at once. Customers and crews are invented. Runs only while the shop has no engines.
// Friction: REFERENCES §2 gives K ≈ 0.12 with anti-seize/moly-type compound and 0.18 "lubricated"
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

const MOLY = "Moly assembly paste (the stud maker's lube)";

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
      peak_pressure_mpa: null,
      peak_pressure_source: "estimated",
      pressure_rise_factor: 3,
      running_head_c: 105,
      running_block_c: 90,
      chamber_cc: 48,
      piston_volume_cc: 6,
      deck_clearance_mm: 0,
      status: "in-build",
      notes: "Wet flanged ductile sleeves, stainless wire in the block with a receiver groove in the head. Customer wants it on the dyno before the spring meeting.",
    },
    materials: { block: "Ductile iron 65-45-12", head: "A356.0-T6 cast aluminium", sleeve: "Ductile iron 65-45-12" },
    plans: [
      {
        name: "Copper + wire, 0.10 mm proud, 115 lbf·ft",
        gasket: "Solid copper 1.1 mm, 87 mm bore, wire-ring groove",
        fastener: "½-20 chromoly head stud, reduced shank",
        lubricant: MOLY,
        thread_friction: 0.11,
        bearing_friction: 0.12,
        method: "stretch-measured",
        stages: [nm(40), nm(80), nm(115)],
        wire_location: "block",
        wire_projection_mm: 0.11,
        receiver_groove_depth_mm: 0.05,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "Sleeves as machined (0.10 mm proud). Wire about 10 % of the copper thickness.",
        chosen: true,
      },
      {
        name: "Copper + wire, 0.05 mm proud, 100 lbf·ft",
        gasket: "Solid copper 1.1 mm, 87 mm bore, wire-ring groove",
        fastener: "½-20 chromoly head stud, reduced shank",
        lubricant: MOLY,
        thread_friction: 0.11,
        bearing_friction: 0.12,
        method: "stretch-measured",
        stages: [nm(40), nm(70), nm(100)],
        wire_location: "block",
        wire_projection_mm: 0.11,
        receiver_groove_depth_mm: 0.05,
        sleeve_protrusion_mm: 0.05,
        target_margin: 1.5,
        notes: "What if the sleeves are taken down to 0.05 mm proud.",
      },
      {
        name: "Copper, no wire",
        gasket: "Solid copper 1.1 mm, 87 mm bore, plain",
        fastener: "½-20 chromoly head stud, reduced shank",
        lubricant: MOLY,
        thread_friction: 0.11,
        bearing_friction: 0.12,
        method: "stretch-measured",
        stages: [nm(40), nm(80), nm(115)],
        wire_location: "none",
        wire_projection_mm: 0,
        receiver_groove_depth_mm: 0,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "Plain copper on the sleeve top land, for comparison.",
      },
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
      peak_pressure_mpa: 14.5,
      peak_pressure_source: "measured",
      pressure_rise_factor: 3,
      running_head_c: 110,
      running_block_c: 95,
      chamber_cc: 52,
      piston_volume_cc: 8,
      deck_clearance_mm: -0.25,
      status: "running",
      notes: "Cast-iron block, no sleeves. Peak pressure from the crew's in-cylinder sensor on the last dyno day.",
    },
    materials: { block: "Gray cast iron, class 30–40", head: "A356.0-T6 cast aluminium", sleeve: null },
    plans: [
      {
        name: "MLS 1.3 mm at maker torque",
        gasket: "Multilayer steel 1.3 mm, 87 mm bore",
        fastener: "7/16-20 chromoly head stud, full shank",
        lubricant: "Clean engine oil",
        thread_friction: 0.15,
        bearing_friction: 0.16,
        method: "torque-estimated-friction",
        stages: [nm(35), nm(65), nm(85)],
        wire_location: "none",
        wire_projection_mm: 0,
        receiver_groove_depth_mm: 0,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "As built and running.",
        chosen: true,
      },
      {
        name: "MLS 1.3 mm, extra 10 %",
        gasket: "Multilayer steel 1.3 mm, 87 mm bore",
        fastener: "7/16-20 chromoly head stud, full shank",
        lubricant: "Clean engine oil",
        thread_friction: 0.15,
        bearing_friction: 0.16,
        method: "torque-estimated-friction",
        stages: [nm(35), nm(65), Math.round(nm(85) * 1.1 * 10) / 10],
        wire_location: "none",
        wire_projection_mm: 0,
        receiver_groove_depth_mm: 0,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "Ten per cent over the maker's figure: does it buy seal, or only squeeze the head? The maker's figure stands unless the maker agrees.",
      },
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
      sleeve_protrusion_mm: 0.05,
      fuel: "Methanol",
      target_manifold_kpa: 420,
      peak_pressure_mpa: null,
      peak_pressure_source: "estimated",
      pressure_rise_factor: 3,
      running_head_c: 95,
      running_block_c: 85,
      chamber_cc: 78,
      piston_volume_cc: 10,
      deck_clearance_mm: -0.3,
      status: "quoted",
      notes: "Aluminium block with dry ductile-iron sleeves; aluminium heads. Race block with an extra stud between each pair of bores (nine per side per bank). Quote covers both sealing options.",
    },
    studsPerSide: 9,
    materials: { block: "A356.0-T6 cast aluminium", head: "A356.0-T6 cast aluminium", sleeve: "Ductile iron 65-45-12" },
    plans: [
      {
        name: "MLS + sleeve ring",
        gasket: "Multilayer steel 1.3 mm, 107 mm bore, ring in the sleeve",
        fastener: "½-20 chromoly head stud, reduced shank",
        lubricant: MOLY,
        thread_friction: 0.11,
        bearing_friction: 0.12,
        method: "stretch-measured",
        stages: [nm(40), nm(80), nm(115)],
        wire_location: "none",
        wire_projection_mm: 0,
        receiver_groove_depth_mm: 0,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "Stainless ring in a groove in the sleeve top.",
        chosen: true,
      },
      {
        name: "Fire-ring gasket",
        gasket: "Fire-ring gasket 1.2 mm, 107 mm bore",
        fastener: "½-20 chromoly head stud, reduced shank",
        lubricant: MOLY,
        thread_friction: 0.11,
        bearing_friction: 0.12,
        method: "stretch-measured",
        stages: [nm(40), nm(80), nm(115)],
        wire_location: "none",
        wire_projection_mm: 0,
        receiver_groove_depth_mm: 0,
        sleeve_protrusion_mm: null,
        target_margin: 1.5,
        notes: "Steel fire ring in the gasket; no sleeve groove needed.",
      },
    ],
  },
];

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ name: DEMO_TEAM }).first("id");
  if (!team) return;
  if (await knex("engines").where({ team_id: team.id }).first("id")) return;
  const at = new Date().toISOString();
  // Look-ups go through the transaction: SQLite has one connection, so the outer knex would wait forever.
  const lookup = (trx: Knex.Transaction) => async (table: string, name: string): Promise<number> => {
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
    await trx("audit_events").insert({ team_id: team.id, action: "demo.engines-seeded", created_at: at });
  });
}
