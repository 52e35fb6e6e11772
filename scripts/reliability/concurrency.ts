// npm run reliability:concurrency — 20 clients writing through the built server while a second process
// takes SQLite's write lock for 1.5 s at a time (0.5 s apart), for CONCURRENCY_SECONDS (default 20).
// Every answer must be a 302 (written) — no 5xx, no SQLITE_BUSY. Needs npm run build first.
import { spawn } from "node:child_process";
import { freshDatabase, rename, signInCookie, startServer } from "./server.ts";

const SECONDS = Number(process.env.CONCURRENCY_SECONDS ?? 20);
const PORT = Number(process.env.CONCURRENCY_PORT ?? 3332);
const WRITERS = 20;

const { file, env } = freshDatabase("concurrency");
const server = await startServer(env, PORT);
const cookie = await signInCookie(PORT, "owner@example.com");

const holder = spawn(
  process.execPath,
  [
    "-e",
    `const D = require("better-sqlite3"); const d = new D(process.argv[1], { timeout: 10000 });
     const end = Date.now() + Number(process.argv[2]) * 1000; let holds = 0;
     const sleep = (ms) => Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
     while (Date.now() < end) { d.exec("BEGIN IMMEDIATE"); sleep(1500); d.exec("COMMIT"); holds++; sleep(500); }
     console.log(holds);`,
    file,
    String(SECONDS),
  ],
  { cwd: process.cwd(), stdio: ["ignore", "pipe", "inherit"] },
);
let holds = "";
holder.stdout.on("data", (d) => (holds += String(d)));
const holderDone = new Promise((r) => holder.once("exit", r));

const statuses = new Map<number, number>();
const latencies: number[] = [];
const end = Date.now() + SECONDS * 1000;
await Promise.all(
  Array.from({ length: WRITERS }, async (_, w) => {
    for (let i = 0; Date.now() < end; i++) {
      const t0 = performance.now();
      const status = await rename(PORT, cookie, `busy ${w}-${i}`).catch(() => 0);
      latencies.push(performance.now() - t0);
      statuses.set(status, (statuses.get(status) ?? 0) + 1);
    }
  }),
);
await holderDone;
server.kill("SIGTERM");
latencies.sort((a, b) => a - b);
const pct = (p: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(p * latencies.length))]!);
const fiveHundreds = [...statuses].filter(([s]) => s >= 500 || s === 0).reduce((n, [, c]) => n + c, 0);
const report = {
  seconds: SECONDS,
  writers: WRITERS,
  lockHolds: Number(holds.trim()),
  requests: latencies.length,
  statuses: Object.fromEntries(statuses),
  fiveHundreds,
  p50ms: pct(0.5),
  p99ms: pct(0.99),
  maxMs: Math.round(latencies.at(-1)!),
};
console.log(JSON.stringify(report));
if (fiveHundreds > 0) process.exit(1);
