import { getFormProps, useForm } from "@conform-to/react";
import { data, Form } from "react-router";
import { z } from "zod";
import { UNIT_SYSTEMS } from "~/lib/units";
import type { Route } from "./+types/settings";
import { PageTitle } from "~/components/app-shell";
import { Button, ErrorSummary, Field } from "~/components/form";
import { getPasswordHash, setPassword, updateProfile } from "~/models/user.server";
import { requireUser, startSession } from "~/utils/auth.server";
import { parseSubmission, readIntent } from "~/utils/conform.server";
import { NewPassword, PersonName } from "~/utils/password-field.server";
import { verifyPassword } from "~/utils/password.server";
import { PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { redirectWithToast } from "~/utils/toast.server";

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
  const formData = await request.formData();
  if (readIntent(formData, ["profile", "password"], "profile") === "password") {
    const submission = parseSubmission(formData, PasswordSchema);
    // no password, old or new, is sent back to the page
    const refuse = (fieldErrors?: Record<string, string[]>) =>
      data(
        { intent: "password" as const, result: submission.reply({ fieldErrors, hideFields: ["current", "password", "confirm"] }) },
        { status: 400 },
      );
    if (submission.status !== "success") return refuse();
    const { current, password } = submission.value;
    if (!(await verifyPassword((await getPasswordHash(user.id)) ?? "", current)))
      return refuse({ current: ["That is not your current password"] });
    // every session ends (other devices too); this browser gets a fresh one
    await setPassword(user.id, password);
    const session = await startSession(request, user.id, team.id, "/settings");
    return redirectWithToast(request, "/settings", "Password changed; other devices were signed out.", "done", {
      headers: session.headers,
    });
  }
  // a post with units alone keeps the name
  if (!formData.has("name")) formData.set("name", user.name);
  const submission = parseSubmission(formData, ProfileSchema);
  if (submission.status !== "success") return data({ intent: "profile" as const, result: submission.reply() }, { status: 400 });
  await updateProfile(user.id, submission.value);
  return redirectWithToast(request, "/settings", "Settings saved.");
}

export default function Settings({ loaderData, actionData }: Route.ComponentProps) {
  // two forms on the page, each with its own answer
  const [profile, profileFields] = useForm<z.input<typeof ProfileSchema>>({
    id: "profile",
    defaultValue: { name: loaderData.name, units: loaderData.units },
    lastResult: actionData?.intent === "profile" ? actionData.result : undefined,
    shouldValidate: "onSubmit",
  });
  const [password, passwordFields] = useForm<z.input<typeof PasswordSchema>>({
    id: "password",
    lastResult: actionData?.intent === "password" ? actionData.result : undefined,
    shouldValidate: "onSubmit",
  });
  const units = profileFields.units;
  return (
    <>
      <PageTitle sub="Your own preferences; the shop's data is always stored in SI units.">Settings</PageTitle>
      <div className="max-w-xl space-y-6">
        <Form method="post" className="space-y-4 rounded border border-forge-100 bg-white p-4" {...getFormProps(profile)}>
          <ErrorSummary
            errors={profile.allErrors}
            message={profile.errors?.[0] ?? null}
            answer={actionData?.intent === "profile" ? actionData : null}
            fieldId={(name) => (name === "units" ? "f-units-metric" : `f-${name}`)}
          />
          <input type="hidden" name="intent" value="profile" />
          <Field
            label="Name"
            name={profileFields.name.name}
            autoComplete="name"
            required
            defaultValue={profileFields.name.initialValue}
            error={profileFields.name.errors?.[0]}
          />
          <p className="text-sm text-forge-700">You sign in as {loaderData.email}.</p>
          <fieldset aria-describedby={units.errors ? "f-units-error" : undefined}>
            <legend className="font-bold">Display units</legend>
            {units.errors ? (
              <p id="f-units-error" className="text-failed">
                ✖ {units.errors[0]}
              </p>
            ) : null}
            <label htmlFor="f-units-metric" className="mt-2 flex items-center gap-2">
              <input id="f-units-metric" type="radio" name={units.name} value="metric" defaultChecked={units.initialValue === "metric"} />{" "}
              Metric (mm, kN, N·m, bar, MPa)
            </label>
            <label htmlFor="f-units-imperial" className="mt-1 flex items-center gap-2">
              <input
                id="f-units-imperial"
                type="radio"
                name={units.name}
                value="imperial"
                defaultChecked={units.initialValue === "imperial"}
              />{" "}
              Imperial (in, thou, lbf, lbf·ft, psi)
            </label>
          </fieldset>
          <Button type="submit">Save</Button>
        </Form>

        <Form method="post" className="space-y-4 rounded border border-forge-100 bg-white p-4" {...getFormProps(password)}>
          <h2 className="font-bold">Change your password</h2>
          <ErrorSummary
            errors={password.allErrors}
            message={password.errors?.[0] ?? null}
            answer={actionData?.intent === "password" ? actionData : null}
          />
          <input type="hidden" name="intent" value="password" />
          <Field
            label="Current password"
            name={passwordFields.current.name}
            type="password"
            autoComplete="current-password"
            required
            error={passwordFields.current.errors?.[0]}
          />
          <Field
            label="New password"
            name={passwordFields.password.name}
            type="password"
            autoComplete="new-password"
            required
            error={passwordFields.password.errors?.[0]}
            hint={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters. Every other device signed in as you is signed out.`}
          />
          <Field
            label="New password again"
            name={passwordFields.confirm.name}
            type="password"
            autoComplete="new-password"
            required
            error={passwordFields.confirm.errors?.[0]}
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
