import type { Knex } from "knex";

// Foundation: people, teams (shops), memberships with roles, server-side sessions, audit trail.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("users", (t) => {
    t.increments("id").primary();
    t.string("email", 254).notNullable().unique();
    t.string("name", 120).notNullable();
    t.string("password_hash", 255).notNullable();
    t.string("units", 10).notNullable().defaultTo("metric");
    t.string("created_at").notNullable();
    t.check("units in ('metric','imperial')", [], "users_units_check");
  });
  await knex.schema.createTable("teams", (t) => {
    t.increments("id").primary();
    t.string("name", 120).notNullable();
    t.string("created_at").notNullable();
  });
  await knex.schema.createTable("memberships", (t) => {
    t.integer("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.string("role", 10).notNullable();
    t.string("created_at").notNullable();
    t.primary(["user_id", "team_id"]);
    t.check("role in ('owner','builder','viewer')", [], "memberships_role_check");
  });
  await knex.schema.createTable("sessions", (t) => {
    // SHA-256 of the random cookie id: a copy of the database does not hand out live sessions.
    t.string("id_hash", 64).primary();
    t.integer("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.integer("team_id").references("teams.id").onDelete("SET NULL");
    t.text("data").notNullable().defaultTo("{}");
    t.string("created_at").notNullable();
    t.string("last_seen_at").notNullable();
    t.string("expires_at").notNullable();
    t.index(["user_id"]);
  });
  await knex.schema.createTable("audit_events", (t) => {
    t.increments("id").primary();
    t.integer("team_id").references("teams.id").onDelete("CASCADE");
    t.integer("user_id").references("users.id").onDelete("SET NULL");
    t.string("action", 60).notNullable();
    t.text("detail").notNullable().defaultTo("{}");
    t.string("created_at").notNullable();
    t.index(["team_id", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("audit_events");
  await knex.schema.dropTable("sessions");
  await knex.schema.dropTable("memberships");
  await knex.schema.dropTable("teams");
  await knex.schema.dropTable("users");
}
