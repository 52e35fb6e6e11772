// npm run reliability:multi-process — the hosted path's check (docs/hosting.md): N app processes
// (scripts/serve.mjs, the production server) on one PostgreSQL, limits in one shared store.
//   1. a session made on one process is valid on the other;
//   2. the sign-in throttle counts attempts made on both (five wrong passwords over two, the sixth is 429);
//   3. an engine saved through one is listed by the other, and a plan chosen through one shows on the
//      other's plan editor page though that process had the page in its page cache (the version is the DB's);
//   4. throughput of the plan page and the estimate API with 1, 2 and 4 processes (loopback only).
// Needs `npm run build` and a PostgreSQL (HOSTED_PG_URL, default postgres://127.0.0.1:5432/test): it makes
// its own database there and drops it at the end. RATE_LIMIT_STORE=redis uses REDIS_URL instead.
import { execFileSync, type ChildProcess } from "node:child_process";
import pg from "pg";
import { withUser } from "../../app/utils/knex-config.server.ts";
import { ROOT, signInCookie, startServer } from "./server.ts";

const base = process.env.HOSTED_PG_URL ?? "postgres://127.0.0.1:5432/test";
const dbName = `${process.env.TEST_DATABASE_PREFIX ?? "sw_"}mp_${process.pid}`;
const store = process.env.RATE_LIMIT_STORE === "redis" ? "redis" : "postgres";
const firstPort = Number(process.env.MP_FIRST_PORT ?? 33071);
const seconds = Number(process.env.MP_SECONDS ?? 5);
const concurrency = Number(process.env.MP_CONCURRENCY ?? 8);
// under the estimate API's 240 a minute per person (app/utils/rate-limit.server.ts, RULES.apiUser)
const API_REQUESTS = 200;

async function admin(sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: withUser(base) });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

const url = new URL(base);
url.pathname = `/${dbName}`;
const env: Record<string, string> = {
  PATH: process.env.PATH ?? "",
  NODE_ENV: "production",
  DATABASE_URL: url.toString(),
  RATE_LIMIT_STORE: store,
  RATE_LIMIT_KEY_PREFIX: `sw-mp-${process.pid}:`,
  REDIS_URL: process.env.REDIS_URL ?? "redis://127.0.0.1:6379",
  SESSION_SECRET: "multi-process-secret-multi-process-01",
  COOKIE_SECURE: "false",
  PG_POOL_MAX: "4",
};

// The app processes connect as a role that owns nothing, so PostgreSQL's row security binds them
// (docs/decisions/0018-row-security.md); migrations, the seed and this script's own reads use the owner.
const appRole = `${dbName}_app`;
const appUrl = new URL(url.toString());
appUrl.username = appRole;
const appEnv: Record<string, string> = { ...env, DATABASE_URL: appUrl.toString() };
async function grantAppRole(): Promise<void> {
  await admin(`drop role if exists "${appRole}"`);
  await admin(`create role "${appRole}" login nosuperuser nocreatedb nocreaterole nobypassrls`);
  const client = new pg.Client({ connectionString: withUser(url.toString()) });
  await client.connect();
  try {
    await client.query(`grant select, insert, update, delete on all tables in schema public to "${appRole}"`);
    await client.query(`grant usage, select on all sequences in schema public to "${appRole}"`);
  } finally {
    await client.end();
  }
}

const children: ChildProcess[] = [];
async function startAll(n: number, extra: Record<string, string> = {}): Promise<number[]> {
  const ports = Array.from({ length: n }, (_, i) => firstPort + i);
  children.push(...(await Promise.all(ports.map((p) => startServer({ ...appEnv, ...extra }, p)))));
  return ports;
}
async function stopAll(): Promise<void> {
  await Promise.all(
    children
      .splice(0)
      .map((c) => new Promise<void>((resolve) => (c.exitCode !== null ? resolve() : (c.once("exit", () => resolve()), c.kill("SIGTERM"))))),
  );
}

function check(ok: boolean, what: string): void {
  console.log(`${ok ? "ok  " : "FAIL"} ${what}`);
  if (!ok) process.exitCode = 1;
}

const origin = (port: number) => `http://127.0.0.1:${port}`;
const page = (port: number, path: string, cookie: string) =>
  fetch(origin(port) + path, { headers: { Cookie: cookie }, redirect: "manual" });

async function wrongPassword(port: number, email: string): Promise<number> {
  const res = await fetch(`${origin(port)}/login`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: origin(port) },
    body: new URLSearchParams({ email, password: "not-the-password" }),
  });
  await res.arrayBuffer();
  return res.status;
}

/**
 * Requests per second, `concurrency` at a time, spread round-robin over the ports: for `seconds`, or
 * `amount` requests in all (the estimate API allows a person 240 a minute: a count under that).
 */
async function throughput(
  ports: number[],
  send: (port: number) => Promise<Response>,
  amount = Infinity,
): Promise<{ rps: number; errors: number }> {
  let done = 0;
  let errors = 0;
  let next = 0;
  const until = amount === Infinity ? Date.now() + seconds * 1000 : Infinity;
  const started = Date.now();
  await Promise.all(
    Array.from({ length: concurrency }, async () => {
      while (Date.now() < until && next < amount) {
        const res = await send(ports[next++ % ports.length]!).catch(() => null);
        if (!res || res.status !== 200) errors++;
        await res?.arrayBuffer();
        done++;
      }
    }),
  );
  return { rps: done / ((Date.now() - started) / 1000), errors };
}

try {
  await admin(`drop database if exists "${dbName}" with (force)`);
  await admin(`create database "${dbName}"`);
  const run = (args: string[]) => execFileSync(process.execPath, ["--import", "tsx", ...args], { cwd: ROOT, env, stdio: "pipe" });
  run(["node_modules/knex/bin/cli.js", "--knexfile", "knexfile.ts", "migrate:latest"]);
  run(["scripts/db-seed.ts"]);
  await grantAppRole();
  console.log(`database ${dbName} migrated and seeded; app processes as ${appRole} (row security binds it); rate-limit store: ${store}`);

  const [a, b] = await startAll(2);
  // 1. one session, two processes
  const cookie = await signInCookie(a!, "owner@example.com");
  const onB = await page(b!, "/engines", cookie);
  const listed = await onB.text();
  check(
    onB.status === 200 && listed.includes("Fenwick-Oddy 2.0 four") && listed.includes("Mara Quillon"),
    `a session made on :${a} is valid on :${b} (GET /engines → ${onB.status})`,
  );

  // 2. the sign-in throttle counts on both: 5 wrong passwords alternating, the sixth refused wherever it lands
  const statuses: number[] = [];
  for (let i = 0; i < 6; i++) statuses.push(await wrongPassword(i % 2 ? b! : a!, "builder@example.com"));
  check(
    statuses.slice(0, 5).every((s) => s !== 429) && statuses[5] === 429,
    `sign-in throttle across processes: attempts ${statuses.join(", ")} (the sixth is 429)`,
  );

  // 3. an engine saved through A is listed by B
  const engines = await (await page(a!, "/engines", cookie)).text();
  const engineId = /\/engines\/(\d+)/.exec(engines)?.[1];
  const dup = await fetch(`${origin(a!)}/engines/${engineId}/duplicate`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: origin(a!), Cookie: cookie },
    body: "",
  });
  await dup.arrayBuffer();
  const after = await (await page(b!, "/engines", cookie)).text();
  check(dup.status === 302 && after.includes("(copy)"), `an engine saved on :${a} (duplicate → ${dup.status}) is listed on :${b}`);

  // 3b. B keeps the editor page of a plan not chosen; choosing it through A retires B's copy
  const planPaths = [
    ...(await (await page(a!, `/engines/${engineId}/plans`, cookie)).text()).matchAll(/href="(\/engines\/\d+\/plans\/\d+)"/g),
  ].map((m) => m[1]!);
  const planPath = planPaths[0];
  if (!planPath) throw new Error("no plan link on the plans page");
  let notChosen: string | undefined;
  for (const path of new Set(planPaths)) if ((await (await page(b!, path, cookie)).text()).includes("Mark as chosen")) notChosen ??= path;
  if (notChosen) {
    const kept = await (await page(b!, notChosen, cookie)).text();
    const choose = await fetch(origin(a!) + notChosen, {
      method: "POST",
      redirect: "manual",
      headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: origin(a!), Cookie: cookie },
      body: "intent=choose",
    });
    await choose.arrayBuffer();
    const fresh = await (await page(b!, notChosen, cookie)).text();
    check(
      kept.includes("Mark as chosen") && choose.status === 302 && !fresh.includes("Mark as chosen"),
      `a plan chosen on :${a} (→ ${choose.status}) shows as chosen on :${b}'s editor page, which :${b} had kept`,
    );
  } else check(false, "a plan that is not the chosen one, to choose");

  // 4. throughput with 1, 2 and 4 processes
  const input = await planInput(planPath);
  await stopAll();
  console.log(
    `throughput, ${concurrency} requests at a time: the plan page for ${seconds} s, the estimate API ${API_REQUESTS} requests (loopback; this machine's 2 cores are shared):`,
  );
  for (const n of [1, 2, 4]) {
    // fresh rate-limit counters for each run (the throttle across processes was checked above): the
    // estimate API's allowance per person and per address would otherwise be spent by the run before
    const ports = await startAll(n, { RATE_LIMIT_KEY_PREFIX: `sw-mp-${process.pid}-run${n}:` });
    const sessions = await Promise.all(ports.map(() => signInCookie(ports[0]!, "owner@example.com")));
    const plan = await throughput(ports, (p) => page(p, planPath, sessions[ports.indexOf(p)]!));
    const api = await throughput(
      ports,
      (p) =>
        fetch(`${origin(p)}/api/v1/estimate`, {
          method: "POST",
          headers: { "Content-Type": "application/json", Cookie: sessions[ports.indexOf(p)]!, Origin: origin(p) },
          body: JSON.stringify({ input }),
        }),
      API_REQUESTS,
    );
    console.log(
      `  ${n} process${n > 1 ? "es" : ""}: plan page ${plan.rps.toFixed(1)} req/s (${plan.errors} not 200), estimate API ${api.rps.toFixed(1)} req/s (${api.errors} not 200)`,
    );
    await stopAll();
  }
} finally {
  await stopAll();
  await admin(`drop database if exists "${dbName}" with (force)`);
  await admin(`drop role if exists "${appRole}"`);
}

/** The plan's input in SI, as the editor's estimate sends it: read from the database the servers share. */
async function planInput(planPath: string): Promise<unknown> {
  process.env.DATABASE_URL = env.DATABASE_URL;
  const { db, closeDb } = await import("../../app/utils/db.server.ts");
  const { getEngine } = await import("../../app/models/engine.server.ts");
  const { planParts, listPlans } = await import("../../app/models/plan.server.ts");
  const { assemblePlanInput } = await import("../../app/lib/plan/assemble.ts");
  const [, engineId, planId] = /\/engines\/(\d+)\/plans\/(\d+)/.exec(planPath)!;
  const row = await db()("engines")
    .where({ id: Number(engineId) })
    .first("team_id");
  const engine = (await getEngine({ teamId: row.team_id, userId: 0, role: "owner" }, Number(engineId)))!;
  const plan = (await listPlans(row.team_id, engine.id)).find((p) => p.id === Number(planId))!;
  const input = assemblePlanInput((await planParts(row.team_id, engine, plan))!);
  await closeDb();
  return input;
}
