import fs from "node:fs";
import path from "node:path";
import knexFactory from "knex";
import { register } from "tsx/esm/api";
import type { TestProject } from "vitest/node";
import { knexConfig } from "../../app/utils/knex-config.server.ts";

declare module "vitest" {
  export interface ProvidedContext {
    testDbDir: string;
  }
}

// Build the test database once per run from the migrations and the demo seed, so it can never go stale.
// Each test file copies it (tests/setup/setup-file.ts). Each run has its own folder, so two runs at
// once (a developer and an editor plugin, say) never share files.
export default async function setup(project: TestProject) {
  const dir = path.resolve("tests/.tmp", `run-${process.pid}`);
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  // Knex imports the TypeScript migrations itself; the main Vitest process needs tsx for that.
  const unregister = register();
  const knex = knexFactory(knexConfig(path.join(dir, "template.sqlite")));
  try {
    await knex.migrate.latest();
    await knex.seed.run();
    // Fold the WAL into the main file so a plain copy holds everything.
    await knex.raw("PRAGMA wal_checkpoint(TRUNCATE)");
  } finally {
    await knex.destroy();
    await unregister();
  }
  project.provide("testDbDir", dir);
  return () => fs.rmSync(dir, { recursive: true, force: true });
}
