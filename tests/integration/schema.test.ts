import fs from "node:fs";
import path from "node:path";
import knexFactory, { type Knex } from "knex";
import { afterEach, describe, expect, it } from "vitest";
import { knexConfig } from "~/utils/knex-config.server";

const TABLES = ["users", "teams", "memberships", "sessions", "audit_events"];

async function tableNames(knex: Knex): Promise<string[]> {
  const rows = await knex.raw(
    "select name from sqlite_master where type = 'table' and name not like 'knex_%' and name not like 'sqlite_%'",
  );
  return (rows as { name: string }[]).map((r) => r.name).sort();
}

describe("migrations", () => {
  const file = path.resolve(`tests/.tmp/empty-${process.pid}.sqlite`);
  let knex: Knex | undefined;
  afterEach(async () => {
    await knex?.destroy();
    for (const s of ["", "-wal", "-shm"]) fs.rmSync(file + s, { force: true });
  });

  it("apply to an empty database and roll back to nothing", async () => {
    knex = knexFactory(knexConfig(file));
    await knex.migrate.latest();
    expect(await tableNames(knex)).toEqual(expect.arrayContaining(TABLES));
    await knex.migrate.rollback(undefined, true);
    expect(await tableNames(knex)).toEqual([]);
  });

  it("sets WAL, foreign keys and a busy timeout on a fresh connection", async () => {
    knex = knexFactory(knexConfig(file));
    const [journal] = await knex.raw("PRAGMA journal_mode");
    const [fk] = await knex.raw("PRAGMA foreign_keys");
    const [busy] = await knex.raw("PRAGMA busy_timeout");
    expect(journal.journal_mode).toBe("wal");
    expect(fk.foreign_keys).toBe(1);
    expect(busy.timeout).toBe(5000);
  });

  it("refuses a membership with an unknown role and an orphan membership", async () => {
    knex = knexFactory(knexConfig(file));
    await knex.migrate.latest();
    await knex("users").insert({ id: 1, email: "a@example.com", name: "A", password_hash: "x", created_at: "now" });
    await knex("teams").insert({ id: 1, name: "T", created_at: "now" });
    await expect(knex("memberships").insert({ user_id: 1, team_id: 1, role: "boss", created_at: "now" })).rejects.toThrow(/CHECK/);
    await expect(knex("memberships").insert({ user_id: 1, team_id: 99, role: "owner", created_at: "now" })).rejects.toThrow(/FOREIGN KEY/);
  });
});
