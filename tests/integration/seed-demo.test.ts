import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, describe, expect, it } from "vitest";

// Defect 3 of issue 9: every fresh production database got the demo accounts and their published
// password. `npm run db:setup` (what npm start runs) with SEED_DEMO=false must create none.

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "sw-seed-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function setup(env: Record<string, string>): { users: string[]; teams: number } {
  const file = path.join(dir, `${Object.values(env).join("-") || "default"}.sqlite`);
  const run = (args: string[]) =>
    execFileSync(process.execPath, ["--import", "tsx", ...args], {
      env: { PATH: process.env.PATH ?? "", DATABASE_PATH: file, ...env },
      stdio: "pipe",
    });
  run(["node_modules/knex/bin/cli.js", "--knexfile", "knexfile.ts", "migrate:latest"]);
  run(["scripts/db-seed.ts"]);
  const db = new Database(file, { readonly: true });
  try {
    return {
      users: (db.prepare("select email from users order by email").all() as { email: string }[]).map((r) => r.email),
      teams: (db.prepare("select count(*) as n from teams").get() as { n: number }).n,
    };
  } finally {
    db.close();
  }
}

describe("SEED_DEMO", () => {
  it("a production start with SEED_DEMO=false creates no accounts and no teams", () => {
    expect(setup({ NODE_ENV: "production", SEED_DEMO: "false" })).toEqual({ users: [], teams: 0 });
  });

  it("left unset (npm start for the README's demo, dev, tests) it seeds the demo shop as before", () => {
    expect(setup({}).users).toEqual(["builder@example.com", "other-owner@example.com", "owner@example.com", "viewer@example.com"]);
  });
});
