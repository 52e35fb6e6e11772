import { db } from "~/utils/db.server";

/**
 * The SELECT statements a model function sends (from Knex's query event), for the query-plan tests of
 * both engines; PostgreSQL's set_config of the row scope is not a read and is left out.
 */
export async function capturedSelects(run: () => Promise<unknown>): Promise<{ sql: string; bindings: unknown[] }[]> {
  const seen: { sql: string; bindings: unknown[] }[] = [];
  const listen = (q: { sql: string; bindings?: unknown[] }) => seen.push({ sql: q.sql, bindings: q.bindings ?? [] });
  db().on("query", listen);
  try {
    await run();
  } finally {
    db().removeListener("query", listen);
  }
  return seen.filter((q) => /^\s*select/i.test(q.sql) && !/set_config/.test(q.sql));
}
