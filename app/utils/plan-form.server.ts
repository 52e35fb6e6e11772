// One post of the seal-plan form, shared by the new-plan page and the editor: the changes only the
// server makes without JavaScript ("Show all gaskets", the figures following a new fastener), each
// answered as a Conform update of the values, and the refusals, each a Conform reply.
import { gasketFitProblem } from "~/lib/plan/assemble";
import { figuresFollowStep, type MakerFigures } from "~/lib/plan/fastener-figures";
import type { PlanWrite } from "~/lib/plan/form-fields";
import { parsePlanForm, planFormSchema } from "~/lib/plan/form";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import type { EngineRow } from "~/models/engine.server";
import type { PlanEstimateResult } from "~/models/plan-estimate.server";
import { parseSubmission } from "./conform.server";

export type PlanSubmission = ReturnType<typeof parseSubmission<ReturnType<typeof planFormSchema>>>;
export type PlanReply = ReturnType<PlanSubmission["reply"]>;

/** The form's fields as posted (text only), without the route's button word or Conform's. */
function postedValues(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of formData) if (k !== "intent" && k !== "__intent__" && typeof v === "string") out[k] = v;
  return out;
}

/**
 * The post answered with `values` in place of what was typed: Conform's update of the whole form, so
 * the page (a fresh one without JavaScript) shows them. `validated` shows the messages of the reply;
 * left out, the form's own messages wait for the next save, as after any change the builder has not seen.
 */
function withValues(formData: FormData, units: UnitSystem, values: Record<string, string>, validated?: boolean): PlanSubmission {
  const out = new FormData();
  for (const [k, v] of formData) if (k !== "intent" && k !== "__intent__") out.append(k, v);
  out.set("__intent__", JSON.stringify({ type: "update", payload: validated ? { value: values, validated } : { value: values } }));
  return parseSubmission(out, planFormSchema(units));
}

export type PlanFormStep =
  /** The server changed the values shown (nothing is saved): answer with `submission`; `plan` is what they say, if it reads. */
  | { changed: true; submission: PlanSubmission; values: Record<string, string>; note: string | null; plan: PlanWrite | null }
  /** The form as typed, parsed (success or refusal). */
  | { changed: false; submission: PlanSubmission };

/**
 * What a post of the plan form asks for. "Show all gaskets" answers the form as typed with every gasket
 * offered. A fastener changed while the torque, stages, lubricant and friction are still the ones shown
 * for the old one answers with the new maker's figures and the line that says so. Otherwise the form is
 * parsed with the schema for the person's units.
 */
export function planFormStep(formData: FormData, units: UnitSystem, showAllGaskets: boolean, fasteners: MakerFigures[]): PlanFormStep {
  const posted = postedValues(formData);
  if (showAllGaskets) {
    const values = { ...posted, showAllGaskets: "1" };
    return { changed: true, submission: withValues(formData, units, values), values, note: null, plan: shownPlan(values, units) };
  }
  const followed = figuresFollowStep(posted, fasteners, units);
  if (followed) {
    const { values, note } = followed;
    return { changed: true, submission: withValues(formData, units, values), values, note, plan: shownPlan(values, units) };
  }
  return { changed: false, submission: parseSubmission(formData, planFormSchema(units)) };
}

function shownPlan(values: Record<string, string>, units: UnitSystem): PlanWrite | null {
  const r = parsePlanForm(values, units);
  return r.ok ? r.plan : null;
}

/**
 * The estimate cannot run for the figures typed: a gasket that does not suit the bore is filed under
 * the gasket, every other problem (the clamp model's own checks) above the form.
 */
export function refuseEstimate(
  submission: PlanSubmission,
  estimate: Extract<PlanEstimateResult, { ok: false }>,
  engine: EngineRow,
  units: UnitSystem,
): PlanReply {
  const misfit = estimate.gasket
    ? gasketFitProblem(engine.boreMm, estimate.gasket.boreMm, (mm) => formatQuantity(mm, "length", units))
    : null;
  const formErrors = estimate.problems.filter((p) => p !== misfit);
  return submission.reply({
    fieldErrors: misfit && estimate.problems.includes(misfit) ? { gasketId: [misfit] } : {},
    formErrors,
  });
}

/** A changed step (the figures followed) whose figures the estimate then refused: the same refusal, on the changed values. */
export function refuseChangedEstimate(
  formData: FormData,
  step: Extract<PlanFormStep, { changed: true }>,
  estimate: Extract<PlanEstimateResult, { ok: false }>,
  engine: EngineRow,
  units: UnitSystem,
): PlanReply {
  return refuseEstimate(withValues(formData, units, step.values, true), estimate, engine, units);
}

/**
 * A reply on the form's behalf to a post that was not the form's (the suggestion box's Apply): the
 * stored plan's values, with `fieldErrors` beside its fields.
 */
export function replyForStored(values: Record<string, string>, units: UnitSystem, fieldErrors: Record<string, string[]>): PlanReply {
  const out = new FormData();
  for (const [k, v] of Object.entries(values)) out.set(k, v);
  return parseSubmission(out, planFormSchema(units)).reply({ fieldErrors });
}
