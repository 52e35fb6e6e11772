import { data, Form, redirect } from "react-router";
import type { Route } from "./+types/new";
import { Caution } from "~/components/caution";
import { RoleRefusal } from "~/components/refusal";
import { Button, FormError } from "~/components/form";
import { MakerTorque } from "~/components/maker-torque";
import { PlanFields } from "~/components/plan-form";
import { parsePlanForm, planFormValues } from "~/lib/plan/form";
import { formatQuantity } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { createPlan, listPlans, planChoices } from "~/models/plan.server";
import { requireRole } from "~/utils/auth.server";
import { previewPlan } from "~/utils/plan-actions.server";
import { flashToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "New seal plan · Sealwright" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team } = await requireRole(request, "builder");
  const engine = await requireEngine(team.id, params.engineId);
  const [choices, plans] = await Promise.all([planChoices(team.id), listPlans(team.id, engine.id)]);
  // Start from the chosen plan (or the latest), so a new plan differs only where the builder changes it.
  const template = plans.find((p) => p.id === engine.chosenPlanId) ?? plans[plans.length - 1];
  const fastener = choices.fasteners.find((f) => f.id === template?.fastenerId) ?? choices.fasteners[0];
  // Without a plan to start from: the gasket whose bore fits this engine most closely.
  const fitting = choices.gaskets.filter((g) => g.boreMm >= engine.boreMm).sort((x, y) => x.boreMm - y.boreMm);
  const gasket = choices.gaskets.find((g) => g.id === template?.gasketId) ?? fitting[0] ?? choices.gaskets[0];
  const torqueNm = template?.torqueNm ?? fastener?.makerTorqueNm ?? 100;
  const values = planFormValues(
    template
      ? { ...template, name: "", notes: "" }
      : {
          name: "",
          gasketId: gasket?.id ?? 0,
          fastenerId: fastener?.id ?? 0,
          lubricant: fastener?.makerLubricant ?? "",
          threadFriction: fastener?.threadFriction ?? 0.12,
          bearingFriction: fastener?.bearingFriction ?? 0.12,
          method: "torque-estimated-friction",
          torqueNm,
          stagesNm: [Math.round(torqueNm * 0.4), Math.round(torqueNm * 0.7), torqueNm],
          wireLocation: gasket?.type === "solid-copper" ? "block" : "none",
          wireProjectionMm: gasket?.type === "solid-copper" ? 0.1 : 0,
          receiverGrooveDepthMm: 0,
          sleeveProtrusionMm: null,
          targetMargin: 1.5,
          notes: "",
        },
    user.units,
  );
  return { units: user.units, engine, choices, values, torqueNm, emptyLibrary: !fastener || !gasket };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const engine = await requireEngine(team.id, params.engineId);
  const form = Object.fromEntries(await request.formData());
  const values = Object.fromEntries(Object.entries(form).map(([k, v]) => [k, String(v)]));
  const parsed = parsePlanForm(form, user.units);
  if (!parsed.ok) return data({ errors: parsed.errors, values, problems: [] as string[] }, { status: 400 });
  const { problems } = await previewPlan(team.id, engine, parsed.plan, false);
  if (problems.length > 0) return data({ errors: {}, values, problems }, { status: 400 });
  const id = await createPlan(team.id, user.id, engine.id, parsed.plan);
  return redirect(`/engines/${engine.id}/plans/${id}`, { headers: { "Set-Cookie": await flashToast(request, { kind: "done", message: "Plan created." }) } });
}

export default function NewPlan({ loaderData, actionData }: Route.ComponentProps) {
  const { units, engine, choices, emptyLibrary } = loaderData;
  const values = actionData?.values ?? loaderData.values;
  const fastener = choices.fasteners.find((f) => String(f.id) === values.fastenerId);
  return (
    <div className="max-w-xl">
      <h2 className="mb-4 text-2xl font-bold">New seal plan</h2>
      {emptyLibrary ? <FormError message="Add at least one fastener and one gasket in Libraries first." /> : null}
      {actionData?.problems?.length ? <FormError message={`The estimate cannot run: ${actionData.problems.join(" ")}`} /> : null}
      {fastener ? (
        <div className="mb-4">
          <MakerTorque ourTorqueNm={loaderData.torqueNm} makerTorqueNm={fastener.makerTorqueNm} makerLubricant={fastener.makerLubricant} makerStages={fastener.makerStages} units={units} />
        </div>
      ) : null}
      <Form method="post" className="space-y-4" noValidate>
        <PlanFields values={values} errors={actionData?.errors ?? {}} choices={choices} units={units} sleeved={engine.sleeveKind !== "none"} engineProtrusion={formatQuantity(engine.sleeveProtrusionMm, "smallLength", units)} />
        <Button type="submit">Create plan</Button>
      </Form>
      <Caution className="mt-6" />
    </div>
  );
}

// Inside the engine layout: a viewer who types this address reads why, with the engine's tabs still there.
export function ErrorBoundary({ error, params }: Route.ErrorBoundaryProps) {
  return <RoleRefusal error={error} who="A builder or the owner makes seal plans." backTo={`/engines/${params.engineId}/plans`} backLabel="Back to the seal plans" />;
}
