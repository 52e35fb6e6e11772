import type { Knex } from "knex";

// The team's data version (app/models/team-version.server.ts): a counter on the team row that every
// audited write bumps inside its own transaction (recordAudit). The newest audit id was the version
// before; on PostgreSQL two writers can commit out of id order (the sequence hands out ids at insert,
// not at commit), so a page rendered between the two commits could be kept under the higher id and
// never see the lower one's write. The bump's row lock orders the writers by commit: a version read
// means every write that bumped up to it has committed. Knex's schema builder: the same on both engines.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("teams", (t) => void t.integer("data_version").notNullable().defaultTo(0));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("teams", (t) => void t.dropColumn("data_version"));
}
