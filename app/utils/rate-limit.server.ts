import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { Redis } from "ioredis";
import pg from "pg";
import {
  RateLimiterMemory,
  RateLimiterPostgres,
  RateLimiterRedis,
  RateLimiterRes,
  RateLimiterSQLite,
  type RateLimiterAbstract,
} from "rate-limiter-flexible";
import { getEnv } from "./env.server";
import { withUser } from "./knex-config.server";

// Throttles for the doors anyone can knock on: sign-in (per account and per address), sign-up and the
// API (per address, then per person or per token). Every attempt takes a point *before* the work it
// guards (an argon2 hash, a model run), so a thousand guesses sent at once still pay for at most
// `points` hashes. Past the points the key is locked for a short time that doubles with each lock in a
// day (30 s, 1 min, 2 min … at most `maxLockSec`): an attacker waits longer and longer, a person who
// mistyped waits half a minute.
//
// The counts live in a store chosen by RATE_LIMIT_STORE: "memory" (this process; the default),
// "sqlite" (a file beside the database, shared by every process on the machine), or for the hosted path
// (docs/hosting.md) "redis" (REDIS_URL) or "postgres" (the rate_limits table in DATABASE_URL's database),
// shared by every process on every machine.

export interface ThrottleRule {
  /** Attempts allowed in the window before a lock. */
  points: number;
  windowSec: number;
  firstLockSec: number;
  maxLockSec: number;
}

export const RULES = {
  // One account: five tries, then 30 s, doubling to 15 min. Success clears it.
  signInAccount: { points: 5, windowSec: 15 * 60, firstLockSec: 30, maxLockSec: 15 * 60 },
  // One address (a shop's whole network may share it): thirty failed tries per 15 min.
  signInAddress: { points: 30, windowSec: 15 * 60, firstLockSec: 60, maxLockSec: 15 * 60 },
  // New shops from one address: ten an hour (each is a hash and a library of rows).
  signUpAddress: { points: 10, windowSec: 60 * 60, firstLockSec: 5 * 60, maxLockSec: 60 * 60 },
  // Password-reset mails to one address: three an hour, so nobody can flood someone's inbox. Counted
  // alike for addresses with and without an account; a refused request gets the same answer.
  resetEmail: { points: 3, windowSec: 60 * 60, firstLockSec: 60 * 60, maxLockSec: 60 * 60 },
  // The estimate API runs the model (sweep and uncertainty): generous for live editing, bounded for scripts.
  apiUser: { points: 240, windowSec: 60, firstLockSec: 10, maxLockSec: 5 * 60 },
  apiAddress: { points: 600, windowSec: 60, firstLockSec: 10, maxLockSec: 5 * 60 },
  // One personal API token (a script or a dyno laptop): the same budget as a person in the browser.
  apiToken: { points: 240, windowSec: 60, firstLockSec: 10, maxLockSec: 5 * 60 },
} as const satisfies Record<string, ThrottleRule>;

export type ThrottleName = keyof typeof RULES;

const DAY_SEC = 24 * 3600;

let sqliteClient: Database.Database | undefined;

function sqliteStore(): Database.Database {
  if (sqliteClient) return sqliteClient;
  const env = getEnv();
  const file = env.RATE_LIMIT_SQLITE_PATH ?? path.join(path.dirname(path.resolve(env.DATABASE_PATH)), "rate-limit.sqlite");
  fs.mkdirSync(path.dirname(file), { recursive: true });
  sqliteClient = new Database(file);
  sqliteClient.pragma("journal_mode = WAL");
  sqliteClient.pragma("busy_timeout = 2000");
  return sqliteClient;
}

let redisClient: Redis | undefined;
let pgPool: pg.Pool | undefined;

function redisStore(): Redis {
  // A refused command fails fast (the throttle then answers 500) rather than queueing for ever.
  redisClient ??= new Redis(getEnv().REDIS_URL, { maxRetriesPerRequest: 2, lazyConnect: false });
  return redisClient;
}

function postgresStore(): pg.Pool {
  const url = getEnv().DATABASE_URL;
  if (!url) throw new Error("RATE_LIMIT_STORE=postgres needs DATABASE_URL (postgres://…)");
  // Its own small pool: a burst of sign-ins never waits behind the app's queries for a connection.
  pgPool ??= new pg.Pool({ connectionString: withUser(url), max: 3 });
  return pgPool;
}

/** One counter in the configured store. `store` and `prefix` are for tests that stand in for two processes. */
export function limiter(keyPrefix: string, points: number, duration: number, store = getEnv().RATE_LIMIT_STORE): RateLimiterAbstract {
  const prefixed = `${getEnv().RATE_LIMIT_KEY_PREFIX}${keyPrefix}`;
  if (store === "redis") return new RateLimiterRedis({ storeClient: redisStore(), keyPrefix: prefixed, points, duration });
  if (store === "postgres") {
    // The table is made by migration 20261219000000_hosted (tableCreated: no CREATE at start-up).
    return new RateLimiterPostgres({
      storeClient: postgresStore(),
      storeType: "pool",
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix: prefixed,
      points,
      duration,
      clearExpiredByTimeout: true,
    });
  }
  if (store === "sqlite") {
    return new RateLimiterSQLite({
      storeClient: sqliteStore(),
      storeType: "better-sqlite3",
      tableName: "rate_limits",
      keyPrefix,
      points,
      duration,
      clearExpiredByTimeout: true,
    });
  }
  return new RateLimiterMemory({ keyPrefix, points, duration });
}

/** Closes the network stores' connections (tests, shutdown). */
export async function closeRateLimitStores(): Promise<void> {
  const [redis, pool] = [redisClient, pgPool];
  redisClient = undefined;
  pgPool = undefined;
  await Promise.all([redis?.quit(), pool?.end()]);
}

export class Throttle {
  private readonly counter: RateLimiterAbstract;
  private readonly locks: RateLimiterAbstract;

  constructor(
    readonly name: string,
    readonly rule: ThrottleRule,
  ) {
    this.counter = limiter(name, rule.points, rule.windowSec);
    // how many locks this key had today: each one doubles the next
    this.locks = limiter(`${name}-locks`, Number.MAX_SAFE_INTEGER, DAY_SEC);
  }

  /** Takes one attempt for the key: 0 when it may go on, else the milliseconds to wait. */
  async take(key: string): Promise<number> {
    try {
      await this.counter.consume(key);
      return 0;
    } catch (refused) {
      if (!(refused instanceof RateLimiterRes)) throw refused;
      // The attempt that first goes past the points sets the lock; later ones wait it out.
      if (refused.consumedPoints === this.rule.points + 1) {
        const n = (await this.locks.penalty(key)).consumedPoints;
        const lockSec = Math.min(this.rule.maxLockSec, this.rule.firstLockSec * 2 ** Math.min(n - 1, 30));
        await this.counter.block(key, lockSec);
        return lockSec * 1000;
      }
      return Math.max(refused.msBeforeNext, 1000);
    }
  }

  /** Gives back one attempt (a sign-in that succeeded does not count against its address). */
  async refund(key: string): Promise<void> {
    const now = await this.counter.get(key);
    if (now && now.consumedPoints > 0 && now.consumedPoints <= this.rule.points) await this.counter.reward(key, 1);
  }

  /** Forgets the key (a successful sign-in clears its account's failures and locks). */
  async clear(key: string): Promise<void> {
    await Promise.all([this.counter.delete(key), this.locks.delete(key)]);
  }
}

let throttles: Record<ThrottleName, Throttle> | undefined;

export function throttle(name: ThrottleName): Throttle {
  throttles ??= Object.fromEntries(Object.entries(RULES).map(([n, rule]) => [n, new Throttle(n, rule)])) as Record<ThrottleName, Throttle>;
  return throttles[name];
}

/** Fresh counters (tests). */
export function resetThrottles(): void {
  throttles = undefined;
  try {
    sqliteClient?.exec("DELETE FROM rate_limits");
  } catch {
    // no table yet: nothing counted
  }
}

/** Takes an attempt from each (name, key) in order, stopping at the first refusal; 0 or ms to wait. */
export async function takeAll(pairs: [ThrottleName, string][]): Promise<number> {
  for (const [name, key] of pairs) {
    const wait = await throttle(name).take(key);
    if (wait > 0) return wait;
  }
  return 0;
}

/** The Retry-After value (whole seconds, at least 1) for a wait in milliseconds. */
export function retryAfterSeconds(waitMs: number): number {
  return Math.max(1, Math.ceil(waitMs / 1000));
}

export function tooManyHeaders(waitMs: number): Record<string, string> {
  return { "Retry-After": String(retryAfterSeconds(waitMs)) };
}

/** "2 minutes", "30 seconds": for the person reading the refusal. */
export function waitWords(waitMs: number): string {
  const s = retryAfterSeconds(waitMs);
  if (s < 90) return `${s} second${s === 1 ? "" : "s"}`;
  const m = Math.ceil(s / 60);
  return `${m} minute${m === 1 ? "" : "s"}`;
}
