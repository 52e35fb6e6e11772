import { data, Form } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/team";
import { PageTitle } from "~/components/app-shell";
import { Button, Field, FormError, SelectField } from "~/components/form";
import { INVITE_DAYS, inviteMail } from "~/lib/mail/messages";
import { ROLES, ROLES_HIGH_FIRST } from "~/lib/team/roles";
import { createInvite, InviteError, listPendingInvites, revokeInvite } from "~/models/invite.server";
import { changeRole, LastOwnerError, removeMember } from "~/models/member.server";
import { listMembers, renameTeam } from "~/models/team.server";
import { requireRole } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { appUrl } from "~/utils/env.server";
import { sendMail } from "~/utils/mail.server";
import { redirectWithToast } from "~/utils/toast.server";
import { fieldErrors } from "~/utils/field-errors";

export const meta: Route.MetaFunction = () => [{ title: "Team · Sealwright" }];

const ROLE_OPTIONS: [string, string][] = [
  ["viewer", "Viewer — sees the engines shared with them"],
  ["builder", "Builder — engines, plans, libraries"],
  ["owner", "Owner — everything, and this page"],
];
const Role = z.enum(ROLES, "Pick owner, builder or viewer");
const Id = z.coerce.number({ error: "No such member" }).int().positive();

const TeamNameSchema = z.object({ name: z.string().trim().min(1, "Name the shop").max(120, "Keep the shop name under 120 characters") });
const InviteSchema = z.object({ email: z.email("Enter an e-mail address like name@shop.example").max(254), role: Role });
const RoleSchema = z.object({ userId: Id, role: Role });
const MemberSchema = z.object({ userId: Id });
const RevokeSchema = z.object({ inviteId: Id });

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
  const form = Object.fromEntries(await request.formData());
  const refuse = (errors: Record<string, string>, error: string | null = null) =>
    data({ intent, errors, error, values: form }, { status: 400 });
  const intent = readIntent(form, ["rename", "invite", "role", "remove", "revoke"], "rename");
  try {
    switch (intent) {
      case "invite": {
        const parsed = InviteSchema.safeParse(form);
        if (!parsed.success) return refuse(fieldErrors(parsed.error.issues));
        const { token } = await createInvite(team.id, user.id, parsed.data);
        const link = `${appUrl()}/invite/${token}`;
        try {
          await sendMail(parsed.data.email, inviteMail({ teamName: team.name, inviterName: user.name, role: parsed.data.role, link }));
        } catch (error) {
          return refuse(
            {},
            `The invite is made, but the mail could not be sent (${(error as Error).message}). Check the SMTP settings, withdraw it and invite again.`,
          );
        }
        return done(request, `Invite sent to ${parsed.data.email}; the link works once, for ${INVITE_DAYS} days.`);
      }
      case "role": {
        const parsed = RoleSchema.safeParse(form);
        if (!parsed.success) return refuse(fieldErrors(parsed.error.issues));
        await changeRole(team.id, user.id, parsed.data.userId, parsed.data.role);
        return done(request, "Role changed.");
      }
      case "remove": {
        const parsed = MemberSchema.safeParse(form);
        if (!parsed.success) return refuse(fieldErrors(parsed.error.issues));
        await removeMember(team.id, user.id, parsed.data.userId);
        return done(request, "Member removed; their sessions in this shop have ended.");
      }
      case "revoke": {
        const parsed = RevokeSchema.safeParse(form);
        if (!parsed.success) return refuse(fieldErrors(parsed.error.issues));
        await revokeInvite(team.id, user.id, parsed.data.inviteId);
        return done(request, "Invite withdrawn.");
      }
      default: {
        const parsed = TeamNameSchema.safeParse(form);
        if (!parsed.success) return refuse(fieldErrors(parsed.error.issues));
        await renameTeam(team.id, parsed.data.name, user.id);
        return done(request, "Shop renamed.");
      }
    }
  } catch (error) {
    if (error instanceof InviteError) return refuse(error.errors);
    if (error instanceof LastOwnerError) return refuse({}, error.message);
    throw error;
  }
}

export default function TeamPage({ loaderData, actionData }: Route.ComponentProps) {
  const { team, me, members, invites } = loaderData;
  const errorsFor = (intent: string) => (actionData?.intent === intent ? actionData.errors : {}) as Record<string, string | undefined>;
  return (
    <>
      <PageTitle sub="Who works in this shop and what they may do.">Team</PageTitle>
      <FormError message={actionData?.error} />
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
        {/* a new key after each invite empties the form for the next one */}
        <Form method="post" className="mt-3 space-y-3" key={invites[0]?.id ?? 0}>
          <input type="hidden" name="intent" value="invite" />
          <Field
            label="E-mail"
            name="email"
            type="email"
            required
            defaultValue={actionData?.intent === "invite" ? String(actionData.values.email ?? "") : undefined}
            error={errorsFor("invite").email}
          />
          <SelectField label="Role" name="role" options={ROLE_OPTIONS} defaultValue="viewer" error={errorsFor("invite").role} />
          <Button type="submit">Send the invite</Button>
        </Form>
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
      <Form method="post" className="mt-8 flex max-w-xl items-end gap-3">
        <Field className="flex-1" label="Shop name" name="name" defaultValue={team.name} error={errorsFor("rename").name} />
        <Button type="submit">Rename</Button>
      </Form>
    </>
  );
}
