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
export async function writeTransaction<T>(work: (trx: Knex.Transaction) => Promise<T>, scope: RowScope = {}): Promise<T> {
  const knex = db();
  if (!isPostgres(knex)) return knex.transaction(work);
  for (let attempt = 1; ; attempt++) {
    try {
      return await knex.transaction(
        async (trx) => {
          await setScope(trx, scope);
          return work(trx);
        },
        { isolationLevel: "serializable" },
      );
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (attempt >= ATTEMPTS || !code || !RETRYABLE.has(code)) throw error;
      // a little random wait so the two racers do not collide again in step
      await new Promise((resolve) => setTimeout(resolve, 5 * attempt + Math.random() * 20));
    }
  }
}

/**
 * What PostgreSQL's row-security policies are told about one transaction (migrations 20261219000000_hosted
 * and 20261223000000_row-security-all): the team whose rows it may see and write, and for the few lookups
 * made before the team is known, the one person, session or token hash they may find.
 */
export type RowScope = { teamId?: number; userId?: number; sessionHash?: string; tokenHash?: string };

const SETTINGS = { teamId: "app.team_id", userId: "app.user_id", sessionHash: "app.session_hash", tokenHash: "app.token_hash" } as const;

// SET LOCAL (set_config(…, true)): the settings end with the transaction, so a pooled connection never
// carries them to the next request.
async function setScope(trx: Knex.Transaction, scope: RowScope): Promise<void> {
  for (const key of Object.keys(SETTINGS) as (keyof RowScope)[]) {
    const value = scope[key];
    if (value === undefined) continue;
    if (typeof value === "number" && (!Number.isSafeInteger(value) || value <= 0)) throw new Error(`row scope: bad ${key} ${value}`);
    await trx.raw("select set_config(?, ?, true)", [SETTINGS[key], String(value)]);
  }
}

/**
 * A plain transaction (not SERIALIZABLE: see writeTransaction for read-then-write races) for one team,
 * with app.team_id set for the row-security policies; on SQLite the usual IMMEDIATE transaction.
 */
export async function teamTransaction<T>(teamId: number, work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  const knex = db();
  if (!isPostgres(knex)) return knex.transaction(work);
  return knex.transaction(async (trx) => {
    await setScope(trx, { teamId });
    return work(trx);
  });
}

/** Tells row security about a transaction already begun (a team made inside it); nothing on SQLite. */
export async function setRowScope(trx: Knex.Transaction, scope: RowScope): Promise<void> {
  if (isPostgres(trx)) await setScope(trx, scope);
}

/** Reads (or single writes) in one row scope; on SQLite `work` runs on the plain connection. */
export async function withScope<T>(scope: RowScope, work: (q: Knex) => PromiseLike<T>): Promise<T> {
  const knex = db();
  if (!isPostgres(knex)) return work(knex);
  return knex.transaction(async (trx) => {
    await setScope(trx, scope);
    return work(trx);
  });
}

/**
 * Reads (or writes) for one team with PostgreSQL's row security told which team that is: one
 * transaction that begins with SET LOCAL app.team_id (set_config(…, true)), so the setting ends with it
 * and a pooled connection never carries it to the next request. The policies of migration
 * 20261219000000_hosted then let through only that team's rows — a second wall behind the models'
 * `where team_id`. On SQLite (one shop, no policies) `work` runs on the plain connection.
 */
export async function withTeam<T>(teamId: number, work: (q: Knex) => PromiseLike<T>): Promise<T> {
  if (!Number.isSafeInteger(teamId) || teamId <= 0) throw new Error(`withTeam: bad team id ${teamId}`);
  return withScope({ teamId }, work);
}

export async function closeDb(): Promise<void> {
  const closing = instance;
  instance = undefined;
  await closing?.destroy();
}

export function now(): string {
  return new Date().toISOString();
}
