import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/reset-password";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field, FormError } from "~/components/form";
import { completePasswordReset, resetTokenUsable } from "~/models/password-reset.server";
import { parseSubmission } from "~/utils/conform.server";
import { NewPassword } from "~/utils/password-field.server";
import { PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { sessionStorage, getSession } from "~/utils/session.server";
import { redirectWithToast } from "~/utils/toast.server";
import { useRootData } from "~/root";

export const meta: Route.MetaFunction = () => [{ title: "Choose a new password · Sealwright" }];

const ResetSchema = z
  .object({ password: NewPassword, confirm: z.string({ error: "Type the new password again" }) })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

const LINK_GONE = "This link has been used or has expired. Ask for a new one.";

export async function loader({ params }: Route.LoaderArgs) {
  return { usable: await resetTokenUsable(params.token) };
}

export async function action({ request, params }: Route.ActionArgs) {
  const submission = parseSubmission(await request.formData(), ResetSchema);
  // neither password is sent back to the page
  if (submission.status !== "success")
    return data({ result: submission.reply({ hideFields: ["password", "confirm"] }), gone: false }, { status: 400 });
  if (!(await completePasswordReset(params.token, submission.value.password)))
    return data({ result: undefined, gone: true }, { status: 410 });
  // every session of the account ended with the reset, this browser's too: its cookie goes as well
  const headers = new Headers();
  headers.append("Set-Cookie", await sessionStorage().destroySession(await getSession(request)));
  return redirectWithToast(request, "/login", "Password changed. Sign in with the new one; every other device was signed out.", "done", {
    headers,
  });
}

export default function ResetPassword({ loaderData, actionData }: Route.ComponentProps) {
  const gone = !loaderData.usable || actionData?.gone;
  const [form, fields] = useForm<z.input<typeof ResetSchema>>({
    id: "reset-password",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  return (
    <AuthFrame toast={useRootData()?.toast} title="Choose a new password">
      {gone ? (
        <>
          <FormError message={LINK_GONE} />
          <p className="mt-4 text-sm">
            <Link className="text-copper-700 underline" to="/forgot-password">
              Ask for a new link
            </Link>
          </p>
        </>
      ) : (
        <Form method="post" className="space-y-4" {...getFormProps(form)}>
          <ErrorSummary errors={form.allErrors} message={form.errors?.[0] ?? null} answer={actionData} />
          <Field
            label="New password"
            name={fields.password.name}
            type="password"
            autoComplete="new-password"
            required
            error={fields.password.errors?.[0]}
            hint={`${PASSWORD_MIN} to ${PASSWORD_MAX} characters; a short sentence is easy to remember.`}
          />
          <Field
            label="New password again"
            name={fields.confirm.name}
            type="password"
            autoComplete="new-password"
            required
            error={fields.confirm.errors?.[0]}
          />
          <Button type="submit">Set the password</Button>
        </Form>
      )}
    </AuthFrame>
  );
}
