import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import type { Route } from "./+types/copy";
import { Button, FormError } from "~/components/form";
import { REFUSAL_TITLE, RoleRefusal } from "~/components/refusal";
import { gasketFitProblem } from "~/lib/plan/assemble";
import { CopyPlanSchema } from "~/lib/plan/form";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { engineChoices, requireEngine } from "~/models/engine.server";
import { getGasket } from "~/models/library.server";
import { copyPlanToEngine, requirePlan } from "~/models/plan.server";
import type { Asker } from "~/models/viewer-scope.server";
import { requireRole } from "~/utils/auth.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = ({ data, error }) => [
  { title: error ? REFUSAL_TITLE : `Copy ${data?.plan.name ?? "seal plan"} · Sealwright` },
];

/** The other engines of the team, each with whether the plan's gasket fits its bore (and why not). */
async function targets(who: Asker, engineId: number, gasketBoreMm: number | null, units: UnitSystem) {
  const length = (mm: number) => formatQuantity(mm, "length", units);
  return (await engineChoices(who))
    .filter((e) => e.id !== engineId)
    .map((e) => ({
      ...e,
      misfit: gasketBoreMm === null ? "The plan's gasket is no longer in the library." : gasketFitProblem(e.boreMm, gasketBoreMm, length),
    }));
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const gasket = await getGasket(team.id, plan.gasketId);
  return {
    units: user.units,
    engine: { id: engine.id, name: engine.name },
    plan: { id: plan.id, name: plan.name, gasketName: gasket?.name ?? "—" },
    targets: await targets(who, engine.id, gasket?.boreMm ?? null, user.units),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const submission = parseSubmission(await request.formData(), CopyPlanSchema);
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  const refuse = (message: string) => data({ result: submission.reply({ formErrors: [message] }) }, { status: 400 });
  // another shop's engine is not found, as everywhere
  const target = await requireEngine(who, String(submission.value.targetEngineId));
  if (target.id === engine.id) return refuse("That is this plan's own engine; pick another.");
  const gasket = await getGasket(team.id, plan.gasketId);
  const misfit = gasket
    ? gasketFitProblem(target.boreMm, gasket.boreMm, (mm) => formatQuantity(mm, "length", user.units))
    : "The plan's gasket is no longer in the library.";
  if (misfit) return refuse(`Not copied to “${target.name}”: ${misfit}`);
  const id = await copyPlanToEngine(team.id, user.id, plan, target.id);
  return redirectWithToast(request, `/engines/${target.id}/plans/${id}`, `“${plan.name}” copied from “${engine.name}”.`);
}

export default function CopyPlan({ loaderData, actionData }: Route.ComponentProps) {
  const { engine, plan, targets } = loaderData;
  const fitting = targets.filter((t) => !t.misfit);
  // the one form path; its one field is a list of radios, so the message stands above them
  const [form, fields] = useForm<{ targetEngineId?: string }>({
    id: "copy-plan",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const error = form.errors?.[0] ?? fields.targetEngineId.errors?.[0];
  return (
    <section className="max-w-2xl">
      <h2 className="mb-2 text-2xl font-bold">Copy “{plan.name}” to another engine</h2>
      <p className="mb-4 text-forge-700">
        The copy takes the gasket ({plan.gasketName}), its sealing details, the fastener, lubricant, friction and torque procedure. The
        estimate is worked out again for the other engine.
      </p>
      <FormError message={error} />
      {targets.length === 0 ? (
        <p className="rounded border border-dashed border-forge-300 bg-white p-4">This shop has no other engine to copy to.</p>
      ) : (
        <Form method="post" className="mt-4 space-y-4" {...getFormProps(form, { ariaAttributes: false })}>
          <fieldset className="min-w-0 rounded border border-forge-100 bg-white p-4">
            <legend className="px-1 font-bold">Copy to</legend>
            <ul className="space-y-2">
              {targets.map((t) => (
                <li key={t.id}>
                  <label className="flex items-start gap-2">
                    <input
                      type="radio"
                      name={fields.targetEngineId.name}
                      value={t.id}
                      defaultChecked={t.id === fitting[0]?.id}
                      className="mt-1"
                    />
                    <span>
                      <span className="font-medium">{t.name}</span>
                      <span className="block text-sm text-forge-700">
                        {t.misfit ? `✖ The gasket does not fit: ${t.misfit}` : "✔ The gasket fits this bore."}
                      </span>
                    </span>
                  </label>
                </li>
              ))}
            </ul>
          </fieldset>
          <div className="flex flex-wrap gap-3">
            <Button type="submit">Copy the plan</Button>
            <Link to={`/engines/${engine.id}/plans/${plan.id}`} className="rounded border border-forge-300 bg-white px-4 py-2 font-medium">
              Cancel
            </Link>
          </div>
        </Form>
      )}
    </section>
  );
}

export function ErrorBoundary({ error, params }: Route.ErrorBoundaryProps) {
  return (
    <RoleRefusal
      error={error}
      who="A builder or the owner copies seal plans."
      backTo={`/engines/${params.engineId}/plans/${params.planId}`}
      backLabel="Back to the plan"
    />
  );
}
