import { useState } from "react";
import { data, Form } from "react-router";
import type { Route } from "./+types/new";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { REFUSAL_TITLE, RoleRefusal } from "~/components/refusal";
import { Button, ErrorSummary, FormError } from "~/components/form";
import { MakerTorque } from "~/components/maker-torque";
import { PlanFields } from "~/components/plan-form";
import { gasketsByFit } from "~/lib/plan/assemble";
import { figuresFollowStep } from "~/lib/plan/fastener-figures";
import { parsePlanForm, planFormValues, startingPlan, type PlanWrite } from "~/lib/plan/form";
import { formatQuantity, parseQuantity, unitFor } from "~/lib/units";
import { decimalPoint } from "~/lib/units/decimal-comma";
import { LearnedFrictionOffer } from "~/components/learned-friction";
import { learnedFrictions } from "~/models/assembly-readings.server";
import { requireEngine } from "~/models/engine.server";
import { estimatePlan, planStretch } from "~/models/plan-estimate.server";
import { createPlan, listPlans, planChoices } from "~/models/plan.server";
import { requireRole } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
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
  const form = Object.fromEntries(await request.formData());
  const values = Object.fromEntries(Object.entries(form).map(([k, v]) => [k, String(v)]));
  const answer = async (
    status: number,
    extra: { errors?: Record<string, string>; problems?: string[]; note?: string | null; values?: Record<string, string> } = {},
  ) => {
    const shown = parsePlanForm(extra.values ?? values, user.units);
    const stretch = shown.ok ? await planStretch(team.id, engine, shown.plan) : null;
    return data({ errors: {}, problems: [] as string[], note: null as string | null, values, stretch, ...extra }, { status });
  };
  if (readIntent(form, ["create", "show-all-gaskets"], "create") === "show-all-gaskets")
    return answer(200, { values: { ...values, showAllGaskets: "1" } });
  // Without JavaScript: the fastener changed but its figures are still the old stud's; show the new maker's first.
  const choices = await planChoices(team.id);
  const followed = figuresFollowStep(values, choices.fasteners, user.units);
  if (followed) return answer(200, { values: followed.values, note: followed.note });
  const parsed = parsePlanForm(form, user.units);
  if (!parsed.ok) return answer(400, { errors: parsed.errors });
  const estimate = await estimatePlan(team.id, engine, parsed.plan, { units: user.units });
  if (!estimate.ok) return answer(400, { problems: estimate.problems });
  const id = await createPlan(team.id, user.id, engine.id, parsed.plan);
  return redirectWithToast(request, `/engines/${engine.id}/plans/${id}`, "Plan created.");
}

export default function NewPlan({ loaderData, actionData }: Route.ComponentProps) {
  const values = actionData?.values ?? loaderData.values;
  // Stays mounted across answers (focus stays put). With JavaScript a changed fastener and "Show all
  // gaskets" happen in the page; without it every answer is a fresh page with the server's values.
  return <NewPlanForm values={values} loaderData={loaderData} actionData={actionData} />;
}

function NewPlanForm({
  values,
  loaderData,
  actionData,
}: { values: Record<string, string> } & Pick<Route.ComponentProps, "loaderData" | "actionData">) {
  const { units, engine, choices, emptyLibrary } = loaderData;
  const [fastenerId, setFastenerId] = useState(values.fastenerId);
  const [torqueText, setTorqueText] = useState(values.torque ?? "");
  const fastener = choices.fasteners.find((f) => String(f.id) === fastenerId);
  const torque = parseQuantity(decimalPoint(torqueText), "torque", unitFor("torque", units));
  return (
    <div className="max-w-xl">
      <h2 className="mb-4 text-2xl font-bold">New seal plan</h2>
      {emptyLibrary ? <FormError message="Add at least one fastener and one gasket in Libraries first." /> : null}
      <ErrorSummary
        errors={actionData?.errors}
        message={actionData?.problems?.length ? `Nothing was saved: the estimate cannot run. ${actionData.problems.join(" ")}` : null}
        answer={actionData}
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
        noValidate
        onChange={(e) => {
          const t = e.target as unknown as HTMLInputElement;
          if (t.name === "torque") setTorqueText(t.value);
        }}
      >
        <PlanFields
          values={values}
          errors={actionData?.errors ?? {}}
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
