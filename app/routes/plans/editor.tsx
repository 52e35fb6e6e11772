import { useEffect, useMemo, useRef, useState } from "react";
import { data, Form, Link, redirect, useFetcher, useNavigation } from "react-router";
import type { Route } from "./+types/editor";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { EstimatePanel, STATUS_LOOK, VerdictLine } from "~/components/estimate-panel";
import { Button, FormError } from "~/components/form";
import { MakerTorque } from "~/components/maker-torque";
import { PlanFields } from "~/components/plan-form";
import { SuggestionBox } from "~/components/suggestion-box";
import type { Suggestion } from "~/lib/clamp";
import { assemblePlanInput, gasketFitProblem, plannedByStretch } from "~/lib/plan/assemble";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { figuresFollowStep, scaledWrenchStages } from "~/lib/plan/fastener-figures";
import { parsePlanForm, planFormValues, type PlanWrite } from "~/lib/plan/form";
import { stretchLine, studStiffnessFor, type StretchLine } from "~/lib/plan/stretch";
import { formatQuantity } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { estimatePlan, planStretch } from "~/models/plan-estimate.server";
import { archivePlan, choosePlan, createPlan, engineMaterials, planChoices, requirePlan, updatePlan } from "~/models/plan.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { flashToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.plan.name ?? "Seal plan"} · Sealwright` }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role } = await requireUser(request);
  const engine = await requireEngine(team.id, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const [choices, materials, result, stretch] = await Promise.all([
    planChoices(team.id),
    engineMaterials(team.id, engine),
    estimatePlan(team.id, engine, plan, { units: user.units }),
    planStretch(team.id, engine, plan),
  ]);
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

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const engine = await requireEngine(team.id, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const form = Object.fromEntries(await request.formData());
  const intent = String(form.intent ?? "save");
  const base = `/engines/${engine.id}/plans`;
  const toast = async (message: string) => ({ "Set-Cookie": await flashToast(request, { kind: "done", message }) });

  if (intent === "choose") {
    await choosePlan(team.id, user.id, engine.id, plan.id);
    return redirect(`${base}/${plan.id}`, { headers: await toast(`“${plan.name}” is now the chosen plan.`) });
  }
  if (intent === "archive") {
    await archivePlan(team.id, user.id, engine.id, plan.id);
    return redirect(base, { headers: await toast(`“${plan.name}” archived.`) });
  }
  if (intent === "apply-torque" || intent === "new-with-torque") {
    const torqueNm = Number(form.torqueNm);
    const protrusion = form.protrusionMm === undefined || form.protrusionMm === "" ? plan.sleeveProtrusionMm : Number(form.protrusionMm);
    if (!(torqueNm > 0 && torqueNm <= 5000) || (protrusion !== null && !(protrusion >= -0.5 && protrusion <= 1))) {
      return data(
        { errors: { torque: "The suggested figures are out of range." }, values: planFormValues(plan, user.units), note: null, preview: null, suggestion: null, problems: [] as string[], stretch: null },
        { status: 400 },
      );
    }
    const next: PlanWrite = { ...plan, torqueNm, stagesNm: scaledWrenchStages(plan.stagesNm, plan.torqueNm, torqueNm, user.units), sleeveProtrusionMm: protrusion };
    // planned by stretch: the suggested torque becomes the stretch it gives, or the suggestion would change nothing
    if (plannedByStretch(plan)) next.targetStretchMm = await stretchAtTorque(team.id, engine, { ...next, method: "torque-estimated-friction" });
    if (intent === "apply-torque") {
      await updatePlan(team.id, user.id, engine.id, plan.id, next);
      return redirect(`${base}/${plan.id}`, { headers: await toast("Suggested figures applied to this plan.") });
    }
    const id = await createPlan(team.id, user.id, engine.id, { ...next, name: `${plan.name} (suggested)`.slice(0, 120) });
    return redirect(`${base}/${id}`, { headers: await toast("New plan made from the suggestion.") });
  }

  let values = Object.fromEntries(Object.entries(form).map(([k, v]) => [k, String(v)]));
  let note: string | null = null;
  const answer = (status: number, extra: { errors?: Record<string, string>; preview?: EstimateView | null; suggestion?: Suggestion | null; problems?: string[]; stretch?: StretchLine | null } = {}) =>
    data({ errors: {}, values, note, preview: null, suggestion: null, problems: [] as string[], stretch: null, ...extra }, { status });
  if (intent === "show-all-gaskets") {
    values = { ...values, showAllGaskets: "1" };
    return answer(200);
  }
  // Without JavaScript: the fastener changed but its figures are still the old stud's. Show the new
  // maker's figures (and their estimate) and save nothing until the builder has seen them.
  const followed = figuresFollowStep(values, (await planChoices(team.id)).fasteners, user.units);
  if (followed) {
    values = followed.values;
    note = followed.note;
  }
  const parsed = parsePlanForm(values, user.units);
  if (!parsed.ok) return answer(followed ? 200 : 400, { errors: followed ? {} : parsed.errors });
  if (intent === "save" && !followed) {
    const estimate = await estimatePlan(team.id, engine, parsed.plan, { units: user.units });
    if (!estimate.ok) return answer(400, { problems: estimate.problems });
    await updatePlan(team.id, user.id, engine.id, plan.id, parsed.plan);
    return redirect(`${base}/${plan.id}`, { headers: await toast("Plan saved.") });
  }
  // "estimate" and "suggest" (and a save held back above): compute for the values shown; nothing is written.
  const out = await estimatePlan(team.id, engine, parsed.plan, { units: user.units, withSuggestion: intent === "suggest" });
  if (!out.ok) return answer(400, { problems: out.problems });
  return answer(200, { preview: out.view, suggestion: out.suggestion, stretch: await planStretch(team.id, engine, parsed.plan) });
}

/** The stud stretch (mm) a torque-planned version of the plan gives, or null when it cannot be estimated. */
async function stretchAtTorque(teamId: number, engine: Awaited<ReturnType<typeof requireEngine>>, plan: PlanWrite): Promise<number | null> {
  const line = await planStretch(teamId, engine, plan);
  return line ? Number(line.stretchMm.toFixed(4)) : null;
}

type ApiAnswer = EstimateView | { error: string; errors?: { path: string; message: string }[] };

export default function PlanEditor({ loaderData, actionData }: Route.ComponentProps) {
  const { units, canEdit, engine, materials, plan, choices, result, chosen } = loaderData;
  const values = actionData?.values ?? loaderData.values;
  const busy = useNavigation().state !== "idle";
  const live = useLiveEstimate(loaderData);
  const view: EstimateView | null = live.view ?? actionData?.preview ?? (result.ok ? result.view : null);
  const problems = live.problems ?? (actionData?.problems?.length ? actionData.problems : result.ok ? [] : result.problems);
  const suggestion = (actionData?.suggestion ?? null) as Suggestion | null;
  const fastener = choices.fasteners.find((f) => String(f.id) === (live.fastenerId ?? values.fastenerId)) ?? (result.fastener as (typeof choices.fasteners)[number] | null);
  const sleeved = engine.sleeveKind !== "none" && materials.sleeve !== null;
  const torqueNm = view?.torqueNm ?? plan.torqueNm;
  // a refused save or recalculation that brought no estimate back: what shows is the stored plan's
  const refusedWithoutPreview = Boolean(actionData && Object.keys(actionData.errors ?? {}).length > 0 && !actionData.preview);

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <div>
        {view ? (
          // On a phone the estimate is far below the form: keep the verdict in sight while typing.
          <p
            className={`sticky top-0 z-10 mb-3 rounded border-2 px-3 py-2 text-sm shadow lg:hidden ${STATUS_LOOK[view.estimate.verdict.status].tone}`}
            data-testid="verdict-bar"
          >
            <VerdictLine view={view} /> <a href="#estimate-title" className="underline">Estimate ↓</a>
          </p>
        ) : null}
        <div className="mb-3 flex flex-wrap items-center gap-2">
          <h2 className="text-2xl font-bold">{plan.name}</h2>
          {chosen ? <span className="rounded border border-held bg-held-50 px-2 py-0.5 text-sm font-bold text-held">✔ Chosen plan</span> : null}
        </div>
        <Form method="post" key={JSON.stringify(values)} onChange={live.onChange} ref={live.formRef} className="space-y-4" noValidate>
          <fieldset disabled={!canEdit} className="space-y-4">
            <legend className="sr-only">Plan inputs</legend>
            <PlanFields
              values={values}
              errors={actionData?.errors ?? live.errors ?? {}}
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
              <Button type="submit" name="intent" value="save" disabled={busy}>
                Save plan
              </Button>
              <Button type="submit" name="intent" value="estimate" kind="plain" disabled={busy}>
                Recalculate
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
          <div className="mt-4 flex flex-wrap gap-2 border-t border-forge-100 pt-4">
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
            <Link to={`/engines/${engine.id}/plans/${plan.id}/copy`} className="rounded border border-forge-300 bg-white px-4 py-2 font-medium">
              Copy to another engine
            </Link>
          </div>
        ) : null}
      </div>
      <div className="space-y-4">
        <MakerTorque ourTorqueNm={torqueNm} makerTorqueNm={fastener?.makerTorqueNm ?? null} makerLubricant={fastener?.makerLubricant ?? null} makerStages={fastener?.makerStages} units={units} />
        {suggestion ? <SuggestionBox suggestion={suggestion} units={units} canEdit={canEdit} /> : null}
        <Caution />
        {problems.length > 0 ? <FormError message={`The estimate cannot run: ${problems.join(" ")}`} /> : null}
        {live.stale || refusedWithoutPreview ? (
          <p role="status" className="rounded border border-caution bg-caution-50 px-3 py-2 text-sm font-medium" data-testid="estimate-stale">
            {refusedWithoutPreview && !live.view
              ? "⚠ Nothing was saved, and the estimate below is still the saved plan's, not these figures: fix the marked fields, then Recalculate."
              : "⚠ The estimate below is for the last inputs that made sense; fix the marked fields to update it."}
          </p>
        ) : null}
        {view ? <EstimatePanel view={view} units={units} targetMargin={Number(values.targetMargin) || plan.targetMargin} busy={live.busy} /> : null}
      </div>
    </div>
  );
}

/** Recomputes through POST /api/v1/estimate as the builder types (debounced); off without JavaScript. */
function useLiveEstimate(d: Route.ComponentProps["loaderData"]) {
  const fetcher = useFetcher<ApiAnswer>();
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const [errors, setErrors] = useState<Record<string, string> | null>(null);
  const [fastenerId, setFastenerId] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  // the stud stiffness and the target of the inputs last sent, to word the stretch beside the torque
  const [stud, setStud] = useState<{ stiffnessNPerMm: number | null; byStretch: boolean } | null>(null);
  useEffect(() => () => clearTimeout(timer.current), []);

  const onChange = () => {
    clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      if (!formRef.current) return;
      const form = Object.fromEntries(new FormData(formRef.current));
      setFastenerId(String(form.fastenerId ?? ""));
      const full = parsePlanForm(form, d.units);
      setErrors(full.ok ? null : full.errors);
      // Stages do not change the estimate, so a half-typed stage list does not hold it back.
      const parsed = full.ok ? full : parsePlanForm({ ...form, stages: "" }, d.units);
      setStale(!parsed.ok);
      if (!parsed.ok) return;
      const fastener = d.choices.fasteners.find((f) => f.id === parsed.plan.fastenerId);
      const gasket = d.choices.gaskets.find((g) => g.id === parsed.plan.gasketId);
      if (!fastener || !gasket || !d.materials.head || !d.materials.block) return;
      const misfit = gasketFitProblem(d.engine.boreMm, gasket.boreMm, (mm) => formatQuantity(mm, "length", d.units));
      if (misfit) {
        setErrors({ ...(full.ok ? {} : full.errors), gasketId: misfit });
        return setStale(true);
      }
      const input = assemblePlanInput({ engine: d.engine, plan: parsed.plan, fastener, gasket, head: d.materials.head, block: d.materials.block, sleeve: d.materials.sleeve });
      setStud({ stiffnessNPerMm: studStiffnessFor(input), byStretch: plannedByStretch(parsed.plan) });
      fetcher.submit({ input, units: d.units } as never, { method: "post", action: "/api/v1/estimate", encType: "application/json" });
    }, 300);
  };

  return useMemo(() => {
    const answer = fetcher.data;
    const view = answer && "estimate" in answer ? answer : null;
    const problems = answer && "error" in answer ? (answer.errors?.map((e) => e.message) ?? [answer.error]) : null;
    const stretch = view && stud ? stretchLine(stud.byStretch ? "stretch" : "torque", view.estimate.tightening.preload.nominalN, view.torqueNm, stud.stiffnessNPerMm) : null;
    return { onChange, formRef, errors, fastenerId, stale, busy: fetcher.state !== "idle", view, problems, stretch };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [fetcher.data, fetcher.state, errors, fastenerId, stale, stud]);
}
