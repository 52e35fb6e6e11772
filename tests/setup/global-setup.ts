import fs from "node:fs";
import path from "node:path";
import knexFactory from "knex";
import { register } from "tsx/esm/api";
import type { TestProject } from "vitest/node";
import { knexConfig } from "../../app/utils/knex-config.server.ts";
import { createAppRole, createDatabase, dropDatabase, dropRole, testPostgresUrl, uniqueName, urlFor } from "./postgres.ts";

declare module "vitest" {
  export interface ProvidedContext {
    testDbDir: string;
    /** Set on the PostgreSQL pass: the server's URL and the template database each test file copies. */
    pgBaseUrl: string | null;
    pgTemplate: string | null;
    /** On the PostgreSQL pass: the role that owns nothing (RLS binds it), granted the template's tables. */
    pgAppRole: string | null;
  }
}

// Build the test database once per run from the migrations and the demo seed, so it can never go stale.
// Each test file copies it (tests/setup/setup-file.ts). Each run has its own folder (and, on PostgreSQL,
// its own template database), so two runs at once never share anything.
// TEST_DATABASE_URL=postgres://… makes the run a PostgreSQL pass: the template is a database there.
export default async function setup(project: TestProject) {
  const dir = path.resolve("tests/.tmp", `run-${process.pid}`);
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  const pgBaseUrl = testPostgresUrl();
  const pgTemplate = pgBaseUrl ? uniqueName("_tpl") : null;
  if (pgBaseUrl && pgTemplate) await createDatabase(pgBaseUrl, pgTemplate);
  // Knex imports the TypeScript migrations itself; the main Vitest process needs tsx for that.
  const unregister = register();
  const knex = knexFactory(knexConfig(pgBaseUrl && pgTemplate ? urlFor(pgBaseUrl, pgTemplate) : path.join(dir, "template.sqlite")));
  try {
    await knex.migrate.latest();
    await knex.seed.run();
    // The app role of docs/hosting.md for this run: it owns nothing, so row security binds it. Its grants
    // are on the template's tables, and every per-file copy carries them.
    if (pgBaseUrl && pgTemplate) await createAppRole(knex, `${pgTemplate}_app`);
    // Fold the WAL into the main file so a plain copy holds everything.
    if (!pgBaseUrl) await knex.raw("PRAGMA wal_checkpoint(TRUNCATE)");
  } finally {
    await knex.destroy();
    await unregister();
  }
  project.provide("testDbDir", dir);
  project.provide("pgBaseUrl", pgBaseUrl);
  project.provide("pgTemplate", pgTemplate);
  project.provide("pgAppRole", pgTemplate ? `${pgTemplate}_app` : null);
  return async () => {
    fs.rmSync(dir, { recursive: true, force: true });
    if (pgBaseUrl && pgTemplate) {
      await dropDatabase(pgBaseUrl, pgTemplate);
      await dropRole(pgBaseUrl, `${pgTemplate}_app`);
    }
  };
}
