import { getFormProps, useForm } from "@conform-to/react";
import { useEffect, type KeyboardEvent } from "react";
import { data, Form, Link, useNavigation } from "react-router";
import type { Route } from "./+types/editor";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { EstimatePanel, STATUS_LOOK, VerdictLine } from "~/components/estimate-panel";
import { Button, ErrorSummary, FormError } from "~/components/form";
import { MakerTorque } from "~/components/maker-torque";
import { firstErrors, initialValues, PlanFields } from "~/components/plan-form";
import { PlanPrintSheet } from "~/components/plan-print";
import { SuggestionBox } from "~/components/suggestion-box";
import { useLiveEstimate } from "~/components/use-live-estimate";
import type { Suggestion } from "~/lib/clamp";
import { plannedByStretch } from "~/lib/plan/assemble";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { scaledWrenchStages } from "~/lib/plan/fastener-figures";
import { planFormValues, readSuggestedFigures, type PlanFormValues, type PlanWrite } from "~/lib/plan/form-fields";
import { stretchLine, type StretchLine } from "~/lib/plan/stretch";
import { formatQuantity } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { estimatePlan, planStretch, type PlanEstimateResult } from "~/models/plan-estimate.server";
import { archivePlan, choosePlan, createPlan, engineMaterials, planChoices, requirePlan, updatePlan } from "~/models/plan.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { cachedPage } from "~/utils/page-cache.server";
import { planFormStep, refuseChangedEstimate, refuseEstimate, replyForStored, type PlanReply } from "~/utils/plan-form.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.plan.name ?? "Seal plan"} · Sealwright` }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

// the rendered page is kept per person and per version of the shop's data (utils/page-cache.server.ts)
export const middleware: Route.MiddlewareFunction[] = [cachedPage];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const [choices, materials, result] = await Promise.all([
    planChoices(team.id),
    engineMaterials(team.id, engine),
    estimatePlan(team.id, engine, plan, { units: user.units }),
  ]);
  // the stretch line from the estimate's own preload, torque and stud stiffness (no second evaluation);
  // only where the plan cannot be estimated is it worked out apart
  const stretch = result.ok
    ? stretchLine(
        plannedByStretch(plan) ? "stretch" : "torque",
        result.view.estimate.tightening.preload.nominalN,
        result.view.estimate.tightening.torqueNm,
        result.view.estimate.stiffness.studNPerMm,
      )
    : await planStretch(team.id, engine, plan);
  return {
    stretch,
    units: user.units,
    canEdit: roleAtLeast(role, "builder"),
    engine,
    materials,
    plan,
    values: planFormValues(plan, user.units),
    choices,
    result,
    chosen: engine.chosenPlanId === plan.id,
  };
}

// The buttons this page's forms post (the suggestion box's too); anything else is a 400.
const EDITOR_INTENTS = ["save", "estimate", "suggest", "choose", "archive", "apply-torque", "new-with-torque", "show-all-gaskets"] as const;

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const formData = await request.formData();
  const intent = readIntent(formData, EDITOR_INTENTS, "save");
  const base = `/engines/${engine.id}/plans`;

  if (intent === "choose") {
    await choosePlan(team.id, user.id, engine.id, plan.id);
    return redirectWithToast(request, `${base}/${plan.id}`, `“${plan.name}” is now the chosen plan.`);
  }
  if (intent === "archive") {
    await archivePlan(team.id, user.id, engine.id, plan.id);
    return redirectWithToast(request, base, `“${plan.name}” archived.`);
  }

  const answer = (
    status: number,
    result: PlanReply,
    extra: {
      note?: string | null;
      preview?: EstimateView | null;
      suggestion?: Suggestion | null;
      stretch?: StretchLine | null;
      /** Why the estimate cannot run, for the estimate's column (the reply files them beside the fields too). */
      problems?: string[];
    } = {},
  ) => data({ result, note: null, preview: null, suggestion: null, stretch: null, problems: [] as string[], ...extra }, { status });

  if (intent === "apply-torque" || intent === "new-with-torque") {
    const figures = readSuggestedFigures(Object.fromEntries(formData), plan.sleeveProtrusionMm);
    if (!figures.ok) {
      // the suggestion box's own post: the plan form shows the stored plan, the message under its torque
      return answer(400, replyForStored(planFormValues(plan, user.units), user.units, { torque: [figures.message] }));
    }
    const { torqueNm, protrusionMm: protrusion } = figures;
    const next: PlanWrite = {
      ...plan,
      torqueNm,
      stagesNm: scaledWrenchStages(plan.stagesNm, plan.torqueNm, torqueNm, user.units),
      sleeveProtrusionMm: protrusion,
    };
    // planned by stretch: the suggested torque becomes the stretch it gives, or the suggestion would change nothing
    if (plannedByStretch(plan))
      next.targetStretchMm = await stretchAtTorque(team.id, engine, { ...next, method: "torque-estimated-friction" });
    if (intent === "apply-torque") {
      await updatePlan(team.id, user.id, engine.id, plan.id, next);
      return redirectWithToast(request, `${base}/${plan.id}`, "Suggested figures applied to this plan.");
    }
    const id = await createPlan(team.id, user.id, engine.id, { ...next, name: `${plan.name} (suggested)`.slice(0, 120) });
    return redirectWithToast(request, `${base}/${id}`, "New plan made from the suggestion.");
  }

  const step = planFormStep(formData, user.units, intent === "show-all-gaskets", (await planChoices(team.id)).fasteners);
  if (intent === "show-all-gaskets" && step.changed) return answer(200, step.submission.reply());
  let shown: PlanWrite;
  let result: () => PlanReply;
  let refuse: (estimate: Extract<PlanEstimateResult, { ok: false }>) => PlanReply;
  let note: string | null = null;
  if (step.changed) {
    // Without JavaScript: the fastener changed but its figures are still the old stud's. Show the new
    // maker's figures (and their estimate) and save nothing until the builder has seen them.
    note = step.note;
    if (!step.plan) return answer(200, step.submission.reply(), { note });
    shown = step.plan;
    result = () => step.submission.reply();
    refuse = (estimate) => refuseChangedEstimate(formData, step, estimate, engine, user.units);
  } else {
    const { submission } = step;
    if (submission.status !== "success") return answer(submission.status === "error" ? 400 : 200, submission.reply());
    shown = submission.value;
    result = () => submission.reply();
    refuse = (estimate) => refuseEstimate(submission, estimate, engine, user.units);
    if (intent === "save") {
      const estimate = await estimatePlan(team.id, engine, shown, { units: user.units });
      if (!estimate.ok) return answer(400, refuse(estimate), { problems: estimate.problems });
      await updatePlan(team.id, user.id, engine.id, plan.id, shown);
      return redirectWithToast(request, `${base}/${plan.id}`, "Plan saved.");
    }
  }
  // "estimate" and "suggest" (and a save held back above): compute for the values shown; nothing is written.
  const out = await estimatePlan(team.id, engine, shown, { units: user.units, withSuggestion: intent === "suggest" });
  if (!out.ok) return answer(400, refuse(out), { note, problems: out.problems });
  return answer(200, result(), { note, preview: out.view, suggestion: out.suggestion, stretch: await planStretch(team.id, engine, shown) });
}

/** The stud stretch (mm) a torque-planned version of the plan gives, or null when it cannot be estimated. */
async function stretchAtTorque(teamId: number, engine: Awaited<ReturnType<typeof requireEngine>>, plan: PlanWrite): Promise<number | null> {
  const line = await planStretch(teamId, engine, plan);
  return line ? Number(line.stretchMm.toFixed(4)) : null;
}

export default function PlanEditor({ loaderData, actionData }: Route.ComponentProps) {
  const { units, canEdit, engine, materials, plan, choices, result, chosen } = loaderData;
  // One form, mounted for as long as the page is: an answer (a refusal, a recalculation) leaves what was
  // typed, and focus, where they are. The id is Conform's way to re-seed it: it names the stored plan
  // and when it was last written, so only a save or an applied suggestion (the loader's plan changed)
  // resets the fields to the stored values. Not a React key: nothing is remounted.
  const [form, fields] = useForm<PlanFormValues>({
    id: `plan-${plan.id}-${String(plan.updatedAt).replace(/\W/g, "")}`,
    defaultValue: loaderData.values,
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const values = initialValues(fields);
  const serverErrors = firstErrors(form.allErrors);
  const refused = Object.keys(form.allErrors).length > 0;
  const busy = useNavigation().state !== "idle";
  const live = useLiveEstimate(loaderData, result.ok ? result.view : null);
  const view: EstimateView | null = live.view ?? actionData?.preview ?? (result.ok ? result.view : null);
  const problems = live.problems ?? (actionData?.problems?.length ? actionData.problems : result.ok ? [] : result.problems);
  const suggestion = (actionData?.suggestion ?? null) as Suggestion | null;
  const fastener =
    choices.fasteners.find((f) => String(f.id) === (live.fastenerId ?? values.fastenerId)) ??
    (result.fastener as (typeof choices.fasteners)[number] | null);
  const sleeved = engine.sleeveKind !== "none" && materials.sleeve !== null;
  const torqueNm = view?.torqueNm ?? plan.torqueNm;
  // a refused save or recalculation that brought no estimate back: what shows is the stored plan's
  const refusedWithoutPreview = Boolean(actionData && refused && !actionData.preview);
  const refusedProblems = form.errors?.length ? `Nothing was saved: the estimate cannot run. ${form.errors.join(" ")}` : null;
  // After a successful Recalculate or Suggest, focus goes to what it answered (a refusal focuses its summary).
  useEffect(() => {
    if (!actionData?.preview || Object.keys(actionData.result.error ?? {}).length > 0) return;
    document.getElementById(actionData.suggestion ? "suggest-title" : "estimate-title")?.focus();
  }, [actionData]);

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <div>
        {view ? (
          // On a phone the estimate is far below the form: keep the verdict in sight while typing.
          <p
            className={`print-hide sticky top-0 z-10 mb-3 rounded border-2 px-3 py-2 text-sm shadow lg:hidden ${STATUS_LOOK[view.estimate.verdict.status].tone}`}
            data-testid="verdict-bar"
          >
            <VerdictLine view={view} />{" "}
            <a href="#estimate-title" className="underline">
              Estimate ↓
            </a>
          </p>
        ) : null}
        <div className="mb-3 flex flex-wrap items-center gap-2">
          <h2 className="text-2xl font-bold">{plan.name}</h2>
          {chosen ? (
            <span className="rounded border border-held bg-held-50 px-2 py-0.5 text-sm font-bold text-held">✔ Chosen plan</span>
          ) : null}
        </div>
        <PlanPrintSheet
          values={values}
          gasketName={choices.gaskets.find((g) => String(g.id) === values.gasketId)?.name ?? ""}
          fastenerName={fastener?.name ?? ""}
          sleeved={sleeved}
          units={units}
        />
        <ErrorSummary errors={form.allErrors} message={refusedProblems} answer={actionData?.result} />
        <Form
          method="post"
          {...getFormProps(form, { ariaAttributes: false })}
          onChange={live.onChange}
          onKeyDown={enterRecalculates}
          ref={live.formRef}
          className="print-hide space-y-4"
        >
          <fieldset disabled={!canEdit} className="space-y-4">
            <legend className="sr-only">Plan inputs</legend>
            <PlanFields
              fields={fields}
              seed={form.id}
              // the answer's messages until the next answer; otherwise those of the live estimate
              errors={refused ? serverErrors : (live.errors ?? {})}
              choices={choices}
              units={units}
              sleeved={sleeved}
              engineProtrusion={formatQuantity(engine.sleeveProtrusionMm, "smallLength", units)}
              engineBoreMm={engine.boreMm}
              note={actionData?.note}
              stretch={live.stretch ?? (actionData ? actionData.stretch : loaderData.stretch)}
            />
          </fieldset>
          {canEdit ? (
            <div className="flex flex-wrap gap-2">
              {/* Recalculate first: the button Enter presses is the harmless one, not Save */}
              <Button type="submit" name="intent" value="estimate" kind="plain" disabled={busy}>
                Recalculate
              </Button>
              <Button type="submit" name="intent" value="save" disabled={busy}>
                Save plan
              </Button>
              <Button type="submit" name="intent" value="suggest" kind="plain" disabled={busy}>
                Suggest torque for the target
              </Button>
            </div>
          ) : (
            <p className="text-sm text-forge-700">You can read this plan; builders and owners edit it.</p>
          )}
        </Form>
        {canEdit ? (
          <div className="print-hide mt-4 flex flex-wrap gap-2 border-t border-forge-100 pt-4">
            {!chosen ? (
              <Form method="post">
                <Button type="submit" name="intent" value="choose" kind="plain">
                  Mark as chosen
                </Button>
              </Form>
            ) : null}
            <Form method="post">
              <Button type="submit" name="intent" value="archive" kind="plain">
                Archive plan
              </Button>
            </Form>
            <Link to={`/engines/${engine.id}/compare`} className="rounded border border-forge-300 bg-white px-4 py-2 font-medium">
              Compare plans
            </Link>
            <Link
              to={`/engines/${engine.id}/plans/${plan.id}/copy`}
              className="rounded border border-forge-300 bg-white px-4 py-2 font-medium"
            >
              Copy to another engine
            </Link>
          </div>
        ) : null}
      </div>
      <div className="space-y-4">
        <MakerTorque
          ourTorqueNm={torqueNm}
          makerTorqueNm={fastener?.makerTorqueNm ?? null}
          makerLubricant={fastener?.makerLubricant ?? null}
          makerStages={fastener?.makerStages}
          units={units}
        />
        {suggestion ? <SuggestionBox suggestion={suggestion} units={units} canEdit={canEdit} /> : null}
        <Caution />
        {problems.length > 0 ? <FormError message={`The estimate cannot run: ${problems.join(" ")}`} /> : null}
        {/* after a refusal, the builder's next keystroke brings a live estimate of what is typed: no notice then */}
        {live.stale || (refusedWithoutPreview && !live.view) ? (
          <p
            role="status"
            className="rounded border border-caution bg-caution-50 px-3 py-2 text-sm font-medium"
            data-testid="estimate-stale"
          >
            {refusedWithoutPreview && !live.view
              ? "⚠ Nothing was saved, and the estimate below is still the saved plan's, not these figures: fix the marked fields, then Recalculate."
              : "⚠ The estimate below is for the last inputs that made sense; fix the marked fields to update it."}
          </p>
        ) : null}
        {view ? (
          <EstimatePanel view={view} units={units} targetMargin={Number(values.targetMargin) || plan.targetMargin} busy={live.busy} />
        ) : null}
      </div>
    </div>
  );
}

/** Enter in a plan field recalculates (the browser's default would press the first submit button in the form). */
function enterRecalculates(e: KeyboardEvent<HTMLFormElement>) {
  const field = e.target as HTMLElement;
  if (e.key !== "Enter" || !(field instanceof HTMLInputElement) || field.type === "submit") return;
  e.preventDefault();
  e.currentTarget.querySelector<HTMLButtonElement>('button[value="estimate"]')?.click();
}
