import type { EvidencePoint } from "~/lib/records/evidence";
import { withTeam } from "~/utils/db.server";
import { toEngine } from "./engine.server";
import { evaluateAtFiring } from "./plan-at-pressure.server";
import { listPlans } from "./plan.server";
import { toRun } from "./records.server";

// Every run of the team's engines as a point for the evidence view: the clamp model run for the plan on
// the engine that day at the run's own peak pressure, its seal margin (bottom of the band, hot and
// fired) and verdict beside what happened. Runs without a plan or a pressure are counted, not plotted.

export async function evidencePoints(teamId: number): Promise<{ points: EvidencePoint[]; unplotted: number }> {
  const engines = (await withTeam(teamId, (k) => k("engines").where({ team_id: teamId }).whereNull("archived_at"))).map(toEngine);
  const points: EvidencePoint[] = [];
  let unplotted = 0;
  for (const engine of engines) {
    const runs = (await withTeam(teamId, (k) => k("runs").where({ team_id: teamId, engine_id: engine.id }).orderBy("ran_on"))).map(toRun);
    if (runs.length === 0) continue;
    const plans = await listPlans(teamId, engine.id);
    for (const run of runs) {
      const plan = plans.find((p) => p.id === run.planId);
      const peak = run.peakCylinderPressureMpa;
      if (!plan || peak === null) {
        unplotted++;
        continue;
      }
      const at = await evaluateAtFiring(teamId, engine, plan, { peakMpa: peak });
      if (!at.ok) {
        unplotted++;
        continue;
      }
      points.push({
        runId: run.id,
        engineId: engine.id,
        engineName: engine.name,
        ranOn: run.ranOn,
        gasketType: at.gasket.type,
        gasketName: at.gasket.name,
        fastenerName: at.fastener.name,
        fuel: run.fuel,
        peakMpa: peak,
        peakSource: run.peakPressureSource,
        outcome: run.outcome,
        margin: at.estimate.weakestMargin,
        status: at.estimate.verdict.status,
      });
    }
  }
  return { points, unplotted };
}
