import knexFactory, { type Knex } from "knex";
import { afterAll, describe, expect, it } from "vitest";
import { listEngines } from "~/models/engine.server";
import { db, withTeam } from "~/utils/db.server";
import { knexConfig } from "~/utils/knex-config.server";
import { onPostgres, rowsOf, tableNames } from "../setup/engine";
import { createDatabase, dropDatabase, testPostgresUrl, uniqueName, urlFor } from "../setup/postgres";

// PostgreSQL's second wall (migration 20261219000000_hosted): row-level security keyed on the team set
// per transaction. The test database's owner is a superuser, whom PostgreSQL never binds, so each check
// runs as a role that owns nothing — as the hosted app role does (docs/hosting.md).
const PROBE_ROLE = "sw_rls_probe";

async function asProbe<T>(trx: Knex.Transaction, teamId: number | null, work: () => Promise<T>): Promise<T> {
  if (teamId !== null) await trx.raw("select set_config('app.team_id', ?, true)", [String(teamId)]);
  await trx.raw(`set local role ${PROBE_ROLE}`);
  return work();
}

async function demoTeams(): Promise<{ demo: number; other: number }> {
  const [demo, other] = await db()("teams").orderBy("id").pluck("id");
  return { demo: demo as number, other: other as number };
}

describe.runIf(onPostgres)("row-level security on PostgreSQL", () => {
  it("makes the probe role (cluster-wide, so tolerate a parallel file making it too) and grants it the tables", async () => {
    await db().raw(
      `do $$ begin create role ${PROBE_ROLE} nologin nosuperuser nobypassrls; exception when duplicate_object or unique_violation then null; end $$`,
    );
    await db().raw(`grant select, insert, update, delete on all tables in schema public to ${PROBE_ROLE}`);
    await db().raw(`grant usage on all sequences in schema public to ${PROBE_ROLE}`);
  });

  it("a query without the team setting sees no rows of any team-scoped table", async () => {
    const counts = await db().transaction((trx) =>
      asProbe(trx, null, async () => {
        const out: Record<string, number> = {};
        for (const t of ["materials", "fasteners", "gaskets", "engines", "seal_plans", "audit_events"]) {
          out[t] = Number((await trx(t).count({ n: "*" }))[0]!.n);
        }
        return out;
      }),
    );
    expect(counts).toEqual({ materials: 0, fasteners: 0, gaskets: 0, engines: 0, seal_plans: 0, audit_events: 0 });
    // while the owner (no policy binds it) sees the seeded rows
    expect(Number((await db()("engines").count({ n: "*" }))[0]!.n)).toBeGreaterThan(0);
  });

  it("with the team set, exactly that team's rows: none of the other shop's, even asked for by id", async () => {
    const { demo, other } = await demoTeams();
    const expected = (await db()("engines").where({ team_id: demo }).pluck("id")).sort();
    const otherIds = await db()("engines").where({ team_id: other }).pluck("id");
    const seen = await db().transaction((trx) => asProbe(trx, demo, () => trx("engines").pluck("id")));
    expect(seen.sort()).toEqual(expected);
    const asked = await db().transaction((trx) =>
      asProbe(trx, demo, () =>
        trx("engines")
          .whereIn("id", [...otherIds, -1])
          .pluck("id"),
      ),
    );
    expect(asked).toEqual([]);
  });

  it("refuses a write into another team (WITH CHECK), and the setting ends with the transaction", async () => {
    const { demo, other } = await demoTeams();
    const write = db().transaction((trx) =>
      asProbe(trx, demo, () =>
        trx("audit_events").insert({ team_id: other, action: "probe.cross-team", created_at: new Date().toISOString() }),
      ),
    );
    await expect(write).rejects.toMatchObject({ code: "42501" });
    expect(await db()("audit_events").where({ action: "probe.cross-team" }).count({ n: "*" })).toEqual([{ n: 0 }]);
    // SET LOCAL: the next transaction on a pooled connection starts with no team
    const after = await db().transaction((trx) => asProbe(trx, null, () => trx("engines").count({ n: "*" })));
    expect(after).toEqual([{ n: 0 }]);
  });

  it("withTeam sets the team for the model reads: listEngines as the probe role lists the demo shop's engines", async () => {
    const { demo } = await demoTeams();
    const direct = await listEngines({ teamId: demo, userId: 0, role: "owner" }, { pageSize: 100 });
    const walled = await withTeam(demo, async (k) => {
      await k.raw(`set local role ${PROBE_ROLE}`);
      return k("engines").whereNull("archived_at").orderBy("id").pluck("id");
    });
    expect(walled).toEqual(direct.rows.map((r) => r.id).sort((a, b) => a - b));
    expect(walled.length).toBe(direct.total);
  });
});

describe.runIf(testPostgresUrl())("migrations on an empty PostgreSQL database", () => {
  const base = testPostgresUrl()!;
  const name = uniqueName("_empty");
  let knex: Knex | undefined;
  afterAll(async () => {
    await knex?.destroy();
    await dropDatabase(base, name);
  });

  it("apply with the hosted table and policies, and roll back to nothing", async () => {
    await createDatabase(base, name);
    knex = knexFactory(knexConfig(urlFor(base, name)));
    await knex.migrate.latest();
    const tables = await tableNames(knex);
    expect(tables).toEqual(expect.arrayContaining(["users", "teams", "engines", "seal_plans", "rate_limits"]));
    const policies = rowsOf<{ tablename: string }>(await knex.raw("select tablename from pg_policies order by tablename")).map(
      (r) => r.tablename,
    );
    expect(policies).toEqual(["audit_events", "engines", "fasteners", "gaskets", "materials", "seal_plans"]);
    const types = rowsOf<{ data_type: string }>(
      await knex.raw(
        "select distinct data_type from information_schema.columns where table_name = 'seal_plans' and column_name like '%_mm'",
      ),
    );
    expect(types).toEqual([{ data_type: "double precision" }]);
    await knex.migrate.rollback(undefined, true);
    expect(await tableNames(knex)).toEqual([]);
  });
});
