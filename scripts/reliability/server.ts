// Shared by the reliability scripts: a fresh database, the built production server on 127.0.0.1,
// and a signed-in owner. Everything they send goes to 127.0.0.1 only, bounded in count and time.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

export const ROOT = path.resolve(new URL("../..", import.meta.url).pathname);

export function freshDatabase(name: string): { dir: string; file: string; env: Record<string, string> } {
  if (!fs.existsSync(path.join(ROOT, "build/server/index.js"))) throw new Error("run npm run build first");
  const dir = path.join(ROOT, "tests/.tmp", `${name}-${process.pid}`);
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, "db.sqlite");
  const env = {
    PATH: process.env.PATH ?? "",
    DATABASE_PATH: file,
    SESSION_SECRET: "reliability-secret-reliability-secret-01",
    NODE_ENV: "production",
  };
  const run = (args: string[]) => execFileSync(process.execPath, ["--import", "tsx", ...args], { cwd: ROOT, env, stdio: "pipe" });
  run(["node_modules/knex/bin/cli.js", "--knexfile", "knexfile.ts", "migrate:latest"]);
  run(["scripts/db-seed.ts"]);
  return { dir, file, env };
}

export async function startServer(env: Record<string, string>, port: number): Promise<ChildProcess> {
  const child = spawn(process.execPath, ["scripts/serve.mjs", "build/server/index.js"], {
    cwd: ROOT,
    env: { ...env, PORT: String(port), HOST: "127.0.0.1" },
    stdio: "ignore",
  });
  const until = Date.now() + 30_000;
  for (;;) {
    const ok = await fetch(`http://127.0.0.1:${port}/healthz`)
      .then((r) => r.ok)
      .catch(() => false);
    if (ok) return child;
    if (Date.now() > until || child.exitCode !== null) throw new Error("the server did not start");
    await new Promise((r) => setTimeout(r, 100));
  }
}

export async function signInCookie(port: number, email: string): Promise<string> {
  const res = await fetch(`http://127.0.0.1:${port}/login`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: `http://127.0.0.1:${port}` },
    body: new URLSearchParams({ email, password: "sealwright-demo" }),
  });
  const cookie = res.headers.get("set-cookie")?.split(";")[0];
  if (res.status !== 302 || !cookie) throw new Error(`sign-in failed: ${res.status}`);
  return cookie;
}

/** A shop rename: one transaction writing the team row and its audit row. True when acknowledged (302). */
export async function rename(port: number, cookie: string, name: string): Promise<number> {
  const res = await fetch(`http://127.0.0.1:${port}/team`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: `http://127.0.0.1:${port}`, Cookie: cookie },
    body: new URLSearchParams({ name }),
  });
  await res.arrayBuffer();
  return res.status;
}
