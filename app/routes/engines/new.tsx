import { data } from "react-router";
import type { Route } from "./+types/new";
import { PageTitle } from "~/components/app-shell";
import { EngineForm } from "~/components/engine-form";
import { useSeedKey } from "~/components/form";
import { blankEngineForm, engineFormStep } from "~/lib/engine";
import { createEngine, EngineInputError, listMaterialOptions } from "~/models/engine.server";
import { requireRole } from "~/utils/auth.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "New engine · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team } = await requireRole(request, "builder");
  const units = user.units;
  return { units, materials: await listMaterialOptions(team.id), blank: blankEngineForm(units) };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const form = Object.fromEntries([...(await request.formData())].map(([k, v]) => [k, String(v)]));
  const step = engineFormStep(form, user.units);
  if (step.step === "render") return { values: step.values, errors: step.errors, reseed: true };
  if (step.step === "invalid") return data({ values: step.values, errors: step.errors }, { status: 400 });
  try {
    const id = await createEngine(team.id, user.id, step.engine);
    return redirectWithToast(request, `/engines/${id}`, `Engine “${step.engine.name}” added.`);
  } catch (e) {
    if (e instanceof EngineInputError) return data({ values: step.values, errors: e.errors }, { status: 400 });
    throw e;
  }
}

export default function NewEngine({ loaderData, actionData }: Route.ComponentProps) {
  const values = actionData?.values ?? loaderData.blank;
  const seedKey = useSeedKey(values, Boolean(actionData && "reseed" in actionData));
  return (
    <>
      <PageTitle
        sub={`Geometry, materials, sleeves, studs and boost: what every seal plan for it starts from. Lengths in ${loaderData.units === "imperial" ? "inches" : "millimetres"}; change units in Settings.`}
      >
        New engine
      </PageTitle>
      <EngineForm
        // stays mounted; a post-back that changed the rows (pattern, add or remove stud) re-seeds it
        key={seedKey}
        values={values}
        errors={actionData?.errors ?? {}}
        answer={actionData}
        materials={loaderData.materials}
        units={loaderData.units}
        submitLabel="Save engine"
        cancelTo="/engines"
      />
    </>
  );
}
