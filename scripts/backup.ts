// npm run backup [target]: a consistent copy of the instance's database, made while the server runs,
// checked (integrity_check, foreign_key_check) before it is reported. Restore: stop the server, put
// the copy at DATABASE_PATH (remove any -wal/-shm beside it), start the server.
import { backupDatabase } from "../app/utils/backup.server.ts";
import { getEnv } from "../app/utils/env.server.ts";

const env = getEnv();
if (env.DATABASE_URL) {
  console.error(
    "DATABASE_URL is set: PostgreSQL is backed up by the server's own tools (base backup + WAL, or pg_dump); see docs/hosting.md.",
  );
  process.exit(1);
}
const stamp = new Date().toISOString().replace(/[:.]/g, "-");
const target = process.argv[2] ?? `backups/sealwright-${stamp}.sqlite`;
const report = backupDatabase(env.DATABASE_PATH, target);
console.log(JSON.stringify(report, null, 2));
if (report.integrity !== "ok" || report.foreignKeyProblems > 0) process.exit(1);
