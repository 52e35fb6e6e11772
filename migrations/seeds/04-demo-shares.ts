import type { Knex } from "knex";

// The demo viewer (a customer's tuner, invented) is shown one engine: the four-cylinder. Viewers see
// only the engines shared with them, so the demo viewer's pages have something to show.
export const DEMO_SHARED_ENGINE = "Fenwick-Oddy 2.0 four";

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
  const viewer = await knex("users").where({ email: "viewer@example.com" }).first("id");
  const owner = await knex("users").where({ email: "owner@example.com" }).first("id");
  if (!team || !viewer) return;
  const engine = await knex("engines").where({ team_id: team.id, name: DEMO_SHARED_ENGINE }).first("id");
  if (!engine) return;
  if (await knex("engine_shares").where({ team_id: team.id }).first("engine_id")) return;
  await knex("engine_shares").insert({
    engine_id: engine.id,
    user_id: viewer.id,
    team_id: team.id,
    shared_by: owner?.id ?? null,
    created_at: new Date().toISOString(),
  });
}
