import type { Route } from "./+types/edit";
import { EngineForm } from "~/components/engine-form";
import { REFUSAL_TITLE, RoleRefusal } from "~/components/refusal";
import { ENGINE_FORM_INTENTS, engineToForm } from "~/lib/engine";
import { archiveEngine, EngineInputError, listMaterialOptions, requireEngine, updateEngine } from "~/models/engine.server";
import { requireRole } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { engineFormStep, refuseEngine } from "~/utils/engine-form.server";
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
  const formData = await request.formData();
  if (readIntent(formData, ENGINE_FORM_INTENTS, "save") === "archive") {
    await archiveEngine(team.id, user.id, engine.id);
    return redirectWithToast(request, "/engines", `Engine “${engine.name}” archived.`);
  }
  const step = await engineFormStep(formData, user.units, ENGINE_FORM_INTENTS);
  if (step.answer) return step.answer;
  try {
    await updateEngine(team.id, user.id, engine.id, step.engine);
  } catch (e) {
    if (e instanceof EngineInputError) return refuseEngine(step.submission, e);
    throw e;
  }
  return redirectWithToast(request, `/engines/${engine.id}`, "Engine saved.");
}

export default function EditEngine({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <section>
      <h2 className="mb-4 text-2xl font-bold">Edit the engine record</h2>
      <EngineForm
        defaultValue={loaderData.values}
        result={actionData?.result}
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
