import type { Knex } from "knex";

// Personal API tokens: one person's key to one team, at no more than their role there. Only the
// SHA-256 of the token is kept (like the session ids): a copy of the database hands out no live keys.
// `prefix` is the token's first characters, shown in the list so a person can tell their keys apart.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("api_tokens", (t) => {
    t.increments("id").primary();
    t.integer("team_id").notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.string("name", 80).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.string("prefix", 16).notNullable();
    t.string("role", 10).notNullable();
    t.string("created_at").notNullable();
    t.string("last_used_at").nullable();
    t.string("revoked_at").nullable();
    t.index(["user_id", "team_id"]);
    t.check("role in ('owner','builder','viewer')", [], "api_tokens_role_check");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("api_tokens");
}
