import { data, Form, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/settings";
import { PageTitle } from "~/components/app-shell";
import { Button } from "~/components/form";
import { setUnits } from "~/models/user.server";
import { requireUser } from "~/utils/auth.server";
import { flashToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Settings · Sealwright" }];

const UnitsSchema = z.object({ units: z.enum(["metric", "imperial"], "Pick metric or imperial") });

export async function loader({ request }: Route.LoaderArgs) {
  const { user } = await requireUser(request);
  return { units: user.units };
}

export async function action({ request }: Route.ActionArgs) {
  const { user } = await requireUser(request);
  const parsed = UnitsSchema.safeParse(Object.fromEntries(await request.formData()));
  if (!parsed.success) return data({ error: parsed.error.issues[0]?.message ?? "Pick metric or imperial" }, { status: 400 });
  await setUnits(user.id, parsed.data.units);
  return redirect("/settings", { headers: { "Set-Cookie": await flashToast(request, { kind: "done", message: "Units saved." }) } });
}

export default function Settings({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageTitle sub="Your own preferences; the shop's data is always stored in SI units.">Settings</PageTitle>
      <Form method="post" className="max-w-xl rounded border border-forge-100 bg-white p-4">
        <fieldset>
          <legend className="font-bold">Display units</legend>
          {actionData?.error ? <p className="text-failed">✖ {actionData.error}</p> : null}
          <label className="mt-2 flex items-center gap-2">
            <input type="radio" name="units" value="metric" defaultChecked={loaderData.units === "metric"} /> Metric (mm, kN, N·m, bar, MPa)
          </label>
          <label className="mt-1 flex items-center gap-2">
            <input type="radio" name="units" value="imperial" defaultChecked={loaderData.units === "imperial"} /> Imperial (in, thou, lbf, lbf·ft, psi)
          </label>
        </fieldset>
        <div className="mt-4">
          <Button type="submit">Save</Button>
        </div>
      </Form>
      <p className="mt-6"><a className="text-copper-700 underline" href="/settings/tokens">API tokens</a> for scripts and dyno laptops</p>
    </>
  );
}
