import fs from "node:fs";
import { describe, expect, it } from "vitest";

// RATE_LIMIT_STORE=sqlite: the throttles count in a file beside the database, so every process on
// the machine shares them. Two Throttle objects on one file stand in for two server processes.
process.env.RATE_LIMIT_STORE = "sqlite";
process.env.RATE_LIMIT_SQLITE_PATH = `${process.env.DATABASE_PATH}.rate-limit.sqlite`;

describe("the SQLite throttle store", () => {
  it("counts across processes: five tries in one, the sixth in the other is locked 30 s", async () => {
    const { RULES, Throttle } = await import("~/utils/rate-limit.server");
    const first = new Throttle("shared-account", RULES.signInAccount);
    const second = new Throttle("shared-account", RULES.signInAccount);
    await new Promise((r) => setTimeout(r, 50)); // the store creates its table on first use
    for (let i = 0; i < 5; i++) expect(await (i % 2 ? first : second).take("owner@example.com")).toBe(0);
    expect(await second.take("owner@example.com")).toBe(30_000);
    const wait = await first.take("owner@example.com");
    expect(wait).toBeGreaterThan(28_000);
    expect(wait).toBeLessThanOrEqual(30_000);
    // another account is untouched, and clearing ends the lock for both
    expect(await first.take("builder@example.com")).toBe(0);
    await second.clear("owner@example.com");
    expect(await first.take("owner@example.com")).toBe(0);
    expect(fs.existsSync(process.env.RATE_LIMIT_SQLITE_PATH!)).toBe(true);
  });
});
