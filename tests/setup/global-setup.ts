import fs from "node:fs";
import path from "node:path";
import knexFactory from "knex";
import { register } from "tsx/esm/api";
import { knexConfig } from "../../app/utils/knex-config.server.ts";

export const TMP_DIR = path.resolve("tests/.tmp");
export const TEMPLATE_DB = path.join(TMP_DIR, "template.sqlite");

// Build the test database once per run from the migrations and the demo seed, so it can never go stale.
// Each test file copies it (tests/setup/setup-file.ts).
export default async function setup() {
  // Knex imports the TypeScript migrations itself; the main Vitest process needs tsx for that.
  const unregister = register();
  fs.rmSync(TMP_DIR, { recursive: true, force: true });
  fs.mkdirSync(TMP_DIR, { recursive: true });
  const knex = knexFactory(knexConfig(TEMPLATE_DB));
  try {
    await knex.migrate.latest();
    await knex.seed.run();
    // Fold the WAL into the main file so a plain copy holds everything.
    await knex.raw("PRAGMA wal_checkpoint(TRUNCATE)");
  } finally {
    await knex.destroy();
    await unregister();
  }
  return () => fs.rmSync(TMP_DIR, { recursive: true, force: true });
}
