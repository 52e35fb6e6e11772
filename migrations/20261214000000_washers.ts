import type { Knex } from "knex";

// The washer's hardness (Vickers), beside its outside diameter and thickness already on the
// fastener: the washer-bearing limit on the head depends on it (app/lib/clamp/washer.ts). Null: not
// recorded, taken as a hardened washer as before. Plain ALTER TABLE … ADD COLUMN on SQLite and PostgreSQL.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("fasteners", (t) => {
    t.double("washer_hardness_hv").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("fasteners", (t) => {
    t.dropColumn("washer_hardness_hv");
  });
}
