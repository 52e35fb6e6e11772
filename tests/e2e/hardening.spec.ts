import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { expect, test, type APIResponse } from "@playwright/test";

// Issue 9 against the built server over real sockets (scripts/serve.mjs): the header table on every
// kind of response, refusals in words, throttles keyed by the socket's address. No browser needed.

const ROOT = new URL("../..", import.meta.url).pathname;
const TABLE = [
  "content-security-policy",
  "x-content-type-options",
  "x-frame-options",
  "referrer-policy",
  "permissions-policy",
  "cache-control",
];

function expectTable(res: APIResponse, what: string) {
  const h = res.headers();
  for (const name of TABLE) expect(h[name], `${what}: ${name}`).toBeTruthy();
  expect(h["x-frame-options"], what).toBe("DENY");
  expect(h["x-content-type-options"], what).toBe("nosniff");
}

test("defect 11: the header table on pages, redirects, /healthz, API JSON, static files and refusals", async ({ request, baseURL }) => {
  const page = await request.get("/login");
  expectTable(page, "page");
  expect(page.headers()["content-security-policy"]).toMatch(/script-src 'self' 'nonce-/);
  const asset = (await page.text()).match(/\/assets\/[\w.-]+\.js/)?.[0];
  expect(asset).toBeTruthy();

  const cases: [string, APIResponse][] = [
    ["redirect", await request.get("/engines", { maxRedirects: 0 })],
    ["healthz", await request.get("/healthz")],
    ["api json", await request.post("/api/v1/estimate", { data: { input: {} }, headers: { Origin: baseURL! } })],
    ["asset", await request.get(asset!)],
    ["public file", await request.get("/favicon.svg")],
    [
      "cross-site refusal",
      await request.post("/login", { form: { email: "a@example.com", password: "x" }, headers: { Origin: "http://evil.example" } }),
    ],
    ["404", await request.get("/engines/0x1", { maxRedirects: 0 })],
  ];
  for (const [what, res] of cases) expectTable(res, what);
  expect(cases[0]![1].status()).toBe(302);
  expect(cases[2]![1].status()).toBe(401);
  expect(cases[2]![1].headers()["cache-control"]).toBe("no-store");
  expect(cases[3]![1].headers()["cache-control"]).toMatch(/immutable/);
  expect(cases[5]![1].status()).toBeGreaterThanOrEqual(400);
  expect(cases[5]![1].status()).toBeLessThan(500);
});

test("defects 6 and 12: wrong Content-Type is 415, an oversized or chunked-oversized form is 413", async ({ request, baseURL }) => {
  const origin = { Origin: baseURL! };
  expect((await request.post("/login", { data: "email=a", headers: { ...origin, "Content-Type": "text/plain" } })).status()).toBe(415);
  expect((await request.post("/login", { data: { email: "a" }, headers: origin })).status()).toBe(415);
  const big = await request.post("/login", {
    data: "password=" + "x".repeat(5 * 1024 * 1024),
    headers: { ...origin, "Content-Type": "application/x-www-form-urlencoded" },
  });
  expect(big.status()).toBe(413);
  expectTable(big, "413");
  const res = await fetch(`${baseURL}/login`, {
    method: "POST",
    headers: { ...origin, "Content-Type": "application/x-www-form-urlencoded" },
    body: new ReadableStream({
      start(c) {
        for (let i = 0; i < 20; i++) c.enqueue(new TextEncoder().encode("a".repeat(64 * 1024)));
        c.close();
      },
    }),
    duplex: "half",
  } as RequestInit);
  expect(res.status).toBe(413);
});

test("defect 2: the throttle keys on the socket's address and answers 429 with Retry-After", async ({ request, baseURL }) => {
  const guess = () =>
    request.post("/login", { form: { email: "nobody-e2e@example.com", password: "wrong-guess" }, headers: { Origin: baseURL! } });
  const statuses: number[] = [];
  for (let i = 0; i < 6; i++) statuses.push((await guess()).status());
  expect(statuses).toEqual([400, 400, 400, 400, 400, 429]);
  const locked = await guess();
  expect(locked.status()).toBe(429);
  expect(Number(locked.headers()["retry-after"])).toBeGreaterThan(0);
  expect(await locked.text()).toContain("Too many sign-in attempts");
});

test("the production server (scripts/serve.mjs) exits promptly on SIGTERM", async () => {
  const dir = path.join(ROOT, "tests/.e2e-data/serve-shutdown");
  fs.rmSync(dir, { recursive: true, force: true });
  const port = Number(process.env.E2E_PORT ?? 3210) + 9;
  const child = spawn(process.execPath, [path.join(ROOT, "scripts/serve.mjs"), "build/server/index.js"], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(port),
      HOST: "127.0.0.1",
      NODE_ENV: "production",
      DATABASE_PATH: path.join(dir, "x.sqlite"),
      SESSION_SECRET: "shutdown-secret-shutdown-secret-0123456",
    },
    stdio: "ignore",
  });
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  try {
    await expect
      .poll(async () => (await fetch(`http://127.0.0.1:${port}/healthz`).catch(() => null))?.status ?? 0, { timeout: 15_000 })
      .toBe(200);
    child.kill("SIGTERM");
    expect(await Promise.race([exited, new Promise<string>((r) => setTimeout(() => r("timeout"), 5_000))])).toBe(0);
  } finally {
    if (child.exitCode === null) child.kill("SIGKILL");
  }
});
