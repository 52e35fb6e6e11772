import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/forgot-password";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field } from "~/components/form";
import { RESET_MINUTES, resetMail } from "~/lib/mail/messages";
import { startPasswordReset } from "~/models/password-reset.server";
import { normalizeEmail } from "~/models/user.server";
import { throttle } from "~/utils/rate-limit.server";
import { getUser } from "~/utils/auth.server";
import { appUrl } from "~/utils/env.server";
import { sendMailLater } from "~/utils/mail.server";
import { parseSubmission } from "~/utils/conform.server";
import { useRootData } from "~/root";

export const meta: Route.MetaFunction = () => [{ title: "Reset your password · Sealwright" }];

const ForgotSchema = z.object({ email: z.email("Enter an e-mail address like name@shop.example").max(254) });

// The one answer for every well-formed address, known or not: nothing tells who has an account.
export const RESET_SENT = `If that address has a Sealwright account, a link to choose a new password is on its way. It works once, for ${RESET_MINUTES} minutes.`;

export async function loader({ request }: Route.LoaderArgs) {
  return { signedIn: Boolean(await getUser(request)) };
}

export async function action({ request }: Route.ActionArgs) {
  const submission = parseSubmission(await request.formData(), ForgotSchema);
  if (submission.status !== "success") return data({ result: submission.reply(), sent: null }, { status: 400 });
  const { email } = submission.value;
  // past three an hour for this address nothing is sent, and the answer is the same
  const throttled = (await throttle("resetEmail").take(normalizeEmail(email))) > 0;
  const reset = throttled ? null : await startPasswordReset(email);
  // the mail goes out after the answer, so a known address does not answer later than an unknown one
  if (reset) void sendMailLater(reset.email, resetMail({ name: reset.name, link: `${appUrl()}/reset-password/${reset.token}` }));
  return data({ result: undefined, sent: RESET_SENT }, { status: 200 });
}

export default function ForgotPassword({ actionData }: Route.ComponentProps) {
  const [form, fields] = useForm<z.input<typeof ForgotSchema>>({
    id: "forgot-password",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  return (
    <AuthFrame toast={useRootData()?.toast} title="Reset your password">
      {actionData?.sent ? (
        <p role="status" className="rounded border border-held bg-held-50 px-3 py-2 text-sm">
          {actionData.sent}
        </p>
      ) : (
        <Form method="post" className="space-y-4" {...getFormProps(form)}>
          <ErrorSummary errors={form.allErrors} message={form.errors?.[0] ?? null} answer={actionData} />
          <p className="text-sm text-forge-700">Enter the address you sign in with; we send a link to choose a new password.</p>
          <Field
            label="E-mail"
            name={fields.email.name}
            type="email"
            autoComplete="email"
            required
            defaultValue={fields.email.initialValue}
            error={fields.email.errors?.[0]}
          />
          <Button type="submit">Send the link</Button>
        </Form>
      )}
      <p className="mt-6 text-sm">
        <Link className="text-copper-700 underline" to="/login">
          Back to sign-in
        </Link>
      </p>
    </AuthFrame>
  );
}
