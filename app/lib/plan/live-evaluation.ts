// The editor's in-browser evaluation, in a module of its own so the page loads it after the first paint
// (a dynamic import), not with the page's initial JavaScript.
import { PlanInputSchema, type PlanInput, type PlanInputRaw } from "../clamp";
import { evaluatePlan } from "../clamp/evaluate";
import type { EstimateView } from "./estimate-view";
import { displayWording } from "./wording";
import type { UnitSystem } from "../units";

/** The input as the model takes it, or null where the schema refuses it (the server words why). */
export function validPlanInput(raw: PlanInputRaw): PlanInput | null {
  const parsed = PlanInputSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

export { stretchLine, studStiffnessFor } from "./stretch";

/** The view with the immediate figures of a new evaluation and the slow parts (sweep, scatter run) of an earlier one. */
export function withEvaluation(slow: EstimateView, input: PlanInput, units: UnitSystem): EstimateView {
  const estimate = evaluatePlan(input, displayWording(units));
  return { ...slow, torqueNm: estimate.tightening.torqueNm, estimate, ceiling: estimate.ceiling, targetMargin: input.targetMargin };
}
