import type { Knex } from "knex";

// The dashboard's engine counts by status (engineStatusCounts: the team's engines not archived, grouped
// by status) read off one index that holds every column the count needs, in the order of the groups,
// rather than the table: a covering index on (team_id, status, archived_at). Status before archived_at
// on purpose: an index on (team_id, archived_at, status) matches the dashboard's other engine queries
// as well as (team_id, archived_at, updated_at) does, and SQLite without ANALYZE statistics took it
// for the chosen-plan list, sorting every engine of the team in a temp b-tree instead of reading them
// in updated_at order. Knex's schema builder: the same on SQLite and PostgreSQL.
const TABLE = "engines";
const COLUMNS = ["team_id", "status", "archived_at"];
const NAME = "engines_team_status_archived_index";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable(TABLE, (t) => void t.index(COLUMNS, NAME));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable(TABLE, (t) => void t.dropIndex(COLUMNS, NAME));
}
