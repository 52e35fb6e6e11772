import { db, now } from "~/utils/db.server";
import type { Role } from "./user.server";

export interface MemberRow {
  userId: number;
  name: string;
  email: string;
  role: Role;
}

export async function getTeam(teamId: number): Promise<{ id: number; name: string } | null> {
  return (await db()("teams").select("id", "name").where({ id: teamId }).first()) ?? null;
}

export async function listMembers(teamId: number): Promise<MemberRow[]> {
  return db()("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .where("m.team_id", teamId)
    .orderBy([{ column: "m.role", order: "asc" }, { column: "u.name" }])
    .select({ userId: "u.id", name: "u.name", email: "u.email", role: "m.role" });
}

export async function renameTeam(teamId: number, name: string, byUserId: number): Promise<void> {
  await db().transaction(async (trx) => {
    await trx("teams").where({ id: teamId }).update({ name: name.trim() });
    await trx("audit_events").insert({
      team_id: teamId,
      user_id: byUserId,
      action: "team.renamed",
      detail: JSON.stringify({ name }),
      created_at: now(),
    });
  });
}

export async function listAuditEvents(teamId: number, limit = 20) {
  return db()("audit_events as a")
    .leftJoin("users as u", "u.id", "a.user_id")
    .where("a.team_id", teamId)
    .orderBy("a.id", "desc")
    .limit(limit)
    .select({ id: "a.id", action: "a.action", at: "a.created_at", who: "u.name" });
}
