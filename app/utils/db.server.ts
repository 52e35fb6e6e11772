import knexFactory, { type Knex } from "knex";
import { getEnv } from "./env.server";
import { knexConfig } from "./knex-config.server";

let instance: Knex | undefined;
let signalsHooked = false;

// The app's single Knex instance. The pool is closed on SIGTERM/SIGINT so the server can exit.
export function db(): Knex {
  if (instance) return instance;
  instance = knexFactory(knexConfig(getEnv().DATABASE_PATH));
  if (!signalsHooked) {
    signalsHooked = true;
    for (const signal of ["SIGTERM", "SIGINT"] as const) {
      process.once(signal, () => void closeDb().finally(() => process.exit(0)));
    }
  }
  return instance;
}

export async function closeDb(): Promise<void> {
  const closing = instance;
  instance = undefined;
  await closing?.destroy();
}

export function now(): string {
  return new Date().toISOString();
}
