import { data, Form, Link, redirect, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/signup";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field } from "~/components/form";
import { fieldErrors } from "~/utils/field-errors";
import { createUserWithTeam, EmailTakenError } from "~/models/user.server";
import { getUser, startSession } from "~/utils/auth.server";
import { clientAddress } from "~/utils/client-address.server";
import { isCommonPassword } from "~/utils/password.server";
import { isBlankPassword, PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { takeAll, tooManyHeaders, waitWords } from "~/utils/rate-limit.server";

export const meta: Route.MetaFunction = () => [{ title: "Create your shop · Sealwright" }];

const SignUpSchema = z.object({
  name: z.string().trim().min(1, "Enter your name").max(120, "Keep your name under 120 characters"),
  email: z.email("Enter an e-mail address like name@shop.example").max(254),
  teamName: z.string().trim().min(1, "Name your shop or team").max(120, "Keep the shop name under 120 characters"),
  password: z
    .string()
    .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
    .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`)
    .refine((p) => !isBlankPassword(p), "Use letters, digits or symbols, not only spaces")
    .refine((p) => !isCommonPassword(p), "That password is on a public list of common passwords; pick another (a short sentence works well)"),
});

// The same words whether the e-mail is taken now or was taken a moment ago by a second sign-up.
export const EMAIL_NOT_AVAILABLE = "That e-mail cannot start a new shop. If it is yours, sign in instead.";

// A throttled attempt's Retry-After reaches the page response too (not only the data).
export const headers: Route.HeadersFunction = ({ actionHeaders }) => {
  const retryAfter = actionHeaders.get("Retry-After");
  return retryAfter ? { "Retry-After": retryAfter } : new Headers();
};

export async function loader({ request }: Route.LoaderArgs) {
  if (await getUser(request)) throw redirect("/dashboard");
  return null;
}

export async function action({ request, context }: Route.ActionArgs) {
  const form = Object.fromEntries(await request.formData());
  const values = { name: String(form.name ?? ""), email: String(form.email ?? ""), teamName: String(form.teamName ?? "") };
  const parsed = SignUpSchema.safeParse(form);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.error.issues), values, formError: null }, { status: 400 });
  // Each attempt that would hash and write counts against the address, taken or not.
  const wait = await takeAll([["signUpAddress", clientAddress(context)]]);
  if (wait > 0) {
    const formError = `Too many new shops from this network; try again in ${waitWords(wait)}.`;
    return data({ errors: {} as Record<string, string>, values, formError }, { status: 429, headers: tooManyHeaders(wait) });
  }
  try {
    // Hashes first, then lets the UNIQUE constraint say whether the e-mail is free: no separate look-up
    // that answers faster for a taken e-mail, and no race between two sign-ups of the same e-mail.
    const { user, teamId } = await createUserWithTeam(parsed.data);
    return startSession(request, user.id, teamId, "/dashboard");
  } catch (error) {
    if (error instanceof EmailTakenError) return data({ errors: { email: EMAIL_NOT_AVAILABLE }, values, formError: null }, { status: 400 });
    throw error;
  }
}

export default function SignUp({ actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  const errors: Record<string, string> = actionData?.errors ?? {};
  const values = actionData?.values;
  return (
    <AuthFrame title="Create your shop">
      <Form method="post" className="space-y-4" noValidate>
        <ErrorSummary errors={errors} message={actionData?.formError ?? (Object.keys(errors).length ? "The shop was not created: check the marked fields." : null)} answer={actionData} />
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
