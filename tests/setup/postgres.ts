import crypto from "node:crypto";
import pg from "pg";
import { withUser } from "../../app/utils/knex-config.server.ts";

// The PostgreSQL side of the test setup: a template database built once per run, and a fresh copy of it
// per test file (CREATE DATABASE … TEMPLATE is a file copy inside the server: far cheaper than migrating).
// Every name starts with TEST_DATABASE_PREFIX (default sw_t) so a forgotten database is easy to find and
// drop, and two people sharing one server can keep theirs apart.

/** The URL the PostgreSQL pass runs against (TEST_DATABASE_URL), or null for the SQLite pass. */
export function testPostgresUrl(): string | null {
  const url = process.env.TEST_DATABASE_URL;
  return url && /^postgres(ql)?:\/\//i.test(url) ? url : null;
}

/** The same server, another database. */
export function urlFor(baseUrl: string, database: string): string {
  const url = new URL(baseUrl);
  url.pathname = `/${database}`;
  return url.toString();
}

export function uniqueName(kind: string): string {
  const prefix = (process.env.TEST_DATABASE_PREFIX ?? "sw_t").replace(/[^a-z0-9_]/gi, "");
  return `${prefix}${kind}_${process.pid}_${crypto.randomBytes(4).toString("hex")}`;
}

async function admin<T>(baseUrl: string, work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: withUser(baseUrl) });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

const ident = (name: string) => `"${name.replace(/"/g, '""')}"`;

/** Creates a database (empty, or a copy of `template`). Retries while another copy of the template is being made. */
export async function createDatabase(baseUrl: string, name: string, template?: string): Promise<void> {
  const sql = `CREATE DATABASE ${ident(name)}${template ? ` TEMPLATE ${ident(template)}` : ""}`;
  for (let attempt = 1; ; attempt++) {
    try {
      await admin(baseUrl, (c) => c.query(sql));
      return;
    } catch (error) {
      // 55006: "source database is being accessed by other users" — a parallel file copying it right now
      if ((error as { code?: string }).code !== "55006" || attempt >= 40) throw error;
      await new Promise((r) => setTimeout(r, 50 + Math.random() * 100));
    }
  }
}

export async function dropDatabase(baseUrl: string, name: string): Promise<void> {
  await admin(baseUrl, (c) => c.query(`DROP DATABASE IF EXISTS ${ident(name)} WITH (FORCE)`));
}

type RawRunner = { raw: (sql: string, bindings?: readonly string[]) => Promise<unknown> };

/**
 * The hosted app role (docs/hosting.md, docs/decisions/0018-row-security.md) for a test run: a login role
 * that owns nothing and does not bypass row security, granted the tables and sequences of the database
 * `owner` is connected to. Roles are cluster-wide, so each run makes its own and drops it after.
 */
export async function createAppRole(owner: RawRunner, role: string): Promise<void> {
  await owner.raw(`create role ${ident(role)} login nosuperuser nocreatedb nocreaterole nobypassrls`);
  await owner.raw(`grant select, insert, update, delete on all tables in schema public to ${ident(role)}`);
  await owner.raw(`grant usage, select on all sequences in schema public to ${ident(role)}`);
}

export async function dropRole(baseUrl: string, role: string): Promise<void> {
  await admin(baseUrl, (c) => c.query(`DROP ROLE IF EXISTS ${ident(role)}`));
}

/** The same URL with another user (trust auth on the project's machines: no password). */
export function urlAs(url: string, user: string): string {
  const parsed = new URL(url);
  parsed.username = user;
  parsed.password = "";
  return parsed.toString();
}
