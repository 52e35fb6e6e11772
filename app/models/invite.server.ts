import type { Knex } from "knex";
import { data } from "react-router";
import { INVITE_DAYS } from "~/lib/mail/messages";
import { db, now, withScope, withTeam, writeTransaction } from "~/utils/db.server";
import { hashPassword } from "~/utils/password.server";
import { hashLinkToken, isLinkToken, newLinkToken } from "~/utils/tokens.server";
import { insertUser, normalizeEmail, type Role, type UserRow } from "./user.server";
import { recordAudit } from "./audit.server";

const DAY_MS = 86_400_000;

export interface PendingInvite {
  id: number;
  email: string;
  role: Role;
  invitedBy: string | null;
  expiresAt: string;
}

/** The invite a link names, with why it cannot be used when it cannot. */
export type InviteLookup =
  | { ok: true; id: number; teamId: number; teamName: string; email: string; role: Role; accountExists: boolean }
  | { ok: false; reason: "unknown" | "used" | "expired" };

export class InviteError extends Error {
  constructor(public errors: Record<string, string>) {
    super("invite refused");
  }
}

/**
 * A new invite for this address to this team, replacing any pending one for the same address. Returns
 * the token for the e-mail link (only its hash is kept). An address already in the team is refused.
 */
export async function createInvite(
  teamId: number,
  byUserId: number,
  input: { email: string; role: Role },
): Promise<{ token: string; id: number }> {
  const email = normalizeEmail(input.email);
  const { token, hash } = newLinkToken();
  return writeTransaction(
    async (trx) => {
      const member = await trx("memberships as m")
        .join("users as u", "u.id", "m.user_id")
        .where({ "m.team_id": teamId, "u.email": email })
        .first("u.id");
      if (member) throw new InviteError({ email: "This address is already a member of the shop" });
      const at = new Date();
      await trx("team_invites")
        .where({ team_id: teamId, email })
        .whereNull("accepted_at")
        .whereNull("revoked_at")
        .update({ revoked_at: at.toISOString() });
      const [{ id }] = await trx("team_invites")
        .insert({
          team_id: teamId,
          email,
          role: input.role,
          token_hash: hash,
          invited_by: byUserId,
          created_at: at.toISOString(),
          expires_at: new Date(at.getTime() + INVITE_DAYS * DAY_MS).toISOString(),
        })
        .returning("id");
      await recordAudit(trx, teamId, byUserId, "member.invited", { email, role: input.role });
      return { token, id: id as number };
    },
    { teamId },
  );
}

/** Invites of this team not yet accepted, revoked or expired. */
export async function listPendingInvites(teamId: number): Promise<PendingInvite[]> {
  return withTeam(teamId, (k) =>
    k("team_invites as i")
      .leftJoin("users as u", "u.id", "i.invited_by")
      .where("i.team_id", teamId)
      .whereNull("i.accepted_at")
      .whereNull("i.revoked_at")
      .where("i.expires_at", ">", now())
      .orderBy("i.id", "desc")
      .select({ id: "i.id", email: "i.email", role: "i.role", invitedBy: "u.name", expiresAt: "i.expires_at" }),
  );
}

/** Withdraws a pending invite of this team; another team's (or a used one) is not found. */
export async function revokeInvite(teamId: number, byUserId: number, inviteId: number): Promise<void> {
  await writeTransaction(
    async (trx) => {
      const n = await trx("team_invites")
        .where({ team_id: teamId, id: inviteId })
        .whereNull("accepted_at")
        .whereNull("revoked_at")
        .update({ revoked_at: now() });
      if (n === 0) throw data("No such invite in this shop.", { status: 404 });
      await recordAudit(trx, teamId, byUserId, "member.invite-withdrawn", { inviteId });
    },
    { teamId },
  );
}

export async function findInvite(token: string | undefined): Promise<InviteLookup> {
  if (!isLinkToken(token)) return { ok: false, reason: "unknown" };
  const tokenHash = hashLinkToken(token);
  // row security: the invite is found by its link's hash alone (team_invites_by_hash)
  const row = await withScope({ tokenHash }, (k) =>
    k("team_invites as i").join("teams as t", "t.id", "i.team_id").where("i.token_hash", tokenHash).first("i.*", { team_name: "t.name" }),
  );
  if (!row || row.revoked_at) return { ok: false, reason: "unknown" };
  if (row.accepted_at) return { ok: false, reason: "used" };
  if (Date.parse(row.expires_at) <= Date.now()) return { ok: false, reason: "expired" };
  const account = await db()("users").where({ email: row.email }).first("id");
  return {
    ok: true,
    id: row.id,
    teamId: row.team_id,
    teamName: row.team_name,
    email: row.email,
    role: row.role,
    accountExists: Boolean(account),
  };
}

/** Marks the invite used, inside the caller's transaction; false when it was used, withdrawn or expired meanwhile. */
async function claim(trx: Knex.Transaction, inviteId: number): Promise<boolean> {
  const n = await trx("team_invites")
    .where({ id: inviteId })
    .whereNull("accepted_at")
    .whereNull("revoked_at")
    .where("expires_at", ">", now())
    .update({ accepted_at: now() });
  return n === 1;
}

async function join(trx: Knex.Transaction, invite: Extract<InviteLookup, { ok: true }>, userId: number) {
  const already = await trx("memberships").where({ user_id: userId, team_id: invite.teamId }).first("role");
  if (!already) await trx("memberships").insert({ user_id: userId, team_id: invite.teamId, role: invite.role, created_at: now() });
  await recordAudit(trx, invite.teamId, userId, "member.joined", { role: invite.role });
}

export const INVITE_GONE = "This invite link has been used, withdrawn or has expired. Ask the shop for a new one.";

/** Accepts for a person who has an account with the invited address: the shop is added to it. */
export async function acceptInviteAsUser(invite: Extract<InviteLookup, { ok: true }>, user: UserRow): Promise<void> {
  if (normalizeEmail(user.email) !== invite.email)
    throw data(`This invite is for ${invite.email}; you are signed in as ${user.email}.`, { status: 403 });
  await writeTransaction(
    async (trx) => {
      if (!(await claim(trx, invite.id))) throw data(INVITE_GONE, { status: 410 });
      await join(trx, invite, user.id);
    },
    { teamId: invite.teamId },
  );
}

/** Accepts by making the account: the invited address, the name and password given. */
export async function acceptInviteAsNewUser(
  invite: Extract<InviteLookup, { ok: true }>,
  input: { name: string; password: string },
): Promise<UserRow> {
  const passwordHash = await hashPassword(input.password);
  return writeTransaction(
    async (trx) => {
      if (!(await claim(trx, invite.id))) throw data(INVITE_GONE, { status: 410 });
      if (await trx("users").where({ email: invite.email }).first("id"))
        throw data("This address has an account now: sign in to accept.", { status: 409 });
      const user = await insertUser(trx, { email: invite.email, name: input.name, passwordHash });
      await join(trx, invite, user.id);
      return user;
    },
    { teamId: invite.teamId },
  );
}
