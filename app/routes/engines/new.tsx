import type { Route } from "./+types/new";
import { PageTitle } from "~/components/app-shell";
import { EngineForm } from "~/components/engine-form";
import { blankEngineForm } from "~/lib/engine";
import { createEngine, EngineInputError, listMaterialOptions } from "~/models/engine.server";
import { requireRole } from "~/utils/auth.server";
import { engineFormStep, refuseEngine } from "~/utils/engine-form.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "New engine · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team } = await requireRole(request, "builder");
  const units = user.units;
  return { units, materials: await listMaterialOptions(team.id), blank: blankEngineForm(units) };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const formData = await request.formData();
  const step = await engineFormStep(formData, user.units, ["save", "pattern"]);
  if (step.answer) return step.answer;
  try {
    const id = await createEngine(team.id, user.id, step.engine);
    return redirectWithToast(request, `/engines/${id}`, `Engine “${step.engine.name}” added.`);
  } catch (e) {
    if (e instanceof EngineInputError) return refuseEngine(step.submission, e);
    throw e;
  }
}

export default function NewEngine({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageTitle
        sub={`Geometry, materials, sleeves, studs and boost: what every seal plan for it starts from. Lengths in ${loaderData.units === "imperial" ? "inches" : "millimetres"}; change units in Settings.`}
      >
        New engine
      </PageTitle>
      <EngineForm
        defaultValue={loaderData.blank}
        result={actionData?.result}
        materials={loaderData.materials}
        units={loaderData.units}
        submitLabel="Save engine"
        cancelTo="/engines"
      />
    </>
  );
}
