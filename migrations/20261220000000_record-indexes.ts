import type { Knex } from "knex";

// A leading index for every foreign key the team, records and API tables brought (the rule
// tests/integration/query-plans.sqlite.test.ts keeps): joins and deletes from the parent side, and the
// engine-scoped lists (an engine's assemblies, runs and files; a viewer's shared engines).
const INDEXES: { table: string; columns: string[]; name: string }[] = [
  { table: "team_invites", columns: ["invited_by"], name: "team_invites_invited_by_index" },
  { table: "engine_shares", columns: ["user_id"], name: "engine_shares_user_id_index" },
  { table: "engine_shares", columns: ["shared_by"], name: "engine_shares_shared_by_index" },
  { table: "api_tokens", columns: ["team_id"], name: "api_tokens_team_id_index" },
  { table: "assemblies", columns: ["engine_id"], name: "assemblies_engine_id_index" },
  { table: "assemblies", columns: ["plan_id"], name: "assemblies_plan_id_index" },
  { table: "assemblies", columns: ["created_by"], name: "assemblies_created_by_index" },
  { table: "runs", columns: ["engine_id"], name: "runs_engine_id_index" },
  { table: "runs", columns: ["plan_id"], name: "runs_plan_id_index" },
  { table: "runs", columns: ["created_by"], name: "runs_created_by_index" },
  { table: "files", columns: ["engine_id"], name: "files_engine_id_index" },
  { table: "files", columns: ["assembly_id"], name: "files_assembly_id_index" },
  { table: "files", columns: ["run_id"], name: "files_run_id_index" },
  { table: "files", columns: ["created_by"], name: "files_created_by_index" },
];

export async function up(knex: Knex): Promise<void> {
  for (const i of INDEXES) await knex.schema.alterTable(i.table, (t) => void t.index(i.columns, i.name));
}

export async function down(knex: Knex): Promise<void> {
  for (const i of [...INDEXES].reverse()) await knex.schema.alterTable(i.table, (t) => void t.dropIndex(i.columns, i.name));
}
