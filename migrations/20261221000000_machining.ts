import type { Knex } from "knex";

// The machining and measurement record of a build: the head and deck as machined and measured, the
// sleeve protrusion per bore, the wire and its receiver groove as cut and the gasket as compressed.
// One team's row; SI in the column names (mm, µm Ra); per-bore protrusion as JSON text, like the
// assemblies' stages; dates as ISO text set in code (portable to PostgreSQL).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("machining_records", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    t.integer("plan_id").notNullable().references("seal_plans.id");
    t.string("measured_on", 10).notNullable();
    t.string("measured_by", 120).notNullable();
    t.double("head_flatness_mm");
    t.double("deck_flatness_mm");
    t.double("head_finish_um");
    t.double("deck_finish_um");
    t.double("head_removed_mm");
    t.double("deck_removed_mm");
    // JSON: [mm | null] per bore, cylinder 1 first
    t.text("sleeve_protrusion_mm").notNullable().defaultTo("[]");
    t.double("wire_projection_mm");
    t.double("receiver_groove_depth_mm");
    t.double("gasket_compressed_mm");
    t.text("notes").notNullable().defaultTo("");
    t.integer("created_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.string("updated_at").notNullable();
    t.index(["team_id", "engine_id"]);
    // a leading index for each foreign key (deletes and joins from the parent side)
    t.index(["engine_id"]);
    t.index(["plan_id"]);
    t.index(["created_by"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("machining_records");
}
