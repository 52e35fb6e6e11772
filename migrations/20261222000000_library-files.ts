import type { Knex } from "knex";

// Makers' sheets on fasteners and gaskets: a file now belongs to exactly one of an engine (and maybe one
// of its assemblies or runs), a fastener or a gasket, and always to one team (team_id stays NOT NULL, the
// row-security key). On SQLite, Knex rebuilds the table for the column change and the check (copying the
// rows, the foreign keys and the indexes); on PostgreSQL it is a plain ALTER.
const ONE_OWNER =
  "(case when engine_id is null then 0 else 1 end) + (case when fastener_id is null then 0 else 1 end)" +
  " + (case when gasket_id is null then 0 else 1 end) = 1";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("files", (t) => {
    t.integer("engine_id").nullable().alter();
    t.integer("fastener_id").references("fasteners.id").onDelete("CASCADE");
    t.integer("gasket_id").references("gaskets.id").onDelete("CASCADE");
    t.index(["fastener_id"], "files_fastener_id_index");
    t.index(["gasket_id"], "files_gasket_id_index");
    t.check(ONE_OWNER, [], "files_one_owner");
  });
}

// The library's files go with the columns (their stored objects are left for the sweep, docs/hosting.md).
export async function down(knex: Knex): Promise<void> {
  await knex("files").whereNull("engine_id").delete();
  await knex.schema.alterTable("files", (t) => {
    t.dropChecks(["files_one_owner"]);
    t.dropIndex(["fastener_id"], "files_fastener_id_index");
    t.dropIndex(["gasket_id"], "files_gasket_id_index");
    t.dropForeign(["fastener_id"]);
    t.dropForeign(["gasket_id"]);
    t.dropColumn("fastener_id");
    t.dropColumn("gasket_id");
    t.integer("engine_id").notNullable().alter();
  });
}
