// The target-stretch migration is plain SQL both SQLite and PostgreSQL run (docs: Knex keeps the door open to PostgreSQL).
import knexFactory, { type Knex } from "knex";
import { describe, expect, it } from "vitest";
import * as migration from "../../migrations/20261208000000_plan_target_stretch";
import { ownerDb } from "../setup/db-roles";

/** The SQL a migration step would send to a dialect, without a server: each schema call is rendered, not run. */
async function sqlFor(client: "pg" | "better-sqlite3", step: (k: Knex) => Promise<void>): Promise<string[]> {
  const real = knexFactory({ client, useNullAsDefault: true });
  const out: string[] = [];
  const schema = new Proxy(real.schema, {
    get(target, prop) {
      const value = Reflect.get(target, prop);
      if (typeof value !== "function") return value;
      return (...args: unknown[]) => {
        out.push((value as (...a: unknown[]) => Knex.SchemaBuilder).apply(real.schema, args).toString());
        return Promise.resolve();
      };
    },
  });
  await step({ schema } as unknown as Knex);
  await real.destroy();
  return out;
}

describe("seal_plans.target_stretch_mm", () => {
  it("adds and drops a nullable double column in plain SQL on PostgreSQL and SQLite", async () => {
    expect(await sqlFor("pg", migration.up)).toEqual(['alter table "seal_plans" add column "target_stretch_mm" double precision null']);
    expect(await sqlFor("pg", migration.down)).toEqual(['alter table "seal_plans" drop column "target_stretch_mm"']);
    expect(await sqlFor("better-sqlite3", migration.up)).toEqual(["alter table `seal_plans` add column `target_stretch_mm` float null"]);
  });

  it("is in the test database, empty for the demo's plans", async () => {
    const rows = await ownerDb()("seal_plans").select("target_stretch_mm");
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(r.target_stretch_mm).toBeNull();
  });
});
