import type { Knex } from "knex";
import { seedTeamLibrary } from "../../app/models/library-seed.server.ts";

// Every team without a library gets the handbook materials and the demo fasteners and gaskets.
// Safe to run twice: a team that already has any material row is left alone.
export async function seed(knex: Knex): Promise<void> {
  const teams: { id: number }[] = await knex("teams").select("id");
  for (const team of teams) {
    const has = await knex("materials").where({ team_id: team.id }).first("id");
    if (has) continue;
    await knex.transaction((trx) => seedTeamLibrary(trx, team.id));
  }
}
