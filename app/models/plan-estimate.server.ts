import { evaluatePlan, parsePlan, type PlanEstimate, type PlanInput, type Status } from "~/lib/clamp";
import { assemblePlanInput, type PlanRecord } from "~/lib/plan/assemble";
import { estimateView, type EstimateView } from "~/lib/plan/estimate-view";
import { displayWording } from "~/lib/plan/wording";
import type { UnitSystem } from "~/lib/units";
import { toEngine, type EngineRow } from "./engine.server";
import { db } from "~/utils/db.server";
import { viewerScope, type Asker } from "./viewer-scope.server";
import { planParts, requirePlan, type FastenerInfo, type GasketInfo } from "./plan.server";

export type PlanEstimateResult =
  | { ok: true; view: EstimateView; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

type StoredPlan = PlanRecord & { gasketId: number; fastenerId: number };
type Parsed =
  | { ok: true; plan: PlanInput; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

/** The plan's parts from this team's rows, as the clamp model's validated input (the API hands it out as the plan's `input`). */
export async function storedPlanInput(teamId: number, engine: EngineRow, plan: StoredPlan): Promise<Parsed> {
  const parts = await planParts(teamId, engine, plan);
  if (!parts) return { ok: false, problems: ["The plan's gasket, fastener or the engine's materials are missing from the library."], fastener: null, gasket: null };
  const parsed = parsePlan(assemblePlanInput(parts));
  if (!parsed.ok) return { ok: false, problems: parsed.errors.map((e) => e.message), fastener: parts.fastenerInfo, gasket: parts.gasketInfo };
  return { ok: true, plan: parsed.plan, fastener: parts.fastenerInfo, gasket: parts.gasketInfo };
}

/** Loads the plan's parts from this team's rows, builds the model input and runs the estimate. */
export async function estimatePlan(teamId: number, engine: EngineRow, plan: StoredPlan, units: UnitSystem = "metric"): Promise<PlanEstimateResult> {
  const r = await storedPlanInput(teamId, engine, plan);
  if (!r.ok) return r;
  return { ok: true, view: estimateView(r.plan, displayWording(units)), fastener: r.fastener, gasket: r.gasket };
}

export type PlanEvaluationResult =
  | { ok: true; estimate: PlanEstimate; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

/** The evaluation alone (verdict, margins, ceiling): no sweep and no scatter run, for lists. */
export async function evaluateStoredPlan(teamId: number, engine: EngineRow, plan: StoredPlan, units: UnitSystem = "metric"): Promise<PlanEvaluationResult> {
  const r = await storedPlanInput(teamId, engine, plan);
  if (!r.ok) return r;
  return { ok: true, estimate: evaluatePlan(r.plan, displayWording(units), { sentences: false }), fastener: r.fastener, gasket: r.gasket };
}

export interface ChosenPlanVerdict {
  engineId: number;
  engineName: string;
  planId: number;
  planName: string;
  status: Status;
  headline: string;
  /** The check that decides: "stud-assembly", "seal", … */
  limiting: string;
}

/**
 * The verdict of each working engine's chosen plan (not retired, most recently touched first, at most
 * `limit`): the evaluation only, no sweep or scatter run. Plans that cannot be estimated are left out.
 */
export async function chosenPlanVerdicts(who: Asker, limit = 50): Promise<ChosenPlanVerdict[]> {
  const teamId = who.teamId;
  const rows = await viewerScope(db()("engines"), who)
    .whereNull("archived_at")
    .whereNot("status", "retired")
    .whereNotNull("chosen_plan_id")
    .orderBy("updated_at", "desc")
    .orderBy("id", "desc")
    .limit(limit);
  const out: ChosenPlanVerdict[] = [];
  for (const row of rows) {
    const engine = toEngine(row);
    const plan = await requirePlan(teamId, engine.id, String(engine.chosenPlanId)).catch(() => null);
    if (!plan) continue;
    const r = await evaluateStoredPlan(teamId, engine, plan);
    if (!r.ok) continue;
    const v = r.estimate.verdict;
    out.push({ engineId: engine.id, engineName: engine.name, planId: plan.id, planName: plan.name, status: v.status, headline: v.headline, limiting: v.limiting });
  }
  return out;
}

/** At risk: the chosen plan is short, or the stud is what limits it (the check that decides is the stud's). */
export function atRisk(v: ChosenPlanVerdict): boolean {
  return v.status === "short" || (v.status !== "holds" && v.limiting.startsWith("stud-"));
}
