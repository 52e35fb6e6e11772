import { data } from "react-router";
import type { FastenerRecord, GasketRecord, MaterialRecord, PlanParts, PlanRecord } from "~/lib/plan/assemble";
import type { PlanWrite } from "~/lib/plan/form";
import { db, now } from "~/utils/db.server";
import type { EngineRow } from "./engine.server";

export interface PlanRow extends PlanRecord {
  id: number;
  engineId: number;
  name: string;
  gasketId: number;
  fastenerId: number;
  lubricant: string;
  stagesNm: number[];
  targetMargin: number;
  notes: string;
  updatedAt: string;
}

export interface FastenerInfo extends FastenerRecord {
  id: number;
  name: string;
  makerTorqueNm: number | null;
  makerLubricant: string | null;
  makerStages: string | null;
  makerStretchMm: number | null;
  threadFriction: number;
  bearingFriction: number;
}

export interface GasketInfo extends GasketRecord {
  id: number;
  name: string;
}

type Row = Record<string, any>;

function toPlan(r: Row): PlanRow {
  return {
    id: r.id,
    engineId: r.engine_id,
    name: r.name,
    gasketId: r.gasket_id,
    fastenerId: r.fastener_id,
    lubricant: r.lubricant,
    threadFriction: r.thread_friction,
    bearingFriction: r.bearing_friction,
    method: r.method,
    torqueNm: r.torque_nm,
    stagesNm: JSON.parse(r.stages),
    wireLocation: r.wire_location,
    wireProjectionMm: r.wire_projection_mm,
    receiverGrooveDepthMm: r.receiver_groove_depth_mm,
    sleeveProtrusionMm: r.sleeve_protrusion_mm,
    targetMargin: r.target_margin,
    notes: r.notes,
    updatedAt: r.updated_at,
  };
}

function toMaterial(r: Row): MaterialRecord {
  return {
    name: r.name,
    modulusMpa: r.modulus_mpa,
    yieldMpa: r.yield_mpa,
    expansionUmPerMC: r.expansion_um_per_m_c,
    limitingSurfacePressureMpa: r.limiting_surface_pressure_mpa,
  };
}

async function material(teamId: number, id: number | null): Promise<MaterialRecord | null> {
  if (id === null) return null;
  const row = await db()("materials").where({ team_id: teamId, id }).first();
  return row ? toMaterial(row) : null;
}

export async function listPlans(teamId: number, engineId: number): Promise<PlanRow[]> {
  const rows = await db()("seal_plans").where({ team_id: teamId, engine_id: engineId }).whereNull("archived_at").orderBy("id");
  return rows.map(toPlan);
}

export async function requirePlan(teamId: number, engineId: number, planIdParam: string | undefined): Promise<PlanRow> {
  const id = Number(planIdParam);
  const row = Number.isInteger(id)
    ? await db()("seal_plans").where({ team_id: teamId, engine_id: engineId, id }).whereNull("archived_at").first()
    : null;
  if (!row) throw data("No such seal plan on this engine.", { status: 404 });
  return toPlan(row);
}

/** Active fasteners and gaskets of the team, for the plan editor's pickers. */
export async function planChoices(teamId: number): Promise<{ fasteners: FastenerInfo[]; gaskets: GasketInfo[] }> {
  const [fasteners, gaskets] = await Promise.all([
    db()("fasteners").where({ team_id: teamId }).whereNull("archived_at").orderBy("name"),
    db()("gaskets").where({ team_id: teamId }).whereNull("archived_at").orderBy("name"),
  ]);
  const out: FastenerInfo[] = [];
  for (const f of fasteners) {
    const m = await material(teamId, f.material_id);
    if (m) out.push(toFastener(f, m));
  }
  return { fasteners: out, gaskets: gaskets.map(toGasket) };
}

function toFastener(f: Row, m: MaterialRecord): FastenerInfo {
  return {
    id: f.id,
    name: f.name,
    diameterMm: f.diameter_mm,
    pitchMm: f.pitch_mm,
    reducedShankDiameterMm: f.reduced_shank_diameter_mm,
    reducedShankLengthMm: f.reduced_shank_length_mm,
    freeThreadLengthMm: f.free_thread_length_mm,
    engagementMm: f.engagement_mm,
    washerOdMm: f.washer_od_mm,
    washerHoleMm: f.washer_hole_mm,
    washerThicknessMm: f.washer_thickness_mm,
    material: m,
    makerTorqueNm: f.maker_torque_nm,
    makerLubricant: f.maker_lubricant,
    makerStages: f.maker_stages,
    makerStretchMm: f.maker_stretch_mm,
    threadFriction: f.thread_friction,
    bearingFriction: f.bearing_friction,
  };
}

function toGasket(g: Row): GasketInfo {
  return {
    id: g.id,
    name: g.name,
    type: g.type,
    compressedThicknessMm: g.compressed_thickness_mm,
    boreMm: g.bore_mm,
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
  };
}

export async function getFastener(teamId: number, id: number): Promise<FastenerInfo | null> {
  const f = Number.isInteger(id) ? await db()("fasteners").where({ team_id: teamId, id }).first() : null;
  const m = f ? await material(teamId, f.material_id) : null;
  return f && m ? toFastener(f, m) : null;
}

export async function getGasket(teamId: number, id: number): Promise<GasketInfo | null> {
  const g = Number.isInteger(id) ? await db()("gaskets").where({ team_id: teamId, id }).first() : null;
  return g ? toGasket(g) : null;
}

/** The engine's head, block and sleeve materials (this team's rows). */
export async function engineMaterials(teamId: number, engine: EngineRow) {
  const [head, block, sleeve] = await Promise.all([
    material(teamId, engine.headMaterialId),
    material(teamId, engine.blockMaterialId),
    material(teamId, engine.sleeveMaterialId),
  ]);
  return { head, block, sleeve };
}

/** Everything the clamp model needs for this plan on this engine, all from this team's rows. */
export async function planParts(
  teamId: number,
  engine: EngineRow,
  plan: PlanRecord & { gasketId: number; fastenerId: number },
): Promise<(PlanParts & { fastenerInfo: FastenerInfo; gasketInfo: GasketInfo }) | null> {
  const [fastener, gasket, { head, block, sleeve }] = await Promise.all([
    getFastener(teamId, plan.fastenerId),
    getGasket(teamId, plan.gasketId),
    engineMaterials(teamId, engine),
  ]);
  if (!fastener || !gasket || !head || !block) return null;
  return { engine, plan, fastener, gasket, head, block, sleeve, fastenerInfo: fastener, gasketInfo: gasket };
}


function planColumns(w: PlanWrite) {
  return {
    name: w.name,
    gasket_id: w.gasketId,
    fastener_id: w.fastenerId,
    lubricant: w.lubricant,
    thread_friction: w.threadFriction,
    bearing_friction: w.bearingFriction,
    method: w.method,
    torque_nm: w.torqueNm,
    stages: JSON.stringify(w.stagesNm),
    wire_location: w.wireLocation,
    wire_projection_mm: w.wireProjectionMm,
    receiver_groove_depth_mm: w.receiverGrooveDepthMm,
    sleeve_protrusion_mm: w.sleeveProtrusionMm,
    target_margin: w.targetMargin,
    notes: w.notes,
  };
}

async function audit(teamId: number, userId: number, action: string, detail: object) {
  await db()("audit_events").insert({ team_id: teamId, user_id: userId, action, detail: JSON.stringify(detail), created_at: now() });
}

export async function createPlan(teamId: number, userId: number, engineId: number, w: PlanWrite): Promise<number> {
  const at = now();
  const [row] = await db()("seal_plans")
    .insert({ team_id: teamId, engine_id: engineId, created_at: at, updated_at: at, ...planColumns(w) })
    .returning("id");
  const id = (row as { id: number }).id;
  await audit(teamId, userId, "plan.created", { engineId, planId: id, name: w.name });
  return id;
}

export async function updatePlan(teamId: number, userId: number, engineId: number, planId: number, w: PlanWrite): Promise<void> {
  await db()("seal_plans").where({ team_id: teamId, engine_id: engineId, id: planId }).update({ ...planColumns(w), updated_at: now() });
  await audit(teamId, userId, "plan.updated", { engineId, planId, name: w.name });
}

export async function archivePlan(teamId: number, userId: number, engineId: number, planId: number): Promise<void> {
  await db().transaction(async (trx) => {
    await trx("seal_plans").where({ team_id: teamId, engine_id: engineId, id: planId }).update({ archived_at: now() });
    await trx("engines").where({ team_id: teamId, id: engineId, chosen_plan_id: planId }).update({ chosen_plan_id: null });
  });
  await audit(teamId, userId, "plan.archived", { engineId, planId });
}

export async function choosePlan(teamId: number, userId: number, engineId: number, planId: number): Promise<void> {
  await db()("engines").where({ team_id: teamId, id: engineId }).update({ chosen_plan_id: planId, updated_at: now() });
  await audit(teamId, userId, "plan.chosen", { engineId, planId });
}
