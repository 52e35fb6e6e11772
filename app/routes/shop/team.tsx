import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { data, Form } from "react-router";
import type { z } from "zod";
import type { Route } from "./+types/team";
import { PageTitle } from "~/components/app-shell";
import { Button, ErrorSummary, Field, SelectField } from "~/components/form";
import { INVITE_DAYS, inviteMail } from "~/lib/mail/messages";
import { InviteSchema, MemberSchema, RevokeInviteSchema, RoleSchema, TeamNameSchema } from "~/lib/team/forms";
import { ROLES_HIGH_FIRST } from "~/lib/team/roles";
import { createInvite, InviteError, listPendingInvites, revokeInvite } from "~/models/invite.server";
import { changeRole, LastOwnerError, removeMember } from "~/models/member.server";
import { listMembers, renameTeam } from "~/models/team.server";
import { requireRole } from "~/utils/auth.server";
import { parseSubmission, readIntent } from "~/utils/conform.server";
import { appUrl } from "~/utils/env.server";
import { sendMail } from "~/utils/mail.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Team · Sealwright" }];

const ROLE_OPTIONS: [string, string][] = [
  ["viewer", "Viewer — sees the engines shared with them"],
  ["builder", "Builder — engines, plans, libraries"],
  ["owner", "Owner — everything, and this page"],
];
// Which schema reads each button's post.
const SCHEMA = { rename: TeamNameSchema, invite: InviteSchema, role: RoleSchema, remove: MemberSchema, revoke: RevokeInviteSchema };
type Intent = keyof typeof SCHEMA;
const ROW_INTENTS: readonly Intent[] = ["role", "remove", "revoke"];

export async function loader({ request }: Route.LoaderArgs) {
  const { team, user } = await requireRole(request, "owner");
  const [members, invites] = await Promise.all([listMembers(team.id), listPendingInvites(team.id)]);
  return { team, me: user.id, members, invites };
}

async function done(request: Request, message: string) {
  return redirectWithToast(request, "/team", message);
}

export async function action({ request }: Route.ActionArgs) {
  const { team, user } = await requireRole(request, "owner");
  const formData = await request.formData();
  const intent = readIntent(formData, ["rename", "invite", "role", "remove", "revoke"], "rename");
  const submission = parseSubmission(formData, SCHEMA[intent]);
  const refuse = (options: { fieldErrors?: Record<string, string[]>; formErrors?: string[] } = {}) =>
    data({ intent, result: submission.reply(options) }, { status: 400 });
  if (submission.status !== "success") return refuse();
  try {
    switch (intent) {
      case "invite": {
        const invite = submission.value as z.output<typeof InviteSchema>;
        const { token } = await createInvite(team.id, user.id, invite);
        const link = `${appUrl()}/invite/${token}`;
        try {
          await sendMail(invite.email, inviteMail({ teamName: team.name, inviterName: user.name, role: invite.role, link }));
        } catch (error) {
          return refuse({
            formErrors: [
              `The invite is made, but the mail could not be sent (${(error as Error).message}). Check the SMTP settings, withdraw it and invite again.`,
            ],
          });
        }
        return done(request, `Invite sent to ${invite.email}; the link works once, for ${INVITE_DAYS} days.`);
      }
      case "role": {
        const { userId, role } = submission.value as z.output<typeof RoleSchema>;
        await changeRole(team.id, user.id, userId, role);
        return done(request, "Role changed.");
      }
      case "remove": {
        await removeMember(team.id, user.id, (submission.value as z.output<typeof MemberSchema>).userId);
        return done(request, "Member removed; their sessions in this shop have ended.");
      }
      case "revoke": {
        await revokeInvite(team.id, user.id, (submission.value as z.output<typeof RevokeInviteSchema>).inviteId);
        return done(request, "Invite withdrawn.");
      }
      default: {
        await renameTeam(team.id, (submission.value as z.output<typeof TeamNameSchema>).name, user.id);
        return done(request, "Shop renamed.");
      }
    }
  } catch (error) {
    if (error instanceof InviteError)
      return refuse({ fieldErrors: Object.fromEntries(Object.entries(error.errors).map(([name, message]) => [name, [message]])) });
    if (error instanceof LastOwnerError) return refuse({ formErrors: [error.message] });
    throw error;
  }
}

/** The first message of an answer, form-level or a field's (the member rows' fields are hidden or unlabelled). */
function firstMessage(result: SubmissionResult<string[]> | undefined): string | null {
  return Object.values(result?.error ?? {}).flatMap((list) => list ?? [])[0] ?? null;
}

export default function TeamPage({ loaderData, actionData }: Route.ComponentProps) {
  const { team, me, members, invites } = loaderData;
  const answerFor = (intent: Intent) => (actionData?.intent === intent ? actionData.result : undefined);
  const rowAnswer = actionData && ROW_INTENTS.includes(actionData.intent) ? actionData.result : undefined;
  const [rename, renameFields] = useForm<z.input<typeof TeamNameSchema>>({
    id: "rename",
    defaultValue: { name: team.name },
    lastResult: answerFor("rename"),
    shouldValidate: "onSubmit",
  });
  return (
    <>
      <PageTitle sub="Who works in this shop and what they may do.">Team</PageTitle>
      <ErrorSummary message={firstMessage(rowAnswer)} answer={rowAnswer} />
      <div className="max-w-4xl overflow-x-auto" tabIndex={0} role="region" aria-label="members (scrolls sideways)">
        <table className="w-full border-collapse bg-white text-left">
          <caption className="sr-only">Members of {team.name}</caption>
          <thead className="bg-forge-100 text-sm">
            <tr>
              <th scope="col" className="px-3 py-2">
                Name
              </th>
              <th scope="col" className="px-3 py-2">
                E-mail
              </th>
              <th scope="col" className="px-3 py-2">
                Role
              </th>
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.userId} className="border-t border-forge-100">
                <td className="px-3 py-2">
                  {m.name}
                  {m.userId === me ? " (you)" : ""}
                </td>
                <td className="px-3 py-2 break-all">{m.email}</td>
                <td className="px-3 py-2">
                  <Form method="post" className="flex items-center gap-2">
                    <input type="hidden" name="intent" value="role" />
                    <input type="hidden" name="userId" value={m.userId} />
                    <label htmlFor={`role-${m.userId}`} className="sr-only">
                      Role of {m.name}
                    </label>
                    <select
                      id={`role-${m.userId}`}
                      name="role"
                      defaultValue={m.role}
                      className="rounded border border-forge-300 px-2 py-1 capitalize"
                    >
                      {ROLES_HIGH_FIRST.map((r) => (
                        <option key={r} value={r}>
                          {r}
                        </option>
                      ))}
                    </select>
                    <Button type="submit" kind="plain" aria-label={`Change the role of ${m.name}`}>
                      Change
                    </Button>
                  </Form>
                </td>
                <td className="px-3 py-2">
                  <Form method="post">
                    <input type="hidden" name="intent" value="remove" />
                    <input type="hidden" name="userId" value={m.userId} />
                    <Button type="submit" kind="plain" aria-label={`Remove ${m.name} from the shop`}>
                      Remove
                    </Button>
                  </Form>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <section aria-labelledby="invite-title" className="mt-8 max-w-xl rounded border border-forge-100 bg-white p-4">
        <h2 id="invite-title" className="text-xl font-bold">
          Invite someone
        </h2>
        <p className="mt-1 text-sm text-forge-700">
          They get an e-mail with a link that works once, for {INVITE_DAYS} days. A customer is a viewer: they see only the engines you
          share with them.
        </p>
        {/* a new key after each invite made empties the form for the next one; a refusal keeps it mounted */}
        <InviteForm key={invites[0]?.id ?? 0} lastResult={answerFor("invite")} answer={actionData} />
        {invites.length ? (
          <ul className="mt-4 space-y-2 text-sm" aria-label="Invites not yet accepted">
            {invites.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center gap-2">
                <span className="break-all">
                  {i.email} as {i.role}, until {i.expiresAt.slice(0, 10)}
                </span>
                <Form method="post">
                  <input type="hidden" name="intent" value="revoke" />
                  <input type="hidden" name="inviteId" value={i.id} />
                  <Button type="submit" kind="plain" aria-label={`Withdraw the invite to ${i.email}`}>
                    Withdraw
                  </Button>
                </Form>
              </li>
            ))}
          </ul>
        ) : null}
      </section>

      <p className="mt-6">
        {/* a plain link: the browser saves the file */}
        <a href="/team/export" className="text-copper-700 underline" download>
          Download the shop's data (JSON)
        </a>{" "}
        <span className="text-sm text-forge-700">— engines, plans, libraries and the activity log, for your own backup.</span>
      </p>
      <Form method="post" className="mt-8 max-w-xl" {...getFormProps(rename)}>
        <ErrorSummary errors={rename.allErrors} message={rename.errors?.[0] ?? null} answer={answerFor("rename")} />
        <div className="flex items-end gap-3">
          <Field
            className="flex-1"
            label="Shop name"
            name={renameFields.name.name}
            defaultValue={renameFields.name.initialValue}
            error={renameFields.name.errors?.[0]}
          />
          <Button type="submit">Rename</Button>
        </div>
      </Form>
    </>
  );
}

function InviteForm({ lastResult, answer }: { lastResult: SubmissionResult<string[]> | undefined; answer: unknown }) {
  const [form, fields] = useForm<z.input<typeof InviteSchema>>({
    id: "invite",
    defaultValue: { role: "viewer" },
    lastResult,
    shouldValidate: "onSubmit",
  });
  return (
    <Form method="post" className="mt-3 space-y-3" {...getFormProps(form)}>
      <ErrorSummary errors={form.allErrors} message={form.errors?.[0] ?? null} answer={lastResult ? answer : null} />
      <input type="hidden" name="intent" value="invite" />
      <Field
        label="E-mail"
        name={fields.email.name}
        type="email"
        required
        defaultValue={fields.email.initialValue}
        error={fields.email.errors?.[0]}
      />
      <SelectField
        label="Role"
        name={fields.role.name}
        options={ROLE_OPTIONS}
        defaultValue={fields.role.initialValue}
        error={fields.role.errors?.[0]}
      />
      <Button type="submit">Send the invite</Button>
    </Form>
  );
}
