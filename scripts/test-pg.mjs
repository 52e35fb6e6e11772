// npm run test:pg — the integration suite again, on PostgreSQL (tests/setup/postgres.ts: a template
// database per run, a fresh copy per test file). TEST_DATABASE_URL picks the server; the default is this
// project's machines' local one. With --if-reachable (what `npm test` passes) a server that does not
// answer skips the pass with a line saying so, so a machine without PostgreSQL still passes `npm test`.
import { spawnSync } from "node:child_process";
import net from "node:net";

const url = process.env.TEST_DATABASE_URL || "postgres://127.0.0.1:5432/test";
const optional = process.argv.includes("--if-reachable");
const { hostname, port } = new URL(url);

const reachable = await new Promise((resolve) => {
  const socket = net.connect({ host: hostname || "127.0.0.1", port: Number(port || 5432) });
  const done = (ok) => {
    socket.destroy();
    resolve(ok);
  };
  socket.setTimeout(1000, () => done(false));
  socket.once("connect", () => done(true));
  socket.once("error", () => done(false));
});

if (!reachable) {
  const line = `PostgreSQL pass: no server answers at ${hostname}:${port || 5432}`;
  if (optional) {
    console.log(`${line}; skipped (set TEST_DATABASE_URL, or start PostgreSQL, to run it).`);
    process.exit(0);
  }
  console.error(`${line}.`);
  process.exit(1);
}

console.log(`PostgreSQL pass: the integration suite on ${url.replace(/\/\/[^@/]*@/, "//…@")}`);
// files about SQLite itself (BEGIN IMMEDIATE, VACUUM INTO, its query planner) are named *.sqlite.test.ts;
// *.pg.test.ts (row security, PostgreSQL's query plans) run here only (vite.config.ts leaves them out of
// the SQLite run). Vitest ORs its file filters, so "tests/integration" goes in only when no file is named.
const rest = process.argv.slice(2).filter((a) => a !== "--if-reachable");
const named = rest.some((a) => !a.startsWith("-"));
const args = ["vitest", "run", ...(named ? [] : ["tests/integration"]), "--exclude", "**/*.sqlite.test.ts", ...rest];
const run = spawnSync("npx", args, { stdio: "inherit", env: { ...process.env, TEST_DATABASE_URL: url } });
process.exit(run.status ?? 1);
