import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as teamExport from "~/routes/shop/team-export";
import { call, get, signIn, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";

// Figure of issue 9, backups: an owner downloads the team's data as one consistent JSON document (the
// instance backup of the SQLite file is backup.sqlite.test.ts).

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
    const teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
    expect(body.format).toBe("sealwright-team-export");
    expect(body.team.name).toBe("Harrow Lane Boost Works");
    expect(body.members.map((m) => m.email)).toEqual(["builder@example.com", "owner@example.com", "viewer@example.com"]);
    for (const table of ["materials", "fasteners", "gaskets", "engines", "seal_plans", "audit_events"]) {
      const rows = await ownerDb()(table).where({ team_id: teamId }).count({ n: "*" });
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
