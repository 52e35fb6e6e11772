import crypto from "node:crypto";
import knexFactory, { type Knex } from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ALL_TEAM_TABLES } from "../../migrations/20261223000000_row-security-all";
import { listEngines } from "~/models/engine.server";
import { db, withTeam } from "~/utils/db.server";
import { knexConfig } from "~/utils/knex-config.server";
import { appDb, appRoleName, ownerDb } from "../setup/db-roles";
import { onPostgres, rowsOf, tableNames } from "../setup/engine";
import { createDatabase, dropDatabase, testPostgresUrl, uniqueName, urlFor } from "../setup/postgres";

// PostgreSQL's second wall (migrations 20261219000000_hosted and 20261223000000_row-security-all): row-level
// security keyed on the team set per transaction. The owner (a superuser here) is never bound by it, so
// every check runs as the run's app role, which owns nothing (tests/setup/db-roles.ts, docs/hosting.md).

type Settings = Record<string, string | number>;

/** One transaction as the app role with the given app.* settings (SET LOCAL: they end with it). */
async function asApp<T>(settings: Settings, work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  return appDb().transaction(async (trx) => {
    for (const [name, value] of Object.entries(settings)) await trx.raw("select set_config(?, ?, true)", [`app.${name}`, String(value)]);
    return work(trx);
  });
}

const count = async (q: Knex.QueryBuilder): Promise<number> => Number(((await q.count({ n: "*" })) as { n: number }[])[0]!.n);
const sha = (s: string) => crypto.createHash("sha256").update(s).digest("hex");

describe.runIf(onPostgres)("row-level security on PostgreSQL, as the app role", () => {
  let demo = 0;
  let other = 0;
  const hashes = { session: sha("rls-session"), token: sha("rls-token"), invite: sha("rls-invite") };

  // The seed leaves a few tables empty; give each team a row in every team table (as the owner).
  beforeAll(async () => {
    const owner = ownerDb();
    [demo, other] = (await owner("teams").orderBy("id").pluck("id")) as number[];
    const at = new Date().toISOString();
    // the second team has only its library: give it a copy of one demo engine and the rows hanging off it
    const copy = async (table: string, overrides: Record<string, unknown>): Promise<number | undefined> => {
      const row = {
        ...(await owner(table)
          .where({ team_id: demo })
          .orderBy(table === "engine_shares" ? "engine_id" : "id")
          .first()),
      };
      delete row.id;
      const inserted = await owner(table)
        .insert({ ...row, ...overrides, team_id: other })
        .returning(table === "engine_shares" ? "engine_id" : "id");
      return (inserted[0] as { id?: number }).id;
    };
    const otherUser = (await owner("memberships").where({ team_id: other }).first("user_id"))!.user_id as number;
    if (!(await owner("engines").where({ team_id: other }).first("id"))) {
      const engineId = await copy("engines", { name: "Probe engine" });
      const planId = await copy("seal_plans", { engine_id: engineId });
      await copy("assemblies", { engine_id: engineId, plan_id: planId });
      await copy("runs", { engine_id: engineId, plan_id: planId });
      await copy("machining_records", { engine_id: engineId, plan_id: planId });
      await copy("engine_shares", { engine_id: engineId, user_id: otherUser });
    }
    for (const teamId of [demo, other]) {
      const userId = (await owner("memberships").where({ team_id: teamId }).orderBy("user_id").first("user_id"))!.user_id as number;
      const tag = `${teamId}`;
      await owner("sessions").insert({
        id_hash: teamId === demo ? hashes.session : sha(`s${tag}`),
        user_id: userId,
        team_id: teamId,
        created_at: at,
        last_seen_at: at,
        expires_at: "2999-01-01T00:00:00.000Z",
      });
      await owner("api_tokens").insert({
        team_id: teamId,
        user_id: userId,
        name: "probe",
        token_hash: teamId === demo ? hashes.token : sha(`t${tag}`),
        prefix: "swt_probe",
        role: "builder",
        created_at: at,
      });
      await owner("team_invites").insert({
        team_id: teamId,
        email: `invitee${tag}@example.com`,
        role: "builder",
        token_hash: teamId === demo ? hashes.invite : sha(`i${tag}`),
        created_at: at,
        expires_at: "2999-01-01T00:00:00.000Z",
      });
      await owner("audit_events").insert({ team_id: teamId, action: "probe.row", created_at: at });
      const engine = (await owner("engines").where({ team_id: teamId }).orderBy("id").first("id"))!.id as number;
      const key = `t${teamId}/${crypto.randomUUID()}`;
      await owner("files").insert({
        team_id: teamId,
        engine_id: engine,
        storage_key: key,
        name: "probe.pdf",
        content_type: "application/pdf",
        size_bytes: 1,
        created_at: at,
      });
    }
  });

  it("the app role owns nothing and does not bypass row security", async () => {
    const role = appRoleName()!;
    const rows = rowsOf<{ rolsuper: boolean; rolbypassrls: boolean }>(
      await ownerDb().raw("select rolsuper, rolbypassrls from pg_roles where rolname = ?", [role]),
    );
    expect(rows).toEqual([{ rolsuper: false, rolbypassrls: false }]);
    const owned = rowsOf(await ownerDb().raw("select tablename from pg_tables where schemaname = 'public' and tableowner = ?", [role]));
    expect(owned).toEqual([]);
  });

  it("every table with a team_id column has row security and a team policy", async () => {
    const withTeamId = rowsOf<{ table_name: string }>(
      await ownerDb().raw(
        "select table_name from information_schema.columns where table_schema = 'public' and column_name = 'team_id' order by table_name",
      ),
    ).map((r) => r.table_name);
    expect(withTeamId.sort()).toEqual([...ALL_TEAM_TABLES].sort());
    const secured = rowsOf<{ relname: string }>(
      await ownerDb().raw("select relname from pg_class where relrowsecurity and relkind = 'r' order by relname"),
    ).map((r) => r.relname);
    expect(secured).toEqual([...ALL_TEAM_TABLES].sort());
    const teamPolicies = rowsOf<{ tablename: string }>(
      await ownerDb().raw("select tablename from pg_policies where policyname = tablename || '_team' order by tablename"),
    ).map((r) => r.tablename);
    expect(teamPolicies).toEqual([...ALL_TEAM_TABLES].sort());
  });

  describe.each(ALL_TEAM_TABLES)("%s", (table) => {
    it("has rows of both teams (as the owner sees them)", async () => {
      expect(await count(ownerDb()(table).where({ team_id: demo }))).toBeGreaterThan(0);
      expect(await count(ownerDb()(table).where({ team_id: other }))).toBeGreaterThan(0);
    });

    it("without the team setting the app role sees no rows", async () => {
      expect(await asApp({}, (trx) => count(trx(table)))).toBe(0);
    });

    it("with the team set it sees exactly that team's rows, and none of them with another team's id", async () => {
      const mine = await count(ownerDb()(table).where({ team_id: demo }));
      expect(await asApp({ team_id: demo }, (trx) => count(trx(table)))).toBe(mine);
      expect(await asApp({ team_id: other }, (trx) => count(trx(table).where({ team_id: demo })))).toBe(0);
    });

    it("refuses an insert carrying another team's id (WITH CHECK), and writes nothing", async () => {
      const row = { ...(await ownerDb()(table).where({ team_id: demo }).first()) } as Record<string, unknown>;
      delete row.id;
      row.team_id = other;
      const before = await count(ownerDb()(table));
      await expect(asApp({ team_id: demo }, (trx) => trx(table).insert(row))).rejects.toMatchObject({ code: "42501" });
      expect(await count(ownerDb()(table))).toBe(before);
    });
  });

  it("the setting ends with the transaction: the next one on a pooled connection has no team", async () => {
    expect(await asApp({ team_id: demo }, (trx) => count(trx("engines")))).toBeGreaterThan(0);
    for (let i = 0; i < 3; i++) expect(await asApp({}, (trx) => count(trx("engines")))).toBe(0);
  });

  it("the narrow pre-team lookups find exactly the row asked for, read-only where they should be", async () => {
    // a session by its hash, before the team is known
    expect(await asApp({ session_hash: hashes.session }, (trx) => trx("sessions").pluck("id_hash"))).toEqual([hashes.session]);
    // a bearer token by its hash: that one row, and no update through that door
    expect(await asApp({ token_hash: hashes.token }, (trx) => trx("api_tokens").pluck("token_hash"))).toEqual([hashes.token]);
    const touched = await asApp({ token_hash: hashes.token }, (trx) =>
      trx("api_tokens").where({ token_hash: hashes.token }).update({ last_used_at: new Date().toISOString() }),
    );
    expect(touched).toBe(0);
    // an invite link by its hash
    expect(await asApp({ token_hash: hashes.invite }, (trx) => trx("team_invites").pluck("token_hash"))).toEqual([hashes.invite]);
    expect(await asApp({ token_hash: hashes.invite }, (trx) => count(trx("api_tokens")))).toBe(0);
    // a person's own memberships (which teams may they enter?), and nobody else's
    const userId = (await ownerDb()("memberships").where({ team_id: other }).first("user_id"))!.user_id as number;
    const theirs = await ownerDb()("memberships").where({ user_id: userId }).orderBy("team_id").pluck("team_id");
    expect(await asApp({ user_id: userId }, (trx) => trx("memberships").orderBy("team_id").pluck("team_id"))).toEqual(theirs);
    expect(await asApp({ user_id: userId }, (trx) => count(trx("memberships").whereNot({ user_id: userId })))).toBe(0);
    // a team-less audit row (an account event) may be written, and not read back without a team
    await asApp({}, (trx) => trx("audit_events").insert({ team_id: null, action: "probe.no-team", created_at: new Date().toISOString() }));
    expect(await asApp({}, (trx) => count(trx("audit_events")))).toBe(0);
    expect(await count(ownerDb()("audit_events").where({ action: "probe.no-team" }))).toBe(1);
  });

  it("the app's own db() is the app role on this pass (the owner only under TEST_PG_ROLE=owner)", async () => {
    const who = async (k: Knex) =>
      rowsOf<{ name: string; bypass: boolean; owns: boolean }>(
        await k.raw(
          "select current_user as name, rolbypassrls or rolsuper as bypass, " +
            "exists (select 1 from pg_tables where schemaname = 'public' and tableowner = current_user) as owns from pg_roles where rolname = current_user",
        ),
      )[0]!;
    const app = await who(db());
    if (process.env.TEST_PG_ROLE === "owner") expect(app).toEqual(await who(ownerDb()));
    else expect(app).toEqual({ name: appRoleName(), bypass: false, owns: false });
    expect((await who(ownerDb())).owns).toBe(true);
  });

  it("withTeam sets the team for the model reads: the app role lists the demo shop's engines", async () => {
    const direct = await listEngines({ teamId: demo, userId: 0, role: "owner" }, { pageSize: 100 });
    const walled = await appDb().transaction(async (trx) => {
      await trx.raw("select set_config('app.team_id', ?, true)", [String(demo)]);
      return trx("engines").whereNull("archived_at").orderBy("id").pluck("id");
    });
    expect(walled).toEqual(direct.rows.map((r) => r.id).sort((a, b) => a - b));
    expect(walled.length).toBe(direct.total);
    // and withTeam itself: as the app role (the pass's default) the policies alone narrow an unfiltered
    // count to the team; under TEST_PG_ROLE=owner nothing does
    const unfiltered = await withTeam(demo, (k) => count(k("engines").whereNull("archived_at")));
    if (process.env.TEST_PG_ROLE !== "owner") expect(unfiltered).toBe(direct.total);
    else expect(unfiltered).toBeGreaterThan(direct.total); // the owner: no wall, the probe team's copy counts too
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
    const policies = rowsOf<{ tablename: string }>(
      await knex.raw("select distinct tablename from pg_policies where policyname = tablename || '_team' order by tablename"),
    ).map((r) => r.tablename);
    expect(policies).toEqual([...ALL_TEAM_TABLES].sort());
    const types = rowsOf<{ data_type: string }>(
      await knex.raw(
        "select distinct data_type from information_schema.columns where table_name = 'seal_plans' and column_name like '%_mm'",
      ),
    );
    expect(types).toEqual([{ data_type: "double precision" }]);
    // down to just before 20261223000000_row-security-all (one step at a time, whatever came after it):
    // back to the six tables of 20261219000000_hosted
    for (;;) {
      const [done] = (await knex.migrate.list()) as [{ name: string }[], unknown];
      if (!done.some((m) => m.name.startsWith("20261223000000_row-security-all"))) break;
      await knex.migrate.down();
    }
    const six = rowsOf<{ tablename: string }>(await knex.raw("select distinct tablename from pg_policies order by tablename")).map(
      (r) => r.tablename,
    );
    expect(six).toEqual(["audit_events", "engines", "fasteners", "gaskets", "materials", "seal_plans"]);
    await knex.migrate.latest();
    await knex.migrate.rollback(undefined, true);
    expect(await tableNames(knex)).toEqual([]);
  });
});
