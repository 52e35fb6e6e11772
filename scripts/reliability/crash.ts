// npm run reliability:crash — SIGKILLs the built server at a random moment while four clients write,
// CRASH_ROUNDS times (default 100), then checks the database: integrity_check ok, foreign_key_check
// empty, and every write the server acknowledged (302) present. Needs npm run build first.
import Database from "better-sqlite3";
import { freshDatabase, rename, signInCookie, startServer } from "./server.ts";

const ROUNDS = Number(process.env.CRASH_ROUNDS ?? 100);
const PORT = Number(process.env.CRASH_PORT ?? 3331);
const WRITERS = 4;

const { file, env } = freshDatabase("crash");
const acknowledged: string[] = [];
let sent = 0;
let cookie = "";
const started = Date.now();

for (let round = 1; round <= ROUNDS; round++) {
  const server = await startServer(env, PORT);
  cookie ||= await signInCookie(PORT, "owner@example.com");
  let alive = true;
  const writers = Array.from({ length: WRITERS }, async (_, w) => {
    for (let i = 0; alive; i++) {
      const name = `crash ${round}-${w}-${i}`;
      sent++;
      const status = await rename(PORT, cookie, name).catch(() => 0);
      if (status === 302) acknowledged.push(name);
    }
  });
  await new Promise((r) => setTimeout(r, 100 + Math.random() * 500));
  const exited = new Promise((r) => server.once("exit", r));
  server.kill("SIGKILL");
  await exited;
  alive = false;
  await Promise.all(writers);
  if (round % 10 === 0) console.log(`round ${round}: ${acknowledged.length} acknowledged of ${sent} sent`);
}

const db = new Database(file, { readonly: true });
const integrity = (db.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
const foreignKeyProblems = (db.pragma("foreign_key_check") as unknown[]).length;
const recorded = new Set(
  (db.prepare("select detail from audit_events where action = 'team.renamed'").all() as { detail: string }[]).map(
    (r) => JSON.parse(r.detail).name as string,
  ),
);
const missing = acknowledged.filter((name) => !recorded.has(name));
db.close();
const report = {
  kills: ROUNDS,
  sent,
  acknowledged: acknowledged.length,
  missing: missing.length,
  integrity,
  foreignKeyProblems,
  seconds: Math.round((Date.now() - started) / 1000),
};
console.log(JSON.stringify(report));
if (missing.length > 0 || integrity !== "ok" || foreignKeyProblems > 0) process.exit(1);
