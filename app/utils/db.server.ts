import knexFactory, { type Knex } from "knex";
import { databaseTarget } from "./env.server";
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
  instance = knexFactory(knexConfig(databaseTarget()));
  if (!signalsHooked) {
    signalsHooked = true;
    for (const signal of ["SIGTERM", "SIGINT"] as const) {
      process.once(signal, () => void closeDb().finally(() => process.exit(0)));
    }
  }
  return instance;
}

/** True when this process talks to PostgreSQL (DATABASE_URL), false on SQLite. */
export function isPostgres(knex: Knex = db()): boolean {
  return knex.client.config.client === "pg";
}

// PostgreSQL's answers for "another transaction got there first; run yours again": serialization
// failure and deadlock.
const RETRYABLE = new Set(["40001", "40P01"]);
const ATTEMPTS = 5;

/**
 * A write and everything that belongs with it (its audit row above all) as one transaction.
 * SQLite: begun IMMEDIATE, it holds the write lock from its first statement, so a read inside it cannot
 * go stale and another process's writer makes it wait (busy_timeout), never fail.
 * PostgreSQL: SERIALIZABLE, the same promise across app processes — a read-then-write (a count, a last
 * owner, a quota) that another process raced is refused with 40001 and run again here from the start,
 * so `work` must only touch the database. Every write that is more than one statement goes through here.
 */
export async function writeTransaction<T>(work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  const knex = db();
  if (!isPostgres(knex)) return knex.transaction(work);
  for (let attempt = 1; ; attempt++) {
    try {
      return await knex.transaction(work, { isolationLevel: "serializable" });
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (attempt >= ATTEMPTS || !code || !RETRYABLE.has(code)) throw error;
      // a little random wait so the two racers do not collide again in step
      await new Promise((resolve) => setTimeout(resolve, 5 * attempt + Math.random() * 20));
    }
  }
}

/**
 * Reads (or writes) for one team with PostgreSQL's row security told which team that is: one
 * transaction that begins with SET LOCAL app.team_id (set_config(…, true)), so the setting ends with it
 * and a pooled connection never carries it to the next request. The policies of migration
 * 20261219000000_hosted then let through only that team's rows — a second wall behind the models'
 * `where team_id`. On SQLite (one shop, no policies) `work` runs on the plain connection.
 */
export async function withTeam<T>(teamId: number, work: (q: Knex) => Promise<T>): Promise<T> {
  if (!Number.isSafeInteger(teamId) || teamId <= 0) throw new Error(`withTeam: bad team id ${teamId}`);
  const knex = db();
  if (!isPostgres(knex)) return work(knex);
  return knex.transaction(async (trx) => {
    await trx.raw("select set_config('app.team_id', ?, true)", [String(teamId)]);
    return work(trx);
  });
}

export async function closeDb(): Promise<void> {
  const closing = instance;
  instance = undefined;
  await closing?.destroy();
}

export function now(): string {
  return new Date().toISOString();
}
