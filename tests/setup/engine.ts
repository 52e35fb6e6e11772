// Which engine this test file runs on (setup-file.ts sets DATABASE_URL on the PostgreSQL pass), for the
// few tests about one engine only: SQLite's BEGIN IMMEDIATE and file backups, PostgreSQL's row security.
export const onPostgres = Boolean(process.env.DATABASE_URL);
export const onSqlite = !onPostgres;

type Raw = { raw: (sql: string) => Promise<unknown> };

/** The rows of a raw query: SQLite's driver gives the array, pg a result with `rows`. */
export function rowsOf<T>(result: unknown): T[] {
  return (Array.isArray(result) ? result : (result as { rows: T[] }).rows) as T[];
}

/** The app's own tables (not Knex's bookkeeping), sorted, on either engine. */
export async function tableNames(knex: Raw): Promise<string[]> {
  const sql = onPostgresKnex(knex)
    ? "select tablename as name from pg_tables where schemaname = current_schema() and tablename not like 'knex_%'"
    : "select name from sqlite_master where type = 'table' and name not like 'knex_%' and name not like 'sqlite_%'";
  return rowsOf<{ name: string }>(await knex.raw(sql))
    .map((r) => r.name)
    .sort();
}

function onPostgresKnex(knex: Raw): boolean {
  return (knex as { client?: { config?: { client?: unknown } } }).client?.config?.client === "pg";
}
