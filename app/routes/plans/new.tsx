import { getFormProps, useForm } from "@conform-to/react";
import { data, Form } from "react-router";
import type { Route } from "./+types/new";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { REFUSAL_TITLE, RoleRefusal } from "~/components/refusal";
import { Button, ErrorSummary, FormError } from "~/components/form";
import { MakerTorque } from "~/components/maker-torque";
import { firstErrors, PlanFields, useSeededState } from "~/components/plan-form";
import { gasketsByFit } from "~/lib/plan/assemble";
import { planFormValues, startingPlan, type PlanFormValues, type PlanWrite } from "~/lib/plan/form-fields";
import { formatQuantity, parseQuantity, unitFor } from "~/lib/units";
import { decimalPoint } from "~/lib/units/decimal-comma";
import { LearnedFrictionOffer } from "~/components/learned-friction";
import { learnedFrictions } from "~/models/assembly-readings.server";
import { requireEngine } from "~/models/engine.server";
import { estimatePlan, planStretch } from "~/models/plan-estimate.server";
import { createPlan, listPlans, planChoices } from "~/models/plan.server";
import { requireRole } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { planFormStep, refuseEstimate, type PlanReply } from "~/utils/plan-form.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = ({ error }) => [{ title: error ? REFUSAL_TITLE : "New seal plan · Sealwright" }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const [choices, plans] = await Promise.all([planChoices(team.id), listPlans(team.id, engine.id)]);
  // Start from the chosen plan (or the latest), so a new plan differs only where the builder changes it.
  const template = plans.find((p) => p.id === engine.chosenPlanId) ?? plans[plans.length - 1];
  // Without a plan to start from: the first fastener with the maker's figures, and the gasket whose bore fits most closely.
  const fastener = choices.fasteners.find((f) => f.id === template?.fastenerId) ?? choices.fasteners[0];
  const { fitting } = gasketsByFit(choices.gaskets, engine.boreMm);
  const gasket = choices.gaskets.find((g) => g.id === template?.gasketId) ?? fitting[0] ?? choices.gaskets[0];
  const plan: PlanWrite = template ? { ...template, name: "", notes: "" } : startingPlan(fastener, gasket, user.units);
  // planned by stretch gauge: the maker's stretch figure is the starting target
  if (plan.method === "stretch-measured" && plan.targetStretchMm == null) plan.targetStretchMm = fastener?.makerStretchMm ?? null;
  return {
    units: user.units,
    engine,
    choices,
    values: planFormValues(plan, user.units),
    stretch: await planStretch(team.id, engine, plan),
    emptyLibrary: !fastener || !gasket,
    // the shop's own friction, where three or more assemblies teach one: offered, never applied
    learned: (await learnedFrictions(team.id)).flatMap((l) =>
      l.learned.ok
        ? [
            {
              fastenerId: l.fastenerId,
              lubricant: l.lubricant,
              friction: l.learned.friction,
              spread: l.learned.frictionSpread,
              count: l.learned.count,
              shift: l.shift,
            },
          ]
        : [],
    ),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const formData = await request.formData();
  const intent = readIntent(formData, ["create", "show-all-gaskets"], "create");
  // the stretch line beside the torque, for the figures the answer shows
  const answer = async (status: number, result: PlanReply, shown: PlanWrite | null, note: string | null = null) =>
    data({ result, note, stretch: shown ? await planStretch(team.id, engine, shown) : null }, { status });
  // Without JavaScript: every gasket offered, or a changed fastener whose figures are still the old
  // stud's, answered with the new maker's figures first; nothing is created.
  const step = planFormStep(formData, user.units, intent === "show-all-gaskets", (await planChoices(team.id)).fasteners);
  if (step.changed) return answer(200, step.submission.reply(), step.plan, step.note);
  const { submission } = step;
  if (submission.status !== "success") return answer(submission.status === "error" ? 400 : 200, submission.reply(), null);
  const plan = submission.value;
  const estimate = await estimatePlan(team.id, engine, plan, { units: user.units });
  if (!estimate.ok) return answer(400, refuseEstimate(submission, estimate, engine, user.units), plan);
  const id = await createPlan(team.id, user.id, engine.id, plan);
  return redirectWithToast(request, `/engines/${engine.id}/plans/${id}`, "Plan created.");
}

export default function NewPlan({ loaderData, actionData }: Route.ComponentProps) {
  const { units, engine, choices, emptyLibrary } = loaderData;
  // One form per engine's page; it stays mounted across answers (what was typed, and focus, stay put).
  // The id names the engine: moving to another engine's new plan re-seeds it from that engine's loader.
  const [form, fields] = useForm<PlanFormValues>({
    id: `new-plan-${engine.id}`,
    defaultValue: loaderData.values,
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const errors = firstErrors(form.allErrors);
  // the maker's-torque box follows the fastener picked and the torque typed
  const [fastenerId, setFastenerId] = useSeededState(String(fields.fastenerId.initialValue ?? ""), form.id);
  const [torqueText, setTorqueText] = useSeededState(String(fields.torque.initialValue ?? ""), form.id);
  const fastener = choices.fasteners.find((f) => String(f.id) === fastenerId);
  const torque = parseQuantity(decimalPoint(torqueText), "torque", unitFor("torque", units));
  const problems = form.errors ?? [];
  return (
    <div className="max-w-xl">
      <h2 className="mb-4 text-2xl font-bold">New seal plan</h2>
      {emptyLibrary ? <FormError message="Add at least one fastener and one gasket in Libraries first." /> : null}
      <ErrorSummary
        errors={form.allErrors}
        message={problems.length ? `Nothing was saved: the estimate cannot run. ${problems.join(" ")}` : null}
        answer={actionData?.result}
      />
      {fastener ? (
        <div className="mb-4">
          <MakerTorque
            ourTorqueNm={torque.ok ? torque.valueSi : 0}
            makerTorqueNm={fastener.makerTorqueNm}
            makerLubricant={fastener.makerLubricant}
            makerStages={fastener.makerStages}
            units={units}
          />
          <LearnedFrictionOffer learned={loaderData.learned.filter((l) => l.fastenerId === fastener.id)} units={units} />
        </div>
      ) : null}
      <Form
        method="post"
        className="space-y-4"
        {...getFormProps(form, { ariaAttributes: false })}
        onChange={(e) => {
          const t = e.target as unknown as HTMLInputElement;
          if (t.name === fields.torque.name) setTorqueText(t.value);
          if (t.name === fields.fastenerId.name) setFastenerId(t.value);
        }}
      >
        <PlanFields
          fields={fields}
          seed={form.id}
          errors={errors}
          choices={choices}
          units={units}
          sleeved={engine.sleeveKind !== "none"}
          engineProtrusion={formatQuantity(engine.sleeveProtrusionMm, "smallLength", units)}
          engineBoreMm={engine.boreMm}
          note={actionData?.note}
          stretch={actionData ? actionData.stretch : loaderData.stretch}
          onFiguresFollowed={(followed) => {
            setFastenerId(followed.fastenerId ?? "");
            setTorqueText(followed.torque ?? "");
          }}
        />
        <Button type="submit" name="intent" value="create">
          Create plan
        </Button>
      </Form>
      <Caution className="mt-6" />
    </div>
  );
}

// Inside the engine layout: a viewer who types this address reads why, with the engine's tabs still there.
export function ErrorBoundary({ error, params }: Route.ErrorBoundaryProps) {
  return (
    <RoleRefusal
      error={error}
      who="A builder or the owner makes seal plans."
      backTo={`/engines/${params.engineId}/plans`}
      backLabel="Back to the seal plans"
    />
  );
}
