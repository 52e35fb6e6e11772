// The editor's in-browser evaluation, in a module of its own so the page loads it after the first paint
// (a dynamic import), not with the page's initial JavaScript.
import { PlanInputSchema, prepare, type PlanInput, type PlanInputRaw } from "../clamp";
import { evaluatePrepared } from "../clamp/evaluate";
import type { Prepared } from "../clamp/model";
import type { EstimateView } from "./estimate-view";
import { preloadForStretchN } from "./stretch";
import { displayWording } from "./wording";
import type { UnitSystem } from "../units";

/** The input as the model takes it, or null where the schema refuses it (the server words why). */
export function validPlanInput(raw: PlanInputRaw): PlanInput | null {
  const parsed = PlanInputSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
}

export { stretchLine, studStiffnessFor, withStretchTarget } from "./stretch";
// the form's schema (and zod) come with this module, after the first paint, not with the page
export { parsePlanForm } from "./form";

/** The view with the immediate figures of a new evaluation and the slow parts (sweep, scatter run) of an earlier one. */
export function withEvaluation(slow: EstimateView, input: PlanInput, units: UnitSystem): EstimateView {
  return withPrepared(slow, prepare(input), input, units);
}

function withPrepared(slow: EstimateView, p: Prepared, input: PlanInput, units: UnitSystem): EstimateView {
  const estimate = evaluatePrepared(p, undefined, displayWording(units));
  return { ...slow, torqueNm: estimate.tightening.torqueNm, estimate, ceiling: estimate.ceiling, targetMargin: input.targetMargin };
}

export interface LiveFigures {
  /** The validated input (null where the schema refuses it: the server then words why). */
  input: PlanInput | null;
  /** What was validated: the torque input, or it with a stretch target turned into a preload. */
  raw: PlanInputRaw;
  stiffnessNPerMm: number | null;
  /** The new immediate figures on the earlier slow parts (null without an earlier view or a valid input). */
  view: EstimateView | null;
}

/**
 * One keystroke's figures with one validation and one prepare (two of each where a stretch target
 * becomes a preload): the stud stiffness, the stretch target's preload and the evaluation share them.
 * As studStiffnessFor, withStretchTarget and withEvaluation one after the other, with less work.
 */
export function liveFigures(
  torqueInput: PlanInputRaw,
  targetStretchMm: number | null,
  slow: EstimateView | null,
  units: UnitSystem,
): LiveFigures {
  const first = PlanInputSchema.safeParse(torqueInput);
  if (!first.success) return { input: null, raw: torqueInput, stiffnessNPerMm: null, view: null };
  let input = first.data;
  let p = prepare(input);
  const k = p.stud.stiffnessNPerMm;
  const stiffnessNPerMm = Number.isFinite(k) && k > 0 ? k : null;
  let raw = torqueInput;
  // the stud's stiffness does not depend on the target: the torque input's prepare gives it
  if (targetStretchMm !== null && stiffnessNPerMm !== null) {
    raw = {
      ...torqueInput,
      tightening: {
        ...torqueInput.tightening,
        target: { mode: "preload", preloadN: preloadForStretchN(targetStretchMm, stiffnessNPerMm) },
      },
    };
    const second = PlanInputSchema.safeParse(raw);
    if (!second.success) return { input: null, raw, stiffnessNPerMm, view: null };
    input = second.data;
    p = prepare(input);
  }
  return { input, raw, stiffnessNPerMm, view: slow ? withPrepared(slow, p, input, units) : null };
}
