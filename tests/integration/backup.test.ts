import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import knexFactory from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { onPostgres } from "../setup/engine";
import * as teamExport from "~/routes/app/team-export";
import { backupDatabase } from "~/utils/backup.server";
import { db } from "~/utils/db.server";
import { knexConfig } from "~/utils/knex-config.server";
import { call, get, signIn, type Handler } from "./helpers";

// Figure of issue 9, backups: an owner downloads the team's data as one consistent JSON document, and
// the instance backup (VACUUM INTO, made while the app runs) restores and passes integrity_check.

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "sw-backup-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

let owner = "";
let other = "";
beforeAll(async () => {
  owner = await signIn("owner@example.com");
  other = await signIn("other-owner@example.com");
});

interface Export {
  format: string;
  team: { name: string };
  members: Record<string, unknown>[];
  tables: Record<string, { team_id: number }[]>;
}

describe("team export (owners)", () => {
  it("holds every row of the team's tables and nothing of another team's, nor any secret", async () => {
    const out = await call(teamExport.loader as Handler, get("/team/export", owner));
    expect(out.status).toBe(200);
    const body = out.body as Export;
    const teamId = (await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
    expect(body.format).toBe("sealwright-team-export");
    expect(body.team.name).toBe("Harrow Lane Boost Works");
    expect(body.members.map((m) => m.email)).toEqual(["builder@example.com", "owner@example.com", "viewer@example.com"]);
    for (const table of ["materials", "fasteners", "gaskets", "engines", "seal_plans", "audit_events"]) {
      const rows = await db()(table).where({ team_id: teamId }).count({ n: "*" });
      expect(body.tables[table], table).toHaveLength(Number(rows[0]!.n));
      expect(
        body.tables[table]!.every((r) => r.team_id === teamId),
        table,
      ).toBe(true);
    }
    expect(body.tables.engines).toHaveLength(3);
    const text = JSON.stringify(body);
    expect(text).not.toContain("password_hash");
    expect(text).not.toContain("$argon2");
    expect(text).not.toContain("id_hash");
  });

  it("another team's owner gets their own shop only", async () => {
    const body = (await call(teamExport.loader as Handler, get("/team/export", other))).body as Export;
    expect(body.team.name).toBe("Saltmarsh Dyno Cell");
    expect(body.tables.engines).toEqual([]);
    expect(body.members.map((m) => m.email)).toEqual(["other-owner@example.com"]);
  });
});

describe.skipIf(onPostgres)("instance backup (SQLite file)", () => {
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
