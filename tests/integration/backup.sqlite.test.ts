import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import knexFactory from "knex";
import { afterAll, describe, expect, it } from "vitest";
import { backupDatabase } from "~/utils/backup.server";
import { db } from "~/utils/db.server";
import { knexConfig } from "~/utils/knex-config.server";

// Figure of issue 9, backups: the instance backup (VACUUM INTO, made while the app runs) restores and
// passes integrity_check. SQLite's file only: the PostgreSQL pass leaves *.sqlite.test.ts out
// (scripts/test-pg.mjs); PostgreSQL's backups are the server's own (docs/hosting.md).

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "sw-backup-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe("instance backup (SQLite file)", () => {
  it("VACUUM INTO while the app is open: the copy passes integrity_check, has every row, and restores", async () => {
    const target = path.join(dir, "copy.sqlite");
    const report = backupDatabase(process.env.DATABASE_PATH!, target);
    expect(report.integrity).toBe("ok");
    expect(report.foreignKeyProblems).toBe(0);
    for (const table of ["users", "teams", "engines", "seal_plans", "materials", "audit_events"]) {
      expect(report.rows[table], table).toBe(Number((await db()(table).count({ n: "*" }))[0]!.n));
    }
    // restore: the copy is a database the app opens as it is, migrations up to date
    const restored = knexFactory(knexConfig(target));
    try {
      const [, pending] = (await restored.migrate.list()) as [unknown[], unknown[]];
      expect(pending).toEqual([]);
      expect((await restored("engines").whereNotNull("chosen_plan_id")).length).toBe(3);
    } finally {
      await restored.destroy();
    }
    expect(() => backupDatabase(process.env.DATABASE_PATH!, target)).toThrow(/never overwrites/);
  });
});
