import type { Knex } from "knex";

// Team and e-mail: invites (single-use, expiring, only the token's SHA-256 kept), password resets (the
// same), and which engines a viewer may see (a customer sees their own engine, not the shop's others).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("team_invites", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.string("email", 254).notNullable();
    t.string("role", 10).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.integer("invited_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.string("expires_at").notNullable();
    t.string("accepted_at");
    t.string("revoked_at");
    t.check("role in ('owner','builder','viewer')", [], "team_invites_role_check");
    t.index(["team_id"]);
  });
  await knex.schema.createTable("password_resets", (t) => {
    t.increments("id").primary();
    t.integer("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.string("token_hash", 64).notNullable().unique();
    t.string("created_at").notNullable();
    t.string("expires_at").notNullable();
    t.string("used_at");
    t.index(["user_id"]);
  });
  await knex.schema.createTable("engine_shares", (t) => {
    t.integer("engine_id").notNullable().references("engines.id").onDelete("CASCADE");
    t.integer("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("shared_by").references("users.id").onDelete("SET NULL");
    t.string("created_at").notNullable();
    t.primary(["engine_id", "user_id"]);
    t.index(["team_id", "user_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("engine_shares");
  await knex.schema.dropTable("password_resets");
  await knex.schema.dropTable("team_invites");
}
