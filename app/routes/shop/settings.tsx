import { data, Form } from "react-router";
import { z } from "zod";
import { UNIT_SYSTEMS } from "~/lib/units";
import type { Route } from "./+types/settings";
import { PageTitle } from "~/components/app-shell";
import { Button, Field } from "~/components/form";
import { getPasswordHash, setPassword, updateProfile } from "~/models/user.server";
import { requireUser, startSession } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { NewPassword, PersonName } from "~/utils/password-field.server";
import { verifyPassword } from "~/utils/password.server";
import { PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { redirectWithToast } from "~/utils/toast.server";
import { fieldErrors } from "~/utils/field-errors";

export const meta: Route.MetaFunction = () => [{ title: "Settings · Sealwright" }];

const ProfileSchema = z.object({ name: PersonName, units: z.enum(UNIT_SYSTEMS, "Pick metric or imperial") });
const PasswordSchema = z
  .object({
    current: z.string({ error: "Enter your current password" }).min(1, "Enter your current password"),
    password: NewPassword,
    confirm: z.string({ error: "Type the new password again" }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

export async function loader({ request }: Route.LoaderArgs) {
  const { user } = await requireUser(request);
  return { name: user.name, email: user.email, units: user.units };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, team } = await requireUser(request);
  const form = Object.fromEntries(await request.formData());
  if (readIntent(form, ["profile", "password"], "profile") === "password") {
    const parsed = PasswordSchema.safeParse(form);
    if (!parsed.success) return data({ intent: "password", errors: fieldErrors(parsed.error.issues) }, { status: 400 });
    const ok = await verifyPassword((await getPasswordHash(user.id)) ?? "", parsed.data.current);
    if (!ok)
      return data(
        { intent: "password", errors: { current: "That is not your current password" } as Record<string, string> },
        { status: 400 },
      );
    // every session ends (other devices too); this browser gets a fresh one
    await setPassword(user.id, parsed.data.password);
    const session = await startSession(request, user.id, team.id, "/settings");
    return redirectWithToast(request, "/settings", "Password changed; other devices were signed out.", "done", {
      headers: session.headers,
    });
  }
  // a post with units alone keeps the name
  const parsed = ProfileSchema.safeParse({ name: user.name, ...form });
  if (!parsed.success) return data({ intent: "profile", errors: fieldErrors(parsed.error.issues) }, { status: 400 });
  await updateProfile(user.id, parsed.data);
  return redirectWithToast(request, "/settings", "Settings saved.");
}

export default function Settings({ loaderData, actionData }: Route.ComponentProps) {
  const errors = (intent: string) => (actionData?.intent === intent ? actionData.errors : {}) as Record<string, string | undefined>;
  return (
    <>
      <PageTitle sub="Your own preferences; the shop's data is always stored in SI units.">Settings</PageTitle>
      <div className="max-w-xl space-y-6">
        <Form method="post" className="space-y-4 rounded border border-forge-100 bg-white p-4">
          <input type="hidden" name="intent" value="profile" />
          <Field label="Name" name="name" autoComplete="name" required defaultValue={loaderData.name} error={errors("profile").name} />
          <p className="text-sm text-forge-700">You sign in as {loaderData.email}.</p>
          <fieldset>
            <legend className="font-bold">Display units</legend>
            {errors("profile").units ? <p className="text-failed">✖ {errors("profile").units}</p> : null}
            <label className="mt-2 flex items-center gap-2">
              <input type="radio" name="units" value="metric" defaultChecked={loaderData.units === "metric"} /> Metric (mm, kN, N·m, bar,
              MPa)
            </label>
            <label className="mt-1 flex items-center gap-2">
              <input type="radio" name="units" value="imperial" defaultChecked={loaderData.units === "imperial"} /> Imperial (in, thou, lbf,
              lbf·ft, psi)
            </label>
          </fieldset>
          <Button type="submit">Save</Button>
        </Form>

        <Form method="post" className="space-y-4 rounded border border-forge-100 bg-white p-4">
          <h2 className="font-bold">Change your password</h2>
          <input type="hidden" name="intent" value="password" />
          <Field
            label="Current password"
            name="current"
            type="password"
            autoComplete="current-password"
            required
            error={errors("password").current}
          />
          <Field
            label="New password"
            name="password"
            type="password"
            autoComplete="new-password"
            required
            error={errors("password").password}
            hint={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters. Every other device signed in as you is signed out.`}
          />
          <Field
            label="New password again"
            name="confirm"
            type="password"
            autoComplete="new-password"
            required
            error={errors("password").confirm}
          />
          <Button type="submit">Change the password</Button>
        </Form>
        <p>
          <a className="text-copper-700 underline" href="/settings/tokens">
            API tokens
          </a>{" "}
          for scripts and dyno laptops
        </p>
      </div>
    </>
  );
}
