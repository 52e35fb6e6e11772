import type { Knex } from "knex";
import { data } from "react-router";
import { writeTransaction } from "~/utils/db.server";
import type { Role } from "./user.server";
import { recordAudit } from "./audit.server";

// Changing a member's role and removing a member. The shop always keeps at least one owner.

export class LastOwnerError extends Error {
  constructor() {
    super("The shop needs at least one owner: make another member an owner first.");
  }
}

async function membershipOf(trx: Knex.Transaction, teamId: number, userId: number): Promise<Role> {
  const row = await trx("memberships").where({ team_id: teamId, user_id: userId }).first("role");
  if (!row) throw data("No such member in this shop.", { status: 404 });
  return row.role as Role;
}

async function otherOwners(trx: Knex.Transaction, teamId: number, userId: number): Promise<number> {
  const [{ n }] = await trx("memberships")
    .where({ team_id: teamId, role: "owner" })
    .whereNot({ user_id: userId })
    .count<{ n: number }[]>({ n: "*" });
  return Number(n);
}

export async function changeRole(teamId: number, byUserId: number, userId: number, role: Role): Promise<void> {
  await writeTransaction(
    async (trx) => {
      const current = await membershipOf(trx, teamId, userId);
      if (current === role) return;
      if (current === "owner" && (await otherOwners(trx, teamId, userId)) === 0) throw new LastOwnerError();
      await trx("memberships").where({ team_id: teamId, user_id: userId }).update({ role });
      await recordAudit(trx, teamId, byUserId, "member.role-changed", { userId, role });
    },
    { teamId },
  );
}

/** Takes the person out of the shop: their membership, the engines shared with them there, and their sessions in it. */
export async function removeMember(teamId: number, byUserId: number, userId: number): Promise<void> {
  await writeTransaction(
    async (trx) => {
      const current = await membershipOf(trx, teamId, userId);
      if (current === "owner" && (await otherOwners(trx, teamId, userId)) === 0) throw new LastOwnerError();
      await trx("memberships").where({ team_id: teamId, user_id: userId }).delete();
      await trx("engine_shares").where({ team_id: teamId, user_id: userId }).delete();
      await trx("sessions").where({ team_id: teamId, user_id: userId }).delete();
      await recordAudit(trx, teamId, byUserId, "member.removed", { userId });
    },
    { teamId },
  );
}
