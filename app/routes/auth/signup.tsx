import { data, Form, Link, redirect, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/signup";
import { AuthFrame } from "~/components/auth-frame";
import { Button, Field, fieldErrors, FormError } from "~/components/form";
import { createUserWithTeam, emailTaken } from "~/models/user.server";
import { getUser, startSession } from "~/utils/auth.server";
import { PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";

export const meta: Route.MetaFunction = () => [{ title: "Create your shop · Sealwright" }];

const SignUpSchema = z.object({
  name: z.string().trim().min(1, "Enter your name").max(120, "Keep your name under 120 characters"),
  email: z.email("Enter an e-mail address like name@shop.example").max(254),
  teamName: z.string().trim().min(1, "Name your shop or team").max(120, "Keep the shop name under 120 characters"),
  password: z
    .string()
    .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
    .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`),
});

export async function loader({ request }: Route.LoaderArgs) {
  if (await getUser(request)) throw redirect("/dashboard");
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const form = Object.fromEntries(await request.formData());
  const values = { name: String(form.name ?? ""), email: String(form.email ?? ""), teamName: String(form.teamName ?? "") };
  const parsed = SignUpSchema.safeParse(form);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.error.issues), values, formError: null }, { status: 400 });
  if (await emailTaken(parsed.data.email)) {
    return data({ errors: { email: "That e-mail already has an account. Sign in instead." }, values, formError: null }, { status: 400 });
  }
  const { user, teamId } = await createUserWithTeam(parsed.data);
  return startSession(request, user.id, teamId, "/dashboard");
}

export default function SignUp({ actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  const errors: Record<string, string> = actionData?.errors ?? {};
  const values = actionData?.values;
  return (
    <AuthFrame title="Create your shop">
      <Form method="post" className="space-y-4" noValidate>
        <FormError message={actionData?.formError} />
        <Field label="Your name" name="name" autoComplete="name" required defaultValue={values?.name} error={errors.name} />
        <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={values?.email} error={errors.email} />
        <Field label="Shop or team name" name="teamName" required defaultValue={values?.teamName} error={errors.teamName} hint="You become its owner and can invite builders and viewers." />
        <Field label="Password" name="password" type="password" autoComplete="new-password" required error={errors.password} hint={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters; a short sentence is easy to remember.`} />
        <Button type="submit" disabled={busy}>
          {busy ? "Creating…" : "Create shop"}
        </Button>
      </Form>
      <p className="mt-6 text-sm">
        Already have an account?{" "}
        <Link className="text-copper-700 underline" to="/login">
          Sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
