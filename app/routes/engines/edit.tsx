import { data } from "react-router";
import type { Route } from "./+types/edit";
import { EngineForm } from "~/components/engine-form";
import { useSeedKey } from "~/components/form";
import { REFUSAL_TITLE, RoleRefusal } from "~/components/refusal";
import { engineFormStep, engineToForm } from "~/lib/engine";
import { archiveEngine, EngineInputError, listMaterialOptions, requireEngine, updateEngine } from "~/models/engine.server";
import { requireRole } from "~/utils/auth.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = ({ error }) => [{ title: error ? REFUSAL_TITLE : "Edit engine · Sealwright" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const units = user.units;
  const values = engineToForm(engine, units);
  return { units, materials: await listMaterialOptions(team.id), values, engineId: engine.id };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const form = Object.fromEntries([...(await request.formData())].map(([k, v]) => [k, String(v)]));
  if (form.intent === "archive") {
    await archiveEngine(team.id, user.id, engine.id);
    return redirectWithToast(request, "/engines", `Engine “${engine.name}” archived.`);
  }
  const step = engineFormStep(form, user.units);
  if (step.step === "render") return { values: step.values, errors: step.errors, reseed: true };
  if (step.step === "invalid") return data({ values: step.values, errors: step.errors }, { status: 400 });
  try {
    await updateEngine(team.id, user.id, engine.id, step.engine);
  } catch (e) {
    if (e instanceof EngineInputError) return data({ values: step.values, errors: e.errors }, { status: 400 });
    throw e;
  }
  return redirectWithToast(request, `/engines/${engine.id}`, "Engine saved.");
}

export default function EditEngine({ loaderData, actionData }: Route.ComponentProps) {
  const values = actionData?.values ?? loaderData.values;
  const seedKey = useSeedKey(values, Boolean(actionData && "reseed" in actionData));
  return (
    <section>
      <h2 className="mb-4 text-2xl font-bold">Edit the engine record</h2>
      <EngineForm
        key={seedKey}
        values={values}
        errors={actionData?.errors ?? {}}
        answer={actionData}
        materials={loaderData.materials}
        units={loaderData.units}
        submitLabel="Save changes"
        cancelTo={`/engines/${loaderData.engineId}`}
        canArchive
      />
    </section>
  );
}

// Inside the engine layout, so the header and tabs stay: a viewer who follows an edit link reads why.
export function ErrorBoundary({ error, params }: Route.ErrorBoundaryProps) {
  return (
    <RoleRefusal
      error={error}
      who="A builder or the owner edits engine records."
      backTo={`/engines/${params.engineId}`}
      backLabel="Back to the overview"
    />
  );
}
