// The dashboard's chosen-plan verdicts in a fixed handful of queries, whatever the number of engines:
// the engines, their chosen plans, and the team's materials, fasteners and gaskets (each list read
// once), then the plans assembled in memory: the same verdicts as reading each plan and its parts one
// by one (several queries per engine; tests/integration/one-by-one-verdicts.ts, the tests' reference). The
// evaluation of a validated input is kept in a small LRU (the model is pure: the same input gives
// the same verdict), so a dashboard seen again evaluates only the plans that changed.
import { evaluatePlan, parsePlan, type PlanInputRaw } from "~/lib/clamp";
import { LruCache } from "~/lib/lru-cache";
import { assemblePlanInput, gasketFitProblem } from "~/lib/plan/assemble";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { withTeam } from "~/utils/db.server";
import { toEngine } from "./engine.server";
import { listFasteners, listGaskets, listMaterials, type MaterialRow } from "./library.server";
import { workingEnginesWithChosenPlan, type ChosenPlanVerdict } from "./plan-estimate.server";
import { toPlan } from "./plan.server";
import type { Asker } from "./viewer-scope.server";

type Verdict = Pick<ChosenPlanVerdict, "status" | "headline" | "limiting">;

/**
 * Verdicts by input (null where the schema refuses it); the words of a verdict do not depend on units.
 * 512 entries of a few hundred bytes each.
 */
export const VERDICT_CACHE = new LruCache<Verdict | null>(512);

/** The verdict of an assembled input, from the cache or one validation and one lean evaluation (no sentences). */
function verdictOf(raw: PlanInputRaw): Verdict | null {
  const key = JSON.stringify(raw);
  const hit = VERDICT_CACHE.get(key);
  if (hit !== undefined) return hit;
  const parsed = parsePlan(raw);
  let out: Verdict | null = null;
  if (parsed.ok) {
    const v = evaluatePlan(parsed.plan, undefined, { sentences: false }).verdict;
    out = { status: v.status, headline: v.headline, limiting: v.limiting };
  }
  VERDICT_CACHE.set(key, out);
  return out;
}

/**
 * The verdict of the chosen plan of each engine the asker may see (not archived,
 * not retired, most recently updated first, at most `limit`), plans that cannot be estimated left out.
 */
export async function chosenPlanVerdicts(who: Asker, units: UnitSystem, limit = 50): Promise<ChosenPlanVerdict[]> {
  const teamId = who.teamId;
  const engineRows = await workingEnginesWithChosenPlan(who, limit);
  if (engineRows.length === 0) return [];
  const engines = engineRows.map(toEngine);
  const [planRows, materials, fasteners, gaskets] = await Promise.all([
    // by (team, engine) first: the (team_id, engine_id) index then reaches each engine's few plans,
    // where team_id and the ids alone let SQLite walk every plan of the team
    withTeam(teamId, (k) =>
      k("seal_plans")
        .where("team_id", teamId)
        .whereIn(
          "engine_id",
          engines.map((e) => e.id),
        )
        .whereIn(
          "id",
          engines.map((e) => e.chosenPlanId!),
        )
        .whereNull("archived_at"),
    ),
    // archived rows too: a plan may still name one (as getFastener, getGasket and getMaterial read them)
    listMaterials(teamId, { includeArchived: true }),
    listFasteners(teamId, { includeArchived: true }),
    listGaskets(teamId, { includeArchived: true }),
  ]);
  const plans = new Map(planRows.map((r) => [r.id as number, toPlan(r)]));
  const materialById = new Map(materials.map((m) => [m.id, m]));
  const fastenerById = new Map(fasteners.map((f) => [f.id, f]));
  const gasketById = new Map(gaskets.map((g) => [g.id, g]));
  const mat = (id: number | null): MaterialRow | null => (id === null ? null : (materialById.get(id) ?? null));
  const out: ChosenPlanVerdict[] = [];
  for (const engine of engines) {
    const plan = plans.get(engine.chosenPlanId!);
    // requirePlan's rule: the plan must be this engine's
    if (!plan || plan.engineId !== engine.id) continue;
    const f = fastenerById.get(plan.fastenerId);
    const fm = f ? mat(f.materialId) : null;
    const gasket = gasketById.get(plan.gasketId);
    const head = mat(engine.headMaterialId);
    const block = mat(engine.blockMaterialId);
    if (!f || !fm || !gasket || !head || !block) continue;
    if (gasketFitProblem(engine.boreMm, gasket.boreMm, (mm) => formatQuantity(mm, "length", units))) continue;
    const fastener = { ...f, material: fm };
    const verdict = verdictOf(assemblePlanInput({ engine, plan, fastener, gasket, head, block, sleeve: mat(engine.sleeveMaterialId) }));
    if (!verdict) continue;
    out.push({ engineId: engine.id, engineName: engine.name, planId: plan.id, planName: plan.name, ...verdict });
  }
  return out;
}
