import type { Knex } from "knex";

// The planner: the shop's libraries (materials, fasteners, gaskets), engines and seal plans.
// Every row belongs to one team; SI units in column names (mm, mpa, nm, kpa, c). Numbers are double():
// SQLite's REAL either way, and PostgreSQL's double precision (float() there is a 4-byte real).
export async function up(knex: Knex): Promise<void> {
  const common = (t: Knex.CreateTableBuilder) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.string("created_at").notNullable();
    t.string("updated_at").notNullable();
  };
  const library = (t: Knex.CreateTableBuilder) => {
    common(t);
    t.string("name", 120).notNullable();
    // Handbook source for seeded rows; null for rows the shop entered (entered_by names the person).
    t.string("source", 300);
    t.integer("entered_by").references("users.id").onDelete("SET NULL");
    t.string("archived_at");
    t.index(["team_id", "archived_at"]);
  };

  await knex.schema.createTable("materials", (t) => {
    library(t);
    t.string("kind", 20).notNullable();
    t.double("modulus_mpa").notNullable();
    t.double("yield_mpa");
    t.double("expansion_um_per_m_c").notNullable();
    t.double("limiting_surface_pressure_mpa");
    t.check("kind in ('aluminium','iron','steel','stainless','copper','other')", [], "materials_kind_check");
  });

  await knex.schema.createTable("fasteners", (t) => {
    library(t);
    t.string("thread_system", 10).notNullable();
    t.double("diameter_mm").notNullable();
    t.double("pitch_mm").notNullable();
    t.double("reduced_shank_diameter_mm");
    t.double("reduced_shank_length_mm").notNullable().defaultTo(0);
    t.double("free_thread_length_mm").notNullable();
    t.double("engagement_mm").notNullable();
    t.integer("material_id").notNullable().references("materials.id");
    t.double("washer_od_mm").notNullable();
    t.double("washer_hole_mm").notNullable();
    t.double("washer_thickness_mm").notNullable().defaultTo(0);
    // The fastener maker's own figures, as the shop recorded them from the maker's sheet.
    t.double("maker_torque_nm");
    t.string("maker_lubricant", 120);
    t.string("maker_stages", 200);
    t.double("maker_stretch_mm");
    t.double("thread_friction").notNullable();
    t.double("bearing_friction").notNullable();
    t.check("thread_system in ('metric','unified')", [], "fasteners_thread_check");
  });

  await knex.schema.createTable("gaskets", (t) => {
    library(t);
    t.string("type", 20).notNullable();
    t.double("compressed_thickness_mm").notNullable();
    t.double("bore_mm").notNullable();
    t.double("seal_diameter_mm").notNullable();
    t.double("ring_width_mm").notNullable();
    t.double("ring_modulus_mpa").notNullable();
    t.double("seal_line_yield_mpa").notNullable();
    t.double("body_modulus_mpa").notNullable();
    t.double("body_area_per_bore_mm2").notNullable();
    t.double("expansion_um_per_m_c").notNullable();
    t.double("m").notNullable();
    t.double("y_mpa").notNullable();
    t.double("relaxation_percent").notNullable().defaultTo(0);
    t.double("finish_min_ra_um");
    t.double("finish_max_ra_um");
    t.check("type in ('solid-copper','mls','mls-with-ring','fire-ring')", [], "gaskets_type_check");
  });

  await knex.schema.createTable("engines", (t) => {
    common(t);
    t.string("name", 120).notNullable();
    t.string("customer", 120).notNullable().defaultTo("");
    t.integer("cylinders").notNullable();
    t.string("layout", 10).notNullable();
    t.double("bore_mm").notNullable();
    t.double("stroke_mm").notNullable();
    t.double("rod_length_mm");
    t.integer("block_material_id").notNullable().references("materials.id");
    t.integer("head_material_id").notNullable().references("materials.id");
    t.double("head_thickness_at_stud_mm").notNullable();
    t.double("block_depth_to_thread_mm").notNullable().defaultTo(0);
    t.string("sleeve_kind", 12).notNullable().defaultTo("none");
    t.integer("sleeve_material_id").references("materials.id");
    t.double("sleeve_wall_mm");
    t.double("sleeve_support_length_mm");
    t.double("sleeve_protrusion_mm").notNullable().defaultTo(0);
    // Stud pattern: JSON list of studs, each with the cylinders it serves and its share of each.
    t.text("studs").notNullable();
    t.string("fuel", 60).notNullable().defaultTo("");
    t.double("target_manifold_kpa");
    t.double("peak_pressure_mpa");
    t.string("peak_pressure_source", 10).notNullable().defaultTo("estimated");
    // Peak-pressure estimate from manifold pressure: compression exponent and a pressure-rise factor.
    t.double("pressure_rise_factor").notNullable().defaultTo(3);
    t.double("running_head_c").notNullable().defaultTo(110);
    t.double("running_block_c").notNullable().defaultTo(95);
    t.double("chamber_cc");
    t.double("piston_volume_cc").notNullable().defaultTo(0);
    t.double("deck_clearance_mm").notNullable().defaultTo(0);
    t.string("status", 12).notNullable().defaultTo("quoted");
    t.text("notes").notNullable().defaultTo("");
    t.integer("chosen_plan_id");
    t.string("archived_at");
    t.index(["team_id", "status"]);
    t.check("layout in ('inline','V')", [], "engines_layout_check");
    t.check("sleeve_kind in ('none','dry','wet-flange','wet-mid')", [], "engines_sleeve_check");
    t.check("status in ('quoted','in-build','running','retired')", [], "engines_status_check");
    t.check("peak_pressure_source in ('measured','estimated')", [], "engines_pcp_check");
  });

  await knex.schema.createTable("seal_plans", (t) => {
    common(t);
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    t.string("name", 120).notNullable();
    t.integer("gasket_id").notNullable().references("gaskets.id");
    t.integer("fastener_id").notNullable().references("fasteners.id");
    t.string("lubricant", 120).notNullable().defaultTo("");
    t.double("thread_friction").notNullable();
    t.double("bearing_friction").notNullable();
    t.string("method", 40).notNullable();
    t.double("torque_nm").notNullable();
    // Torque stages as a JSON list of N·m, last one equal to torque_nm.
    t.text("stages").notNullable().defaultTo("[]");
    t.string("wire_location", 10).notNullable().defaultTo("none");
    t.double("wire_projection_mm").notNullable().defaultTo(0);
    t.double("receiver_groove_depth_mm").notNullable().defaultTo(0);
    // Null: use the engine's machined protrusion.
    t.double("sleeve_protrusion_mm");
    t.double("target_margin").notNullable().defaultTo(1.5);
    t.text("notes").notNullable().defaultTo("");
    t.string("archived_at");
    t.index(["team_id", "engine_id"]);
    t.check("wire_location in ('none','head','block')", [], "plans_wire_check");
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["seal_plans", "engines", "gaskets", "fasteners", "materials"]) await knex.schema.dropTable(table);
}
