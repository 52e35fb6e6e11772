import { db } from "~/utils/db.server";

/**
 * The team's data version: a counter on its row that every write to the team's records (engines, plans,
 * library items, shares, members and roles, files, records) moves inside the write's own transaction, as
 * it leaves its audit row (recordAudit). The bump locks the team row, so writers are counted in commit
 * order: once a version is read, every write counted up to it has committed (migration
 * 20261226000000_team-data-version says why the newest audit id was not enough on PostgreSQL). Read
 * from the database, so every app process sees the same version (docs/hosting.md). 0 for a new team.
 */
export async function teamDataVersion(teamId: number): Promise<number> {
  const row = await db()("teams").where({ id: teamId }).first("data_version");
  return Number(row?.data_version ?? 0);
}
