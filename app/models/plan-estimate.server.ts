import { evaluatePlan, parsePlan, suggest, type PlanEstimate, type PlanInput, type Status, type Suggestion } from "~/lib/clamp";
import { assemblePlanInput, gasketFitProblem, type PlanParts, type PlanRecord } from "~/lib/plan/assemble";
import { estimateView, type EstimateView } from "~/lib/plan/estimate-view";
import { stretchLineFor, type StretchLine } from "~/lib/plan/stretch";
import { displayWording } from "~/lib/plan/wording";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import type { EngineRow } from "./engine.server";
import { withTeam, type DbRow } from "~/utils/db.server";
import { viewerScope, type Asker } from "./viewer-scope.server";
import { planParts, type FastenerInfo, type GasketInfo } from "./plan.server";

// The plan estimate, the one domain service every page and the API call: the plan's parts from this
// team's rows (or, for the API, a plan in SI), the gasket-fit check, the clamp model's validation,
// then the estimate worded in the person's units. Nothing here writes.

export type PlanEstimateResult =
  | { ok: true; view: EstimateView; suggestion: Suggestion | null; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

/** A plan as stored or as typed (not yet saved): its record and the library rows it names. */
type PlanFigures = PlanRecord & { gasketId: number; fastenerId: number };
type Parsed =
  | { ok: true; plan: PlanInput; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

const NO_PARTS = "Pick a gasket and fastener from this shop's library (and the engine's materials).";

/** Plan parts checked for gasket fit, as the clamp model's validated input. */
function checkParts(parts: PlanParts & { fastenerInfo: FastenerInfo; gasketInfo: GasketInfo }, units: UnitSystem): Parsed {
  const found = { fastener: parts.fastenerInfo, gasket: parts.gasketInfo };
  const misfit = gasketFitProblem(parts.engine.boreMm, parts.gasket.boreMm, (mm) => formatQuantity(mm, "length", units));
  if (misfit) return { ok: false, problems: [misfit], ...found };
  const parsed = parsePlan(assemblePlanInput(parts));
  if (!parsed.ok) return { ok: false, problems: parsed.errors.map((e) => e.message), ...found };
  return { ok: true, plan: parsed.plan, ...found };
}

/**
 * The plan's parts from this team's rows, checked for gasket fit, as the clamp model's validated input
 * (the API hands it out as the plan's `input`).
 */
export async function checkedPlanInput(teamId: number, engine: EngineRow, plan: PlanFigures, units: UnitSystem): Promise<Parsed> {
  const parts = await planParts(teamId, engine, plan);
  if (!parts) return { ok: false, problems: [NO_PARTS], fastener: null, gasket: null };
  return checkParts(parts, units);
}

export interface EstimateOptions {
  /** The person's units: every sentence and figure in the answer reads in them. */
  units: UnitSystem;
  /** Also work out a suggestion toward the plan's target margin. */
  withSuggestion?: boolean;
}

/** The estimate (sweep and scatter included) for a stored plan or for plan figures not yet saved. */
export async function estimatePlan(
  teamId: number,
  engine: EngineRow,
  plan: PlanFigures,
  options: EstimateOptions,
): Promise<PlanEstimateResult> {
  const r = await checkedPlanInput(teamId, engine, plan, options.units);
  if (!r.ok) return r;
  const wording = displayWording(options.units);
  const suggestion = options.withSuggestion ? suggest(r.plan, { targetMargin: r.plan.targetMargin, wording }) : null;
  return { ok: true, view: estimateView(r.plan, wording), suggestion, fastener: r.fastener, gasket: r.gasket };
}

/** The estimate for a plan sent in SI (the API): validated by the clamp model's own schema by the caller. */
export function estimateInput(plan: PlanInput, units: UnitSystem): EstimateView {
  return estimateView(plan, displayWording(units));
}

export type PlanEvaluationResult =
  | { ok: true; estimate: PlanEstimate; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

/** The evaluation alone (verdict, margins, ceiling): no sweep and no scatter run, for lists. */
export async function evaluateStoredPlan(
  teamId: number,
  engine: EngineRow,
  plan: PlanFigures,
  units: UnitSystem,
): Promise<PlanEvaluationResult> {
  const r = await checkedPlanInput(teamId, engine, plan, units);
  if (!r.ok) return r;
  return { ok: true, estimate: evaluatePlan(r.plan, displayWording(units), { sentences: false }), fastener: r.fastener, gasket: r.gasket };
}

export type VariantEvaluation = { ok: true; estimate: PlanEstimate } | { ok: false; problems: string[] };

/**
 * The evaluation of a stored plan and of variants of its parts (the machining record's measured figures
 * in place of the planned ones), the parts read once. The plan itself must evaluate; a variant that
 * the model refuses (a head cut thinner than it can be) says why.
 */
export async function evaluateVariants(
  teamId: number,
  engine: EngineRow,
  plan: PlanFigures,
  units: UnitSystem,
  variantsOf: (parts: PlanParts) => PlanParts[],
): Promise<{ ok: true; planned: PlanEstimate; variants: VariantEvaluation[]; parts: PlanParts } | { ok: false; problems: string[] }> {
  const parts = await planParts(teamId, engine, plan);
  if (!parts) return { ok: false, problems: [NO_PARTS] };
  const wording = displayWording(units);
  // the machining record lists each check with its detail
  const evaluate = (r: Parsed) => (r.ok ? evaluatePlan(r.plan, wording, { sentences: false, details: true }) : null);
  const base = checkParts(parts, units);
  if (!base.ok) return { ok: false, problems: base.problems };
  return {
    ok: true,
    planned: evaluate(base)!,
    parts,
    variants: variantsOf(parts).map((v) => {
      const r = checkParts({ ...parts, ...v }, units);
      return r.ok ? { ok: true, estimate: evaluate(r)! } : { ok: false, problems: r.problems };
    }),
  };
}

/** The stud stretch line for plan figures (saved or as typed), or null when the parts are missing. */
export async function planStretch(teamId: number, engine: EngineRow, plan: PlanFigures): Promise<StretchLine | null> {
  const parts = await planParts(teamId, engine, plan);
  return parts ? stretchLineFor(assemblePlanInput(parts)) : null;
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

/** The engines the asker may see that are working (not archived, not retired) and have a chosen plan: most recently touched first. */
export function workingEnginesWithChosenPlan(who: Asker, limit: number): Promise<DbRow[]> {
  return withTeam(who.teamId, (k) =>
    viewerScope(k("engines"), who)
      .whereNull("archived_at")
      .whereNot("status", "retired")
      .whereNotNull("chosen_plan_id")
      .orderBy("updated_at", "desc")
      .orderBy("id", "desc")
      .limit(limit),
  );
}

/** At risk: the chosen plan is short, or the stud is what limits it (the check that decides is the stud's). */
export function atRisk(v: ChosenPlanVerdict): boolean {
  return v.status === "short" || (v.status !== "holds" && v.limiting.startsWith("stud-"));
}
