// Browser tests use Debian's Chromium, never a browser downloaded by a test tool.
// When it is missing and we are root, install it with apt; otherwise stop with a clear message.
import { execSync } from "node:child_process";
import { existsSync } from "node:fs";

const CHROMIUM = "/usr/bin/chromium";

if (!existsSync(CHROMIUM)) {
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (!isRoot) {
    console.error(
      `Browser tests need Debian's Chromium at ${CHROMIUM}. Install it with:\n  sudo apt-get install -y chromium\nthen run the tests again.`,
    );
    process.exit(1);
  }
  console.log(`${CHROMIUM} is missing; installing Debian's chromium package…`);
  execSync("apt-get update && apt-get install -y --no-install-recommends chromium", {
    stdio: "inherit",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  if (!existsSync(CHROMIUM)) {
    console.error(`apt-get finished but ${CHROMIUM} is still missing.`);
    process.exit(1);
  }
}
console.log(`Browser tests will drive ${CHROMIUM}.`);
