import type { Knex } from "knex";

// The one way a write leaves its audit row: inside the write's own transaction (`writeTransaction` in
// app/utils/db.server.ts), so the row and its audit line land together or not at all. Imported by the
// seed files with a relative path (through library-seed.server.ts), so nothing here may use the "~" alias.

/**
 * Adds one audit_events row for the team and moves the team's data version (team-version.server.ts) in
 * the same transaction; `userId` null for the seed and other work no person did.
 */
export async function recordAudit(
  trx: Knex.Transaction | Knex,
  teamId: number,
  userId: number | null,
  action: string,
  detail: object = {},
  at: string = new Date().toISOString(),
): Promise<void> {
  await trx("audit_events").insert({ team_id: teamId, user_id: userId, action, detail: JSON.stringify(detail), created_at: at });
  await trx("teams").where({ id: teamId }).increment("data_version", 1);
}
