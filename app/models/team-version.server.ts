import { withTeam } from "~/utils/db.server";

/**
 * The team's data version: its newest audit row's id. Every write to a team's records (engines, plans,
 * library items, shares, members and roles, files, records) leaves its audit row inside the write's own
 * transaction (recordAudit), so this number moves with, and only after, every committed write. Read from
 * the database, so every app process sees the same version (docs/hosting.md). 0 for a team with no rows.
 */
export async function teamDataVersion(teamId: number): Promise<number> {
  const row = await withTeam(teamId, (k) => k("audit_events").where({ team_id: teamId }).max({ version: "id" }).first());
  return Number(row?.version ?? 0);
}
