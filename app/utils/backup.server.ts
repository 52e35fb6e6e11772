import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";

// The instance backup: VACUUM INTO writes a consistent, compacted copy of the whole database while the
// server keeps running (readers and the writer carry on; the copy is one transaction's view). The copy
// is then opened and checked, so a backup that would not restore is known at once.

export interface BackupReport {
  file: string;
  bytes: number;
  integrity: string;
  foreignKeyProblems: number;
  rows: Record<string, number>;
}

export function backupDatabase(databasePath: string, target: string): BackupReport {
  fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
  if (fs.existsSync(target)) throw new Error(`${target} exists; a backup never overwrites a file`);
  const source = new Database(databasePath, { readonly: true, fileMustExist: true });
  try {
    source.prepare("VACUUM INTO ?").run(target);
  } finally {
    source.close();
  }
  return checkDatabase(target);
}

/** integrity_check, foreign_key_check and row counts of a database file (a backup, or a restored copy). */
export function checkDatabase(file: string): BackupReport {
  const copy = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const integrity = (copy.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
    const foreignKeyProblems = (copy.pragma("foreign_key_check") as unknown[]).length;
    const tables = copy.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name").all() as {
      name: string;
    }[];
    const rows = Object.fromEntries(
      tables.map(({ name }) => [name, (copy.prepare(`select count(*) as n from "${name}"`).get() as { n: number }).n]),
    );
    return { file, bytes: fs.statSync(file).size, integrity, foreignKeyProblems, rows };
  } finally {
    copy.close();
  }
}
