import type { Knex } from "knex";

// A seal plan may be planned by the stud stretch a stretch gauge reads (method "stretch-measured"):
// the target stretch in mm, null when the plan is planned by torque. Plain ALTER TABLE … ADD COLUMN,
// which SQLite and PostgreSQL both run as is.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("seal_plans", (t) => {
    t.double("target_stretch_mm").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("seal_plans", (t) => {
    t.dropColumn("target_stretch_mm");
  });
}
