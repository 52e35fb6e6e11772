import { data } from "react-router";
import type { PlanParts, PlanRecord } from "~/lib/plan/assemble";
import type { PlanWrite } from "~/lib/plan/form-fields";
import { now, setRowScope, withTeam, writeTransaction, type DbRow } from "~/utils/db.server";
import type { EngineRow } from "./engine.server";
import {
  getFastener as getLibraryFastener,
  getGasket,
  getMaterial,
  listFasteners,
  listGaskets,
  listMaterials,
  type FastenerRow,
  type GasketRow,
  type MaterialRow,
} from "./library.server";
import { recordAudit } from "./audit.server";

export interface PlanRow extends PlanRecord {
  targetStretchMm: number | null;
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

/** A library fastener with its stud material, as the clamp model needs it. */
export type FastenerInfo = FastenerRow & { material: MaterialRow };
export type GasketInfo = GasketRow;

export function toPlan(r: DbRow): PlanRow {
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
    targetStretchMm: r.target_stretch_mm ?? null,
    targetMargin: r.target_margin,
    notes: r.notes,
    updatedAt: r.updated_at,
  };
}

async function material(teamId: number, id: number | null): Promise<MaterialRow | null> {
  return id === null ? null : getMaterial(teamId, id);
}

export async function listPlans(teamId: number, engineId: number): Promise<PlanRow[]> {
  const rows = await withTeam(teamId, (k) =>
    k("seal_plans").where({ team_id: teamId, engine_id: engineId }).whereNull("archived_at").orderBy("id"),
  );
  return rows.map(toPlan);
}

export async function requirePlan(teamId: number, engineId: number, planIdParam: string | undefined): Promise<PlanRow> {
  const id = Number(planIdParam);
  const row = Number.isInteger(id)
    ? await withTeam(teamId, (k) => k("seal_plans").where({ team_id: teamId, engine_id: engineId, id }).whereNull("archived_at").first())
    : null;
  if (!row) throw data("No such seal plan on this engine.", { status: 404 });
  return toPlan(row);
}

/** Active fasteners (each with its stud material) and gaskets of the team, for the plan editor's pickers. */
export async function planChoices(teamId: number): Promise<{ fasteners: FastenerInfo[]; gaskets: GasketInfo[] }> {
  const [fasteners, gaskets, materials] = await Promise.all([
    listFasteners(teamId),
    listGaskets(teamId),
    // archived materials too: an active fastener may still point at one
    listMaterials(teamId, { includeArchived: true }),
  ]);
  const byId = new Map(materials.map((m) => [m.id, m]));
  const withMaterial = fasteners.flatMap((f) => {
    const m = byId.get(f.materialId);
    return m ? [{ ...f, material: m }] : [];
  });
  return { fasteners: withMaterial, gaskets };
}

export async function getFastener(teamId: number, id: number): Promise<FastenerInfo | null> {
  const f = await getLibraryFastener(teamId, id);
  const m = f ? await getMaterial(teamId, f.materialId) : null;
  return f && m ? { ...f, material: m } : null;
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
    target_stretch_mm: w.targetStretchMm,
    target_margin: w.targetMargin,
    notes: w.notes,
  };
}

// Each write and its audit row in one write transaction (BEGIN IMMEDIATE on SQLite): both or neither.

export async function createPlan(teamId: number, userId: number, engineId: number, w: PlanWrite): Promise<number> {
  return writeTransaction(async (trx) => {
    await setRowScope(trx, { teamId });
    const at = now();
    const [row] = await trx("seal_plans")
      .insert({ team_id: teamId, engine_id: engineId, created_at: at, updated_at: at, ...planColumns(w) })
      .returning("id");
    const id = (row as { id: number }).id;
    await recordAudit(trx, teamId, userId, "plan.created", { engineId, planId: id, name: w.name });
    return id;
  });
}

export async function updatePlan(teamId: number, userId: number, engineId: number, planId: number, w: PlanWrite): Promise<void> {
  await writeTransaction(async (trx) => {
    await setRowScope(trx, { teamId });
    await trx("seal_plans")
      .where({ team_id: teamId, engine_id: engineId, id: planId })
      .update({ ...planColumns(w), updated_at: now() });
    await recordAudit(trx, teamId, userId, "plan.updated", { engineId, planId, name: w.name });
  });
}

export async function archivePlan(teamId: number, userId: number, engineId: number, planId: number): Promise<void> {
  await writeTransaction(async (trx) => {
    await setRowScope(trx, { teamId });
    await trx("seal_plans").where({ team_id: teamId, engine_id: engineId, id: planId }).update({ archived_at: now() });
    await trx("engines").where({ team_id: teamId, id: engineId, chosen_plan_id: planId }).update({ chosen_plan_id: null });
    await recordAudit(trx, teamId, userId, "plan.archived", { engineId, planId });
  });
}

export async function choosePlan(teamId: number, userId: number, engineId: number, planId: number): Promise<void> {
  await writeTransaction(
    async (trx) => {
      await trx("engines").where({ team_id: teamId, id: engineId }).update({ chosen_plan_id: planId, updated_at: now() });
      await recordAudit(trx, teamId, userId, "plan.chosen", { engineId, planId });
    },
    { teamId },
  );
}

/** A copy of the plan on another engine of the same team (the caller checks the gasket fits). Returns the new id. */
export async function copyPlanToEngine(teamId: number, userId: number, plan: PlanRow, targetEngineId: number): Promise<number> {
  return writeTransaction(
    async (trx) => {
      const at = now();
      const [row] = await trx("seal_plans")
        .insert({ team_id: teamId, engine_id: targetEngineId, created_at: at, updated_at: at, ...planColumns(plan) })
        .returning("id");
      const id = (row as { id: number }).id;
      await recordAudit(trx, teamId, userId, "plan.copied", {
        engineId: targetEngineId,
        planId: id,
        fromEngineId: plan.engineId,
        fromPlanId: plan.id,
        name: plan.name,
      });
      return id;
    },
    { teamId },
  );
}
