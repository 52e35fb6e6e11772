import { suggest, parsePlan, type Suggestion } from "~/lib/clamp";
import { assemblePlanInput, gasketFitProblem } from "~/lib/plan/assemble";
import { estimateView, type EstimateView } from "~/lib/plan/estimate-view";
import type { PlanWrite } from "~/lib/plan/form";
import { displayWording } from "~/lib/plan/wording";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import type { EngineRow } from "~/models/engine.server";
import { planParts } from "~/models/plan.server";

/** Estimate (and optionally a suggestion) for plan values that may not be saved yet. */
export async function previewPlan(
  teamId: number,
  engine: EngineRow,
  plan: PlanWrite,
  withSuggestion: boolean,
  units: UnitSystem = "metric",
): Promise<{ view: EstimateView | null; suggestion: Suggestion | null; problems: string[] }> {
  const parts = await planParts(teamId, engine, plan);
  if (!parts) return { view: null, suggestion: null, problems: ["Pick a gasket and fastener from this shop's library."] };
  const misfit = gasketFitProblem(engine.boreMm, parts.gasket.boreMm, (mm) => formatQuantity(mm, "length", units));
  if (misfit) return { view: null, suggestion: null, problems: [misfit] };
  const parsed = parsePlan(assemblePlanInput(parts));
  if (!parsed.ok) return { view: null, suggestion: null, problems: parsed.errors.map((e) => e.message) };
  return {
    view: estimateView(parsed.plan, displayWording(units)),
    suggestion: withSuggestion ? suggest(parsed.plan, { targetMargin: plan.targetMargin, wording: displayWording(units) }) : null,
    problems: [],
  };
}
