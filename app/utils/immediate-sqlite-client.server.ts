import { createRequire } from "node:module";
import type { Knex } from "knex";

// Knex opens every SQLite transaction with a plain (deferred) BEGIN: the transaction reads first and
// asks for the write lock only at its first write. If another process wrote in between, SQLite cannot
// wait (the read snapshot is stale) and answers SQLITE_BUSY at once — a 500. BEGIN IMMEDIATE takes the
// write lock up front, so a second writer simply waits its busy_timeout. This client is better-sqlite3's,
// with only the transaction's first statement changed; savepoints (nested transactions) are unchanged.

const require = createRequire(import.meta.url);
const ClientBetterSqlite3 = require("knex/lib/dialects/better-sqlite3/index.js") as new (config: Knex.Config) => Knex.Client;
const TransactionSqlite = require("knex/lib/dialects/sqlite3/execution/sqlite-transaction.js") as new (...args: unknown[]) => {
  query(conn: unknown, sql: string): Promise<unknown>;
};

class ImmediateTransaction extends TransactionSqlite {
  begin(conn: unknown) {
    return this.query(conn, "BEGIN IMMEDIATE;");
  }
}

class ImmediateClient extends ClientBetterSqlite3 {
  transaction(container: unknown, config: unknown, outerTx: unknown): Knex.Transaction {
    return new ImmediateTransaction(this, container, config, outerTx) as unknown as Knex.Transaction;
  }
}

export const immediateSqliteClient = ImmediateClient as unknown as typeof Knex.Client;
