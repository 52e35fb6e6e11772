import type { Knex } from "knex";

// The hosted path (docs/hosting.md), PostgreSQL only; on SQLite this migration does nothing (one shop,
// one file: the rate-limit store is memory or its own file, and there is no second tenant to wall off).
//
// 1. rate_limits: the table RATE_LIMIT_STORE=postgres counts in (rate-limiter-flexible's layout),
//    made here so that no app process runs DDL at start-up.
// 2. Row-level security on the team-scoped tables, a second wall behind the models' team_id scoping: a
//    row is visible and writable only while the transaction's app.team_id names its team (withTeam in
//    app/utils/db.server.ts sets it with SET LOCAL). Table owners and superusers are not bound by it
//    (PostgreSQL's rule), so the wall holds for the app role of docs/hosting.md, which owns nothing.

export const TEAM_TABLES = ["materials", "fasteners", "gaskets", "engines", "seal_plans", "audit_events"];

// current_setting(…, true) is null when never set and '' after a transaction that set it ended;
// either way no team, so the comparison is null and no row passes.
const TEAM_OF_REQUEST = "nullif(current_setting('app.team_id', true), '')::integer";

export async function up(knex: Knex): Promise<void> {
  if (knex.client.config.client !== "pg") return;
  await knex.schema.createTable("rate_limits", (t) => {
    t.string("key", 255).primary();
    t.integer("points").notNullable().defaultTo(0);
    t.bigInteger("expire");
  });
  for (const table of TEAM_TABLES) {
    await knex.raw("alter table ?? enable row level security", [table]);
    await knex.raw(`create policy ?? on ?? using (team_id = ${TEAM_OF_REQUEST}) with check (team_id = ${TEAM_OF_REQUEST})`, [
      `${table}_team`,
      table,
    ]);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client !== "pg") return;
  for (const table of TEAM_TABLES) {
    await knex.raw("drop policy if exists ?? on ??", [`${table}_team`, table]);
    await knex.raw("alter table ?? disable row level security", [table]);
  }
  await knex.schema.dropTable("rate_limits");
}
