import type { Knex } from "knex";

// What a shop can know about its gaskets and fasteners beyond the first planner: the hardness the seal
// line bites into, an MLS bead, the seating and service pressures gasket standards publish (EN 13555),
// the pressure the body needs to seal coolant and oil, the nut face where bearing friction acts, and a
// material's shear strength for thread stripping. All nullable: a row without them uses the typical
// figure of its family, and the estimate says so. Plain ALTER TABLE … ADD COLUMN: SQLite and PostgreSQL.
const GASKET_COLUMNS = [
  "seal_line_hardness_mpa",
  "bead_load_n_per_mm",
  "bead_travel_mm",
  "seating_pressure_mpa",
  "min_service_pressure_mpa",
  "max_pressure_mpa",
  "body_seal_pressure_mpa",
];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("gaskets", (t) => {
    for (const c of GASKET_COLUMNS) t.double(c);
  });
  await knex.schema.alterTable("fasteners", (t) => {
    t.double("nut_face_od_mm");
  });
  await knex.schema.alterTable("materials", (t) => {
    t.double("shear_strength_mpa");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("materials", (t) => t.dropColumn("shear_strength_mpa"));
  await knex.schema.alterTable("fasteners", (t) => t.dropColumn("nut_face_od_mm"));
  await knex.schema.alterTable("gaskets", (t) => {
    for (const c of GASKET_COLUMNS) t.dropColumn(c);
  });
}
