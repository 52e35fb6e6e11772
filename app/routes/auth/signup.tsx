import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link, redirect, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/signup";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field } from "~/components/form";
import { createUserWithTeam, EmailTakenError } from "~/models/user.server";
import { getUser, startSession } from "~/utils/auth.server";
import { clientAddress } from "~/utils/client-address.server";
import { parseSubmission } from "~/utils/conform.server";
import { isCommonPassword } from "~/utils/password.server";
import { isBlankPassword, PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { takeAll, tooManyHeaders, waitWords } from "~/utils/rate-limit.server";
import { useRootData } from "~/root";

export const meta: Route.MetaFunction = () => [{ title: "Create your shop · Sealwright" }];

const SignUpSchema = z.object({
  // Conform reads a blank field as missing: each field's own message covers that too
  name: z.string({ error: "Enter your name" }).trim().min(1, "Enter your name").max(120, "Keep your name under 120 characters"),
  email: z.email("Enter an e-mail address like name@shop.example").max(254),
  teamName: z
    .string({ error: "Name your shop or team" })
    .trim()
    .min(1, "Name your shop or team")
    .max(120, "Keep the shop name under 120 characters"),
  password: z
    .string({ error: `Use at least ${PASSWORD_MIN} characters` })
    .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
    .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`)
    .refine((p) => !isBlankPassword(p), "Use letters, digits or symbols, not only spaces")
    .refine(
      (p) => !isCommonPassword(p),
      "That password is on a public list of common passwords; pick another (a short sentence works well)",
    ),
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
  const submission = parseSubmission(await request.formData(), SignUpSchema);
  // the password is never sent back to the page
  const refuse = (status: number, options: Parameters<typeof submission.reply>[0] = {}, init: ResponseInit = {}) =>
    data({ result: submission.reply({ ...options, hideFields: ["password"] }) }, { ...init, status });
  if (submission.status !== "success") return refuse(400);
  // Each attempt that would hash and write counts against the address, taken or not.
  const wait = await takeAll([["signUpAddress", clientAddress(context)]]);
  if (wait > 0)
    return refuse(
      429,
      { formErrors: [`Too many new shops from this network; try again in ${waitWords(wait)}.`] },
      { headers: tooManyHeaders(wait) },
    );
  try {
    // Hashes first, then lets the UNIQUE constraint say whether the e-mail is free: no separate look-up
    // that answers faster for a taken e-mail, and no race between two sign-ups of the same e-mail.
    const { user, teamId } = await createUserWithTeam(submission.value);
    return startSession(request, user.id, teamId, "/dashboard");
  } catch (error) {
    if (error instanceof EmailTakenError) return refuse(400, { fieldErrors: { email: [EMAIL_NOT_AVAILABLE] } });
    throw error;
  }
}

export default function SignUp({ actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  // the one form path (DEVELOPERS.md): the server parses with the schema, Conform carries its answer
  const [form, fields] = useForm<z.input<typeof SignUpSchema>>({
    id: "signup",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const formError = form.errors?.[0] ?? null;
  return (
    <AuthFrame toast={useRootData()?.toast} title="Create your shop">
      <Form method="post" className="space-y-4" {...getFormProps(form)}>
        <ErrorSummary
          errors={form.allErrors}
          message={formError ?? (Object.keys(form.allErrors).length ? "The shop was not created: check the marked fields." : null)}
          answer={actionData}
        />
        <Field
          label="Your name"
          name={fields.name.name}
          autoComplete="name"
          required
          defaultValue={fields.name.initialValue}
          error={fields.name.errors?.[0]}
        />
        <Field
          label="E-mail"
          name={fields.email.name}
          type="email"
          autoComplete="email"
          required
          defaultValue={fields.email.initialValue}
          error={fields.email.errors?.[0]}
        />
        <Field
          label="Shop or team name"
          name={fields.teamName.name}
          required
          defaultValue={fields.teamName.initialValue}
          error={fields.teamName.errors?.[0]}
          hint="You become its owner and can invite builders and viewers."
        />
        <Field
          label="Password"
          name={fields.password.name}
          type="password"
          autoComplete="new-password"
          required
          error={fields.password.errors?.[0]}
          hint={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters; a short sentence is easy to remember.`}
        />
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
