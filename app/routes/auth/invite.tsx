import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/invite";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field, FormError } from "~/components/form";
import { acceptInviteAsNewUser, acceptInviteAsUser, findInvite, INVITE_GONE } from "~/models/invite.server";
import { getUser, startSession } from "~/utils/auth.server";
import { parseSubmission, readIntent } from "~/utils/conform.server";
import { NewPassword, PersonName } from "~/utils/password-field.server";
import { PASSWORD_MAX, PASSWORD_MIN } from "~/utils/password-rules";
import { useRootData } from "~/root";

export const meta: Route.MetaFunction = () => [{ title: "Join a shop · Sealwright" }];

const NewAccountSchema = z.object({ name: PersonName, password: NewPassword });

export async function loader({ request, params }: Route.LoaderArgs) {
  const invite = await findInvite(params.token);
  if (!invite.ok) return { invite: null, reason: invite.reason, signedInAs: null };
  const user = await getUser(request);
  return {
    invite: { teamName: invite.teamName, email: invite.email, role: invite.role, accountExists: invite.accountExists },
    reason: null,
    signedInAs: user?.email ?? null,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const formData = await request.formData();
  const intent = readIntent(formData, ["join", "create"], "create");
  // a refusal that is no field's: the message alone (what was typed is kept, the password never)
  const refuse = (status: number, message: string) =>
    data({ result: parseSubmission(formData, z.object({})).reply({ formErrors: [message], hideFields: ["password"] }) }, { status });
  const invite = await findInvite(params.token);
  if (!invite.ok) return refuse(410, INVITE_GONE);
  const user = await getUser(request);
  if (intent === "join") {
    // an account with the invited address: the shop is added to it, and this session moves to it
    if (!user) return refuse(400, "Sign in first, with the invited address.");
    await acceptInviteAsUser(invite, user);
    return startSession(request, user.id, invite.teamId, "/dashboard");
  }
  if (invite.accountExists) return refuse(400, "This address has an account: sign in to accept.");
  const submission = parseSubmission(formData, NewAccountSchema);
  if (submission.status !== "success") return data({ result: submission.reply({ hideFields: ["password"] }) }, { status: 400 });
  const created = await acceptInviteAsNewUser(invite, submission.value);
  return startSession(request, created.id, invite.teamId, "/dashboard");
}

const REASON = {
  unknown: "This invite link is not valid: it may have been withdrawn, or a newer invite replaced it.",
  used: "This invite link has been used already. Sign in instead.",
  expired: "This invite link has expired. Ask the shop to invite you again.",
} as const;

export default function Invite({ loaderData, actionData, params }: Route.ComponentProps) {
  const { invite, reason, signedInAs } = loaderData;
  const toast = useRootData()?.toast;
  const [form, fields] = useForm<z.input<typeof NewAccountSchema>>({
    id: "invite",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  if (!invite) {
    return (
      <AuthFrame toast={toast} title="Invite">
        <FormError message={REASON[reason ?? "unknown"]} />
        <p className="mt-4 text-sm">
          <Link className="text-copper-700 underline" to="/login">
            Sign in
          </Link>
        </p>
      </AuthFrame>
    );
  }
  const here = `/invite/${params.token}`;
  return (
    <AuthFrame toast={toast} title={`Join ${invite.teamName}`}>
      <p className="text-sm">
        You are invited as a <strong>{invite.role}</strong>, with the address <strong>{invite.email}</strong>.
      </p>
      <div className="mt-4 space-y-4">
        <ErrorSummary errors={form.allErrors} message={form.errors?.[0] ?? null} answer={actionData} />
        {invite.accountExists ? (
          signedInAs === invite.email ? (
            <Form method="post">
              <input type="hidden" name="intent" value="join" />
              <Button type="submit">Join {invite.teamName}</Button>
            </Form>
          ) : (
            <p className="text-sm">
              {signedInAs ? `You are signed in as ${signedInAs}. ` : ""}This address has a Sealwright account:{" "}
              <Link className="text-copper-700 underline" to={`/login?redirectTo=${encodeURIComponent(here)}`}>
                sign in as {invite.email}
              </Link>{" "}
              to accept.
            </p>
          )
        ) : (
          <Form method="post" className="space-y-4" {...getFormProps(form)}>
            <input type="hidden" name="intent" value="create" />
            <Field
              label="Your name"
              name={fields.name.name}
              autoComplete="name"
              required
              defaultValue={fields.name.initialValue}
              error={fields.name.errors?.[0]}
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
            <Button type="submit">Create my account and join</Button>
          </Form>
        )}
      </div>
    </AuthFrame>
  );
}
