import type { Knex } from "knex";

// The shop's records: assemblies (a plan installed on an engine, as tightened), the run log, and the
// files (photos, makers' sheets) kept on engines, assemblies and runs. Every row belongs to one team;
// SI units in column names; dates as ISO text set in code (portable to PostgreSQL).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("assemblies", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    t.integer("plan_id").notNullable().references("seal_plans.id");
    t.string("assembled_on", 10).notNullable();
    t.string("assembled_by", 120).notNullable();
    t.string("lubricant", 120).notNullable().defaultTo("");
    // JSON: [{ targetNm, reachedNm, angleDeg }] per stage, as done
    t.text("stages_done").notNullable().defaultTo("[]");
    // JSON: [{ label, stretchMm }] for the studs whose stretch was measured at the final stage
    t.text("stud_stretch").notNullable().defaultTo("[]");
    t.double("final_torque_nm");
    t.double("measured_protrusion_mm");
    t.double("gasket_compressed_mm");
    t.text("notes").notNullable().defaultTo("");
    t.integer("created_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.string("updated_at").notNullable();
    t.index(["team_id", "engine_id"]);
  });

  await knex.schema.createTable("runs", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    // The plan on the engine when it ran (its latest assembly on or before the day, else the chosen plan).
    t.integer("plan_id").references("seal_plans.id").onDelete("SET NULL");
    t.string("ran_on", 10).notNullable();
    t.string("kind", 10).notNullable();
    t.double("manifold_pressure_kpa");
    t.string("fuel", 60).notNullable().defaultTo("");
    t.double("peak_cylinder_pressure_mpa");
    t.string("peak_pressure_source", 10).notNullable().defaultTo("estimated");
    t.string("outcome", 20).notNullable();
    // JSON list of cylinder numbers
    t.text("cylinders_affected").notNullable().defaultTo("[]");
    t.text("notes").notNullable().defaultTo("");
    t.text("teardown_findings").notNullable().defaultTo("");
    t.integer("created_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.string("updated_at").notNullable();
    t.index(["team_id", "engine_id", "ran_on"]);
    t.check("kind in ('dyno','pass','street')", [], "runs_kind_check");
    t.check("peak_pressure_source in ('measured','estimated')", [], "runs_pcp_check");
    t.check(
      "outcome in ('held','seeping','coolant-leak','combustion-leak','lifted-head','blown-gasket','stud-failure','other')",
      [],
      "runs_outcome_check",
    );
  });

  await knex.schema.createTable("files", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    t.integer("assembly_id").references("assemblies.id").onDelete("SET NULL");
    t.integer("run_id").references("runs.id").onDelete("SET NULL");
    // Server-generated keys in the file storage; the person's file name is kept only for display.
    t.string("storage_key", 80).notNullable().unique();
    t.string("thumb_key", 80);
    t.string("name", 200).notNullable();
    t.string("content_type", 40).notNullable();
    t.integer("size_bytes").notNullable();
    t.integer("created_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.index(["team_id", "engine_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["files", "runs", "assemblies"]) await knex.schema.dropTable(table);
}
