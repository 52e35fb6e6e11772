import type { AssemblyRecord, StageDone, StudStretch } from "~/lib/records/assembly";
import type { RunInput, RunRecord } from "~/lib/records/run";
import { type DbRow, now, withTeam, writeTransaction } from "~/utils/db.server";
import type { EngineRow } from "./engine.server";
import { evaluateAtFiring } from "./plan-at-pressure.server";
import { listPlans, type PlanRow } from "./plan.server";
import { recordAudit } from "./audit.server";

// Assemblies and runs of an engine: Knex queries, each scoped to the team given. Another team's
// engine, assembly or run is simply not found.

export function toAssembly(r: DbRow): AssemblyRecord {
  return {
    id: r.id,
    engineId: r.engine_id,
    planId: r.plan_id,
    assembledOn: r.assembled_on,
    assembledBy: r.assembled_by,
    lubricant: r.lubricant,
    stagesDone: JSON.parse(r.stages_done) as StageDone[],
    studStretch: JSON.parse(r.stud_stretch) as StudStretch[],
    finalTorqueNm: r.final_torque_nm,
    measuredProtrusionMm: r.measured_protrusion_mm,
    gasketCompressedMm: r.gasket_compressed_mm,
    notes: r.notes,
    createdAt: r.created_at,
  };
}

export function toRun(r: DbRow): RunRecord {
  return {
    id: r.id,
    engineId: r.engine_id,
    planId: r.plan_id,
    ranOn: r.ran_on,
    kind: r.kind,
    manifoldPressureKpa: r.manifold_pressure_kpa,
    fuel: r.fuel,
    peakCylinderPressureMpa: r.peak_cylinder_pressure_mpa,
    peakPressureSource: r.peak_pressure_source,
    outcome: r.outcome,
    cylindersAffected: JSON.parse(r.cylinders_affected) as number[],
    notes: r.notes,
    teardownFindings: r.teardown_findings,
    createdAt: r.created_at,
  };
}

export async function listAssemblies(teamId: number, engineId: number): Promise<AssemblyRecord[]> {
  const rows = await withTeam(teamId, (k) =>
    k("assemblies").where({ team_id: teamId, engine_id: engineId }).orderBy("assembled_on", "desc").orderBy("id", "desc"),
  );
  return rows.map(toAssembly);
}

export interface AssemblyWrite {
  planId: number;
  assembledOn: string;
  assembledBy: string;
  lubricant: string;
  stagesDone: StageDone[];
  studStretch: StudStretch[];
  finalTorqueNm: number | null;
  measuredProtrusionMm?: number;
  gasketCompressedMm?: number;
  notes: string;
}

export async function createAssembly(teamId: number, userId: number, engineId: number, w: AssemblyWrite): Promise<number> {
  return writeTransaction(
    async (trx) => {
      const at = now();
      const [row] = await trx("assemblies")
        .insert({
          team_id: teamId,
          engine_id: engineId,
          plan_id: w.planId,
          assembled_on: w.assembledOn,
          assembled_by: w.assembledBy,
          lubricant: w.lubricant,
          stages_done: JSON.stringify(w.stagesDone),
          stud_stretch: JSON.stringify(w.studStretch),
          final_torque_nm: w.finalTorqueNm,
          measured_protrusion_mm: w.measuredProtrusionMm ?? null,
          gasket_compressed_mm: w.gasketCompressedMm ?? null,
          notes: w.notes,
          created_by: userId,
          created_at: at,
          updated_at: at,
        })
        .returning("id");
      await recordAudit(trx, teamId, userId, "assembly.recorded", { engineId, assemblyId: row.id, planId: w.planId });
      return row.id as number;
    },
    { teamId },
  );
}

export async function listRuns(teamId: number, engineId: number): Promise<RunRecord[]> {
  const rows = await withTeam(teamId, (k) =>
    k("runs").where({ team_id: teamId, engine_id: engineId }).orderBy("ran_on", "desc").orderBy("id", "desc"),
  );
  return rows.map(toRun);
}

/** The plan on the engine on that day: its latest assembly on or before it, else the chosen plan. */
export async function planOnDay(teamId: number, engine: EngineRow, day: string): Promise<PlanRow | null> {
  const plans = await listPlans(teamId, engine.id);
  const fitted = await withTeam(teamId, (k) =>
    k("assemblies")
      .where({ team_id: teamId, engine_id: engine.id })
      .where("assembled_on", "<=", day)
      .orderBy("assembled_on", "desc")
      .orderBy("id", "desc")
      .first("plan_id"),
  );
  return plans.find((p) => p.id === fitted?.plan_id) ?? plans.find((p) => p.id === engine.chosenPlanId) ?? null;
}

export async function createRun(teamId: number, userId: number, engine: EngineRow, r: RunInput): Promise<number> {
  const plan = await planOnDay(teamId, engine, r.ranOn);
  let peak = r.peakCylinderPressureMpa ?? null;
  let source: "measured" | "estimated" = peak === null ? "estimated" : "measured";
  if (peak === null && plan && r.manifoldPressureKpa !== undefined) {
    // the model's estimate from the manifold pressure, marked as such
    const at = await evaluateAtFiring(teamId, engine, plan, { manifoldKpa: r.manifoldPressureKpa });
    if (at.ok) peak = at.estimate.firing.peakPressureMpa;
    source = "estimated";
  }
  return writeTransaction(
    async (trx) => {
      const at = now();
      const [row] = await trx("runs")
        .insert({
          team_id: teamId,
          engine_id: engine.id,
          plan_id: plan?.id ?? null,
          ran_on: r.ranOn,
          kind: r.kind,
          manifold_pressure_kpa: r.manifoldPressureKpa ?? null,
          fuel: r.fuel,
          peak_cylinder_pressure_mpa: peak,
          peak_pressure_source: source,
          outcome: r.outcome,
          cylinders_affected: JSON.stringify(r.cylindersAffected),
          notes: r.notes,
          teardown_findings: r.teardownFindings,
          created_by: userId,
          created_at: at,
          updated_at: at,
        })
        .returning("id");
      await recordAudit(trx, teamId, userId, "run.logged", { engineId: engine.id, runId: row.id });
      return row.id as number;
    },
    { teamId },
  );
}
