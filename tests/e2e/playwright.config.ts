import { defineConfig } from "@playwright/test";
import { MAIL_DIR } from "./mail";

const PORT = Number(process.env.E2E_PORT ?? 3210);
const ROOT = new URL("../..", import.meta.url).pathname;
// The local SMTP sink beside the app (scripts/mail-sink.ts): its own port per app port, so parallel
// runs on one machine do not catch each other's mail; tests read what it stored in MAIL_DIR.
const SMTP_PORT = PORT + 1000;

// Drives the real built app (npm run build first) in Debian's Chromium against a fresh demo database.
export default defineConfig({
  testDir: ".",
  outputDir: "../../test-results/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  timeout: 30_000,
  use: {
    baseURL: `http://localhost:${PORT}`,
    browserName: "chromium",
    trace: "retain-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    },
  },
  webServer: [
    {
      command: `rm -rf ${MAIL_DIR} && node --import tsx scripts/mail-sink.ts`,
      cwd: ROOT,
      port: SMTP_PORT,
      reuseExistingServer: false,
      timeout: 60_000,
      env: { SMTP_PORT: String(SMTP_PORT), MAIL_SINK_DIR: MAIL_DIR },
    },
    {
      command: "rm -rf tests/.e2e-data && npm run db:setup --silent && node scripts/serve.mjs build/server/index.js",
      cwd: ROOT,
      url: `http://localhost:${PORT}/healthz`,
      reuseExistingServer: false,
      timeout: 120_000,
      env: {
        PORT: String(PORT),
        HOST: "127.0.0.1",
        NODE_ENV: "production",
        DATABASE_PATH: "tests/.e2e-data/e2e.sqlite",
        SESSION_SECRET: "e2e-secret-e2e-secret-e2e-secret-0123456",
        APP_URL: `http://localhost:${PORT}`,
        SMTP_HOST: "127.0.0.1",
        SMTP_PORT: String(SMTP_PORT),
        MAIL_SINK_DIR: MAIL_DIR,
      },
    },
  ],
});
