import type { Knex } from "knex";

// Indexes for the hot queries (issue 14), with Knex's schema builder so PostgreSQL runs the same file:
// each names the query it serves; tests/integration/query-plans.sqlite.test.ts reads EXPLAIN QUERY PLAN for them.
const INDEXES: { table: string; columns: string[]; name: string }[] = [
  // dashboard activity: the team's newest rows by id (the (team_id, created_at) index sorts by time)
  { table: "audit_events", columns: ["team_id", "id"], name: "audit_events_team_id_id_index" },
  // foreign key without a leading index: deleting or anonymising a user
  { table: "audit_events", columns: ["user_id"], name: "audit_events_user_id_index" },
  // engine list (default sort: last touched) and the dashboard's chosen-plan verdicts
  { table: "engines", columns: ["team_id", "archived_at", "updated_at"], name: "engines_team_archived_updated_index" },
  // engine list sorted by name, and the engine choices
  { table: "engines", columns: ["team_id", "archived_at", "name"], name: "engines_team_archived_name_index" },
  // foreign keys from engines to materials (a material in use cannot be removed: the check looks here)
  { table: "engines", columns: ["block_material_id"], name: "engines_block_material_id_index" },
  { table: "engines", columns: ["head_material_id"], name: "engines_head_material_id_index" },
  { table: "engines", columns: ["sleeve_material_id"], name: "engines_sleeve_material_id_index" },
  { table: "fasteners", columns: ["material_id"], name: "fasteners_material_id_index" },
  // foreign keys from plans: engine (ON DELETE CASCADE), gasket and fastener
  { table: "seal_plans", columns: ["engine_id"], name: "seal_plans_engine_id_index" },
  { table: "seal_plans", columns: ["gasket_id"], name: "seal_plans_gasket_id_index" },
  { table: "seal_plans", columns: ["fastener_id"], name: "seal_plans_fastener_id_index" },
  // sessions and memberships by team (team deletion, the team's people)
  { table: "sessions", columns: ["team_id"], name: "sessions_team_id_index" },
  { table: "memberships", columns: ["team_id"], name: "memberships_team_id_index" },
];

export async function up(knex: Knex): Promise<void> {
  for (const i of INDEXES) await knex.schema.alterTable(i.table, (t) => void t.index(i.columns, i.name));
}

export async function down(knex: Knex): Promise<void> {
  for (const i of [...INDEXES].reverse()) await knex.schema.alterTable(i.table, (t) => void t.dropIndex(i.columns, i.name));
}
