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

// Knex's better-sqlite3 client prepares every statement anew (SQLite compiles the SQL each time: a tenth
// of a page request's CPU in the plan editor's profile, docs/performance.md). The same SQL on the same
// connection reuses its compiled statement instead; SQLite recompiles a kept statement by itself after a
// schema change (sqlite3_prepare_v2). Only for queries that leave safeIntegers alone (a statement keeps
// that setting), and at most STATEMENTS_KEPT per connection, the oldest dropped first.
const STATEMENTS_KEPT = 500;

interface Statement {
  reader: boolean;
  all(bindings: unknown[]): unknown;
  run(bindings: unknown[]): { lastInsertRowid: number | bigint; changes: number };
}
interface Connection {
  prepare(sql: string): Statement;
}
interface QueryObject {
  sql?: string;
  bindings?: unknown[];
  options?: unknown;
  response?: unknown;
  context?: unknown;
}

const kept = new WeakMap<Connection, Map<string, Statement>>();

function keptStatement(connection: Connection, sql: string): Statement {
  let statements = kept.get(connection);
  if (!statements) kept.set(connection, (statements = new Map()));
  let statement = statements.get(sql);
  if (!statement) {
    statement = connection.prepare(sql);
    statements.set(sql, statement);
    if (statements.size > STATEMENTS_KEPT) statements.delete(statements.keys().next().value as string);
  }
  return statement;
}

type ClientInternals = {
  _optSafeIntegers(options: unknown): boolean | undefined;
  _formatBindings(bindings: unknown[] | undefined): unknown[];
};
const knexQuery = (ClientBetterSqlite3.prototype as unknown as { _query(c: Connection, o: QueryObject): Promise<QueryObject> })._query;

class ImmediateClient extends ClientBetterSqlite3 {
  transaction(container: unknown, config: unknown, outerTx: unknown): Knex.Transaction {
    return new ImmediateTransaction(this, container, config, outerTx) as unknown as Knex.Transaction;
  }

  // as Knex's own _query (knex/lib/dialects/better-sqlite3), with the statement kept
  async _query(connection: Connection, obj: QueryObject): Promise<QueryObject> {
    const self = this as unknown as ClientInternals;
    if (!obj.sql) throw new Error("The query is empty");
    if (!connection) throw new Error("No connection provided");
    if (self._optSafeIntegers(obj.options) !== undefined) return knexQuery.call(this, connection, obj);
    const statement = keptStatement(connection, obj.sql);
    const bindings = self._formatBindings(obj.bindings);
    if (statement.reader) {
      obj.response = statement.all(bindings);
      return obj;
    }
    const response = statement.run(bindings);
    obj.response = response;
    obj.context = { lastID: response.lastInsertRowid, changes: response.changes };
    return obj;
  }
}

export const immediateSqliteClient = ImmediateClient as unknown as typeof Knex.Client;
