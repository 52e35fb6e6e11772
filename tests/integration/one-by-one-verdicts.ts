// The dashboard's chosen-plan verdicts read one by one: each engine's chosen plan and its parts through
// the same model functions the plan pages use (several queries per engine). The app reads them batched
// (chosenPlanVerdicts, app/models/dashboard.server.ts); this is the reference the tests compare
// it with on both engines, and one more set of queries for the query-plan tests.
import type { UnitSystem } from "~/lib/units";
import { toEngine } from "~/models/engine.server";
import { evaluateStoredPlan, workingEnginesWithChosenPlan, type ChosenPlanVerdict } from "~/models/plan-estimate.server";
import { requirePlan } from "~/models/plan.server";
import type { Asker } from "~/models/viewer-scope.server";

/**
 * The verdict of each working engine's chosen plan (not retired, most recently touched first, at most
 * `limit`): the evaluation only, no sweep or scatter run. Plans that cannot be estimated are left out.
 */
export async function chosenPlanVerdictsOneByOne(who: Asker, units: UnitSystem, limit = 50): Promise<ChosenPlanVerdict[]> {
  const teamId = who.teamId;
  const rows = await workingEnginesWithChosenPlan(who, limit);
  const out: ChosenPlanVerdict[] = [];
  for (const row of rows) {
    const engine = toEngine(row);
    const plan = await requirePlan(teamId, engine.id, String(engine.chosenPlanId)).catch(() => null);
    if (!plan) continue;
    const r = await evaluateStoredPlan(teamId, engine, plan, units);
    if (!r.ok) continue;
    const v = r.estimate.verdict;
    out.push({
      engineId: engine.id,
      engineName: engine.name,
      planId: plan.id,
      planName: plan.name,
      status: v.status,
      headline: v.headline,
      limiting: v.limiting,
    });
  }
  return out;
}
