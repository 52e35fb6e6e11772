// Loopback server run: the built app (npm run build) on a fresh demo database, autocannon against the
// health route, the estimate API, the engine list, a plan editor (from the page cache, and rendered
// afresh) and the dashboard, one after another
// in the same run, so each figure is a ratio to the health route measured minutes apart at most.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import autocannon from "autocannon";
import Database from "better-sqlite3";
import { PlanInputSchema } from "../../../app/lib/clamp";
import { v8Raw } from "../../unit/lib/clamp/fixtures";
import { fmt, median, type Row } from "./measure";

const ROOT = path.resolve(import.meta.dirname, "../../..");
// 3306 (this helper's e2e port) is taken by a MariaDB on this machine: the bench uses 3396 unless told
export const BENCH_PORT = Number(process.env.BENCH_PORT ?? 3396);
const ORIGIN = `http://127.0.0.1:${BENCH_PORT}`;
const ENV = {
  ...process.env,
  PORT: String(BENCH_PORT),
  HOST: "127.0.0.1",
  NODE_ENV: "production",
  SESSION_SECRET: "bench-secret-bench-secret-bench-secret-01",
  RATE_LIMIT_STORE: "memory",
};

export interface Server {
  dbPath: string;
  stop: () => Promise<void>;
}

/** A fresh demo database at dbPath (migrations + demo seed), then the built server on it. */
export async function startServer(dbPath: string, seed = true): Promise<Server> {
  if (!fs.existsSync(path.join(ROOT, "build/server/index.js"))) throw new Error("No build: run npm run build first.");
  if (seed) {
    fs.rmSync(path.dirname(dbPath), { recursive: true, force: true });
    fs.mkdirSync(path.dirname(dbPath), { recursive: true });
    const r = spawnSync("npm", ["run", "--silent", "db:setup"], { cwd: ROOT, env: { ...ENV, DATABASE_PATH: dbPath }, stdio: "ignore" });
    if (r.status !== 0) throw new Error("db:setup failed");
  }
  const child: ChildProcess = spawn(process.execPath, ["scripts/serve.mjs", "build/server/index.js"], {
    cwd: ROOT,
    env: { ...ENV, DATABASE_PATH: dbPath },
    stdio: "ignore",
  });
  let exited = false;
  child.once("exit", () => (exited = true));
  let up = false;
  for (let i = 0; i < 400 && !up && !exited; i++) {
    try {
      up = (await fetch(`${ORIGIN}/healthz`)).ok;
    } catch {
      await new Promise((r) => setTimeout(r, 150));
    }
  }
  if (!up) throw new Error(`the server did not come up on port ${BENCH_PORT}${exited ? " (it exited: is the port taken?)" : ""}`);
  return {
    dbPath,
    stop: () =>
      new Promise((resolve) => {
        if (exited) return resolve();
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
      }),
  };
}

/** Signs the demo builder in through the real form and returns the session cookie. */
export async function signIn(email = "builder@example.com"): Promise<string> {
  const res = await fetch(`${ORIGIN}/login`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: ORIGIN },
    body: new URLSearchParams({ email, password: "sealwright-demo" }),
  });
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  if (!cookie.includes("=")) throw new Error(`sign-in failed: ${res.status}`);
  return cookie;
}

/**
 * A plan of the demo builder's shop, read from the database (the URL the editor lives at). With
 * torquePlanned, the first plan whose preload follows its torque (not one planned by stretch, where a
 * new torque changes none of the figures the browser probe watches).
 */
export function somePlanPath(dbPath: string, torquePlanned = false): string {
  const d = new Database(dbPath, { readonly: true });
  try {
    const row = d
      .prepare(
        "select p.id as planId, p.engine_id as engineId from seal_plans p join memberships m on m.team_id = p.team_id join users u on u.id = m.user_id where u.email = ? and p.archived_at is null" +
          (torquePlanned ? " and p.method like 'torque-%'" : "") +
          " order by p.id limit 1",
      )
      .get("builder@example.com") as { planId: number; engineId: number };
    return `/engines/${row.engineId}/plans/${row.planId}`;
  } finally {
    d.close();
  }
}

export interface Load {
  name: string;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  non2xx: number;
}

/** Percentile of a sorted list (nearest rank). */
const pct = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)]! : NaN);

export async function hammer(name: string, opts: autocannon.Options): Promise<Load> {
  // every response time, for p95 (autocannon's own summary stops at p90 and p97.5)
  const times: number[] = [];
  const run = autocannon({ connections: 8, ...opts, url: `${ORIGIN}${opts.url ?? "/"}` });
  run.on("response", (_client: unknown, _status: number, _bytes: number, ms: number) => times.push(ms));
  const r = await run;
  times.sort((a, b) => a - b);
  return { name, rps: r.requests.average, p50: pct(times, 0.5), p95: pct(times, 0.95), p99: pct(times, 0.99), non2xx: r.non2xx + r.errors };
}

/** One round over every route: health first and last (its median is the baseline). */
export async function serverRound(cookie: string, planPath: string, seconds: number): Promise<Load[]> {
  const headers = { cookie, origin: ORIGIN };
  const body = JSON.stringify({ input: PlanInputSchema.parse(v8Raw()), units: "metric" });
  const out: Load[] = [];
  out.push(await hammer("health", { url: "/healthz", duration: seconds }));
  // the API allows 240 requests a minute per person: a fixed count under that, not a duration
  out.push(
    await hammer("estimate API", {
      url: "/api/v1/estimate",
      method: "POST",
      headers: { ...headers, "content-type": "application/json" },
      body,
      amount: 200,
      connections: 4,
    }),
  );
  out.push(await hammer("engines list", { url: "/engines", headers, duration: seconds }));
  out.push(await hammer("plan editor", { url: planPath, headers, duration: seconds }));
  // the same page rendered every time: a toast cookie (any value) keeps the page cache out of the way
  // (app/utils/page-cache.server.ts), as a first view or a view after a write costs
  out.push(
    await hammer("plan editor, uncached", {
      url: planPath,
      headers: { ...headers, cookie: `${cookie}; sw_toast=bench` },
      duration: seconds,
    }),
  );
  out.push(await hammer("dashboard", { url: "/dashboard", headers, duration: seconds }));
  const h2 = await hammer("health", { url: "/healthz", duration: seconds });
  out[0] = {
    ...out[0],
    rps: (out[0].rps + h2.rps) / 2,
    p95: (out[0].p95 + h2.p95) / 2,
    p50: (out[0].p50 + h2.p50) / 2,
    p99: (out[0].p99 + h2.p99) / 2,
  };
  return out;
}

export async function serverRows(rounds: number, seconds: number): Promise<Row[]> {
  const server = await startServer(path.join(ROOT, "tests/.bench-data/server.sqlite"));
  try {
    const cookie = await signIn();
    const planPath = somePlanPath(server.dbPath);
    const all: Load[][] = [];
    for (let i = 0; i < rounds; i++) {
      // a fresh sign-in each round keeps the API's per-person allowance
      all.push(await serverRound(i === 0 ? cookie : await signIn(i % 2 ? "owner@example.com" : "builder@example.com"), planPath, seconds));
    }
    const names = all[0].map((l) => l.name);
    const rows: Row[] = [];
    const healthRps = median(all.map((r) => r[0].rps));
    const healthP95 = median(all.map((r) => r[0].p95));
    for (const [i, name] of names.entries()) {
      const rps = median(all.map((r) => r[i].rps));
      const p50 = median(all.map((r) => r[i].p50));
      const p95 = median(all.map((r) => r[i].p95));
      const p99 = median(all.map((r) => r[i].p99));
      const bad = all.reduce((s, r) => s + r[i].non2xx, 0);
      const value = `${fmt(rps, 0)} req/s, p50/p95/p99 ${fmt(p50, 0)}/${fmt(p95, 0)}/${fmt(p99, 0)} ms${bad ? `, ${bad} non-2xx` : ""}`;
      if (i === 0) rows.push({ figure: "server: health", value, target: "baseline", met: null });
      else {
        const share = rps / healthRps;
        const p95x = p95 / Math.max(healthP95, 1);
        const target = name === "plan editor" ? "≥ 50 % of health, p95 ≤ ×2" : "info (ratio)";
        const met = name === "plan editor" ? share >= 0.5 && p95x <= 2 && bad === 0 : null;
        rows.push({ figure: `server: ${name}`, value: `${value}; ${fmt(share * 100, 1)} % of health, p95 ×${fmt(p95x, 1)}`, target, met });
      }
    }
    return rows;
  } finally {
    await server.stop();
  }
}
