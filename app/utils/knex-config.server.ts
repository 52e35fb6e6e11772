import path from "node:path";
import fs from "node:fs";
import type { Knex } from "knex";
import { immediateSqliteClient } from "./immediate-sqlite-client.server";

type SqliteConnection = { pragma: (sql: string) => unknown };

// One connection (SQLite allows one writer), WAL for readers during writes, foreign keys on,
// and a busy timeout so a second process waits instead of failing at once. Transactions begin
// IMMEDIATE (immediate-sqlite-client.server.ts), so that wait also covers read-then-write transactions.
export function knexConfig(databasePath: string): Knex.Config {
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
    migrations: {
      directory: path.resolve("migrations"),
      extension: "ts",
      loadExtensions: [".ts"],
    },
    seeds: {
      directory: path.resolve("migrations/seeds"),
      extension: "ts",
      loadExtensions: [".ts"],
    },
  };
}
