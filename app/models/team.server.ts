import { type DbRow, teamTransaction, withTeam } from "~/utils/db.server";
import type { Role } from "./user.server";
import type { Asker } from "./viewer-scope.server";
import { recordAudit } from "./audit.server";

export interface MemberRow {
  userId: number;
  name: string;
  email: string;
  role: Role;
}

export async function listMembers(teamId: number): Promise<MemberRow[]> {
  return withTeam(teamId, (k) =>
    k("memberships as m")
      .join("users as u", "u.id", "m.user_id")
      .where("m.team_id", teamId)
      .orderBy([{ column: "m.role", order: "asc" }, { column: "u.name" }, { column: "u.id" }])
      .select({ userId: "u.id", name: "u.name", email: "u.email", role: "m.role" }),
  );
}

export async function renameTeam(teamId: number, name: string, byUserId: number): Promise<void> {
  await teamTransaction(teamId, async (trx) => {
    await trx("teams").where({ id: teamId }).update({ name: name.trim() });
    await recordAudit(trx, teamId, byUserId, "team.renamed", { name });
  });
}

/**
 * The shop's recent activity as the asker may see it: a viewer sees none, because the log names the
 * shop's other engines and customers.
 */
export async function recentActivity(who: Asker, limit = 20) {
  return who.role === "viewer" ? [] : listAuditEvents(who.teamId, limit);
}

export async function listAuditEvents(teamId: number, limit = 20) {
  return withTeam(teamId, (k) =>
    k("audit_events as a")
      .leftJoin("users as u", "u.id", "a.user_id")
      .where("a.team_id", teamId)
      .orderBy("a.id", "desc")
      .limit(limit)
      .select({ id: "a.id", action: "a.action", at: "a.created_at", who: "u.name", detail: "a.detail" }),
  );
}

/** What an audit row's detail names (engine and plan ids, a name), read leniently: old rows have none. */
export function auditSubject(detail: unknown): { engineId?: number; planId?: number; name?: string } {
  if (typeof detail !== "string" || detail === "") return {};
  try {
    const d = JSON.parse(detail) as Record<string, unknown>;
    const int = (x: unknown) => (typeof x === "number" && Number.isInteger(x) ? x : undefined);
    return { engineId: int(d.engineId), planId: int(d.planId), name: typeof d.name === "string" ? d.name : undefined };
  } catch {
    return {};
  }
}

/** Of these plan ids, the ones that still exist (not archived) in this team, with their engine and name. */
export async function livePlans(teamId: number, planIds: number[]): Promise<Map<number, { engineId: number; name: string }>> {
  if (planIds.length === 0) return new Map();
  const rows = await withTeam(teamId, (k) =>
    k("seal_plans as p")
      .join("engines as e", "e.id", "p.engine_id")
      .where("p.team_id", teamId)
      .whereIn("p.id", planIds)
      .whereNull("p.archived_at")
      .whereNull("e.archived_at")
      .select("p.id", "p.engine_id", "p.name"),
  );
  return new Map(rows.map((r: DbRow) => [r.id as number, { engineId: r.engine_id as number, name: r.name as string }]));
}
