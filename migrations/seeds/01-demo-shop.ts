import type { Knex } from "knex";
import { recordAudit } from "../../app/models/audit.server.ts";
import { hashPassword } from "../../app/utils/password.server.ts";

// The demo: an invented shop and a second invented team for isolation tests.
// Nothing here names a real person, shop or brand. Runs only on an empty database.
export const DEMO_PASSWORD = "sealwright-demo";

const DEMO_TEAMS = [
  {
    name: "Harrow Lane Boost Works",
    people: [
      { email: "owner@example.com", name: "Mara Quillon", role: "owner" },
      { email: "builder@example.com", name: "Teo Vastrick", role: "builder" },
      { email: "viewer@example.com", name: "Ollie Brandmere", role: "viewer" },
    ],
  },
  {
    name: "Saltmarsh Dyno Cell",
    people: [{ email: "other-owner@example.com", name: "Ines Corrowby", role: "owner" }],
  },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const existing = await knex("users").count<{ n: number }[]>({ n: "*" });
  if (Number(existing[0]?.n ?? 0) > 0) return;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const at = new Date().toISOString();
  await knex.transaction(async (trx) => {
    for (const team of DEMO_TEAMS) {
      const [{ id: teamId }] = await trx("teams").insert({ name: team.name, created_at: at }).returning("id");
      for (const person of team.people) {
        const [{ id: userId }] = await trx("users")
          .insert({ email: person.email, name: person.name, password_hash: passwordHash, units: "metric", created_at: at })
          .returning("id");
        await trx("memberships").insert({ user_id: userId, team_id: teamId, role: person.role, created_at: at });
      }
      await recordAudit(trx, teamId, null, "demo.seeded", {}, at);
    }
  });
}
