import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import type { Knex } from "knex";
import pg from "pg";
import { immediateSqliteClient } from "./immediate-sqlite-client.server";

type SqliteConnection = { pragma: (sql: string) => unknown };

/** A postgres:// (or postgresql://) URL picks PostgreSQL; anything else is a SQLite file path. */
export function isPostgresUrl(database: string): boolean {
  return /^postgres(ql)?:\/\//i.test(database);
}

// count(*) and sums come back from PostgreSQL as int8/numeric, which pg hands over as strings so that no
// digit is lost. Our counts are far below 2^53, so numbers they are — the same as SQLite gives.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number.parseInt(v, 10));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number.parseFloat(v));

const files = {
  migrations: { directory: path.resolve("migrations"), extension: "ts", loadExtensions: [".ts"] },
  seeds: { directory: path.resolve("migrations/seeds"), extension: "ts", loadExtensions: [".ts"] },
};

/** The Knex config for one database: a SQLite file (the shop's own machine) or a PostgreSQL URL (hosted). */
export function knexConfig(database: string): Knex.Config {
  return isPostgresUrl(database) ? postgresConfig(database) : sqliteConfig(database);
}

// Many app processes share one PostgreSQL, so each keeps a small pool; PG_POOL_MAX × processes must stay
// below the server's max_connections.
function postgresConfig(url: string): Knex.Config {
  return {
    client: "pg",
    connection: withUser(url),
    pool: { min: 0, max: Number(process.env.PG_POOL_MAX ?? 10) },
    ...files,
  };
}

// psql takes the login name when the URL names no user; pg reads only $USER/PGUSER, which a service
// manager may leave unset. Same rule as psql, so postgres://127.0.0.1/test means the same to both.
export function withUser(url: string): string {
  const parsed = new URL(url);
  if (!parsed.username) parsed.username = process.env.PGUSER || process.env.USER || os.userInfo().username;
  return parsed.toString();
}

// One connection (SQLite allows one writer), WAL for readers during writes, foreign keys on,
// and a busy timeout so a second process waits instead of failing at once. Transactions begin
// IMMEDIATE (immediate-sqlite-client.server.ts), so that wait also covers read-then-write transactions.
function sqliteConfig(databasePath: string): Knex.Config {
  if (databasePath !== ":memory:") fs.mkdirSync(path.dirname(path.resolve(databasePath)), { recursive: true });
  return {
    client: immediateSqliteClient,
    connection: { filename: databasePath },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      afterCreate(conn: SqliteConnection, done: (err: Error | null, conn: SqliteConnection) => void) {
        conn.pragma("journal_mode = WAL");
        conn.pragma("foreign_keys = ON");
        conn.pragma("busy_timeout = 5000");
        done(null, conn);
      },
    },
    ...files,
  };
}
