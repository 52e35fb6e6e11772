import { teamTransaction } from "~/utils/db.server";

// Everything one shop owns, as one consistent JSON document (an owner's backup of the team's data).
// Read inside one transaction, so a write landing meanwhile is either wholly in it or not at all.
// Secrets stay out: no password hashes, no session rows.

export const TEAM_EXPORT_VERSION = 1;

// files: the rows (names, types, sizes); the bytes stay in the file storage
const TEAM_TABLES = [
  "materials",
  "fasteners",
  "gaskets",
  "engines",
  "seal_plans",
  "assemblies",
  "machining_records",
  "runs",
  "files",
  "audit_events",
] as const;

export interface TeamExport {
  format: "sealwright-team-export";
  version: number;
  exportedAt: string;
  team: { id: number; name: string; created_at: string };
  members: { email: string; name: string; role: string }[];
  tables: Record<(typeof TEAM_TABLES)[number], Record<string, unknown>[]>;
}

export async function exportTeam(teamId: number): Promise<TeamExport> {
  return teamTransaction(teamId, async (trx) => {
    const team = await trx("teams").where({ id: teamId }).first("id", "name", "created_at");
    const members = await trx("memberships as m")
      .join("users as u", "u.id", "m.user_id")
      .where("m.team_id", teamId)
      .orderBy("u.email")
      .select("u.email", "u.name", "m.role");
    const tables = {} as TeamExport["tables"];
    for (const table of TEAM_TABLES) tables[table] = await trx(table).where({ team_id: teamId }).orderBy("id");
    return { format: "sealwright-team-export", version: TEAM_EXPORT_VERSION, exportedAt: new Date().toISOString(), team, members, tables };
  });
}
