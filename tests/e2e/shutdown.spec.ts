import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { expect, test } from "@playwright/test";

const ROOT = new URL("../..", import.meta.url).pathname;

// The production server (`npm start` runs scripts/serve.mjs) closes its database pool and exits when it is
// told to stop (SIGTERM).
test("the server exits promptly on SIGTERM after serving a request", async () => {
  const dir = path.join(ROOT, "tests/.e2e-data/shutdown");
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
    const code = await Promise.race([exited, new Promise<string>((r) => setTimeout(() => r("timeout"), 5_000))]);
    expect(code).toBe(0);
  } finally {
    if (child.exitCode === null) child.kill("SIGKILL");
  }
});
