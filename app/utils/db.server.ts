import knexFactory, { type Knex } from "knex";
import { getEnv } from "./env.server";
import { knexConfig } from "./knex-config.server";

let instance: Knex | undefined;
let signalsHooked = false;

// The app's single Knex instance. The pool is closed on SIGTERM/SIGINT so the server can exit.
/**
 * A database row as Knex returns it (snake_case columns). Each model maps it to its own camelCase
 * type in one `to…` function next to its queries; nothing else reads raw rows.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- column types vary by driver (SQLite, PostgreSQL)
export type DbRow = Record<string, any>;

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

/**
 * A write and everything that belongs with it (its audit row above all) as one transaction, begun
 * IMMEDIATE: it holds SQLite's write lock from its first statement, so a read inside it cannot go stale
 * and another process's writer makes it wait (busy_timeout), never fail. Every write that is more than
 * one statement goes through here.
 */
export function writeTransaction<T>(work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  return db().transaction(work);
}

export async function closeDb(): Promise<void> {
  const closing = instance;
  instance = undefined;
  await closing?.destroy();
}

export function now(): string {
  return new Date().toISOString();
}
