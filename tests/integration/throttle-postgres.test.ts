import crypto from "node:crypto";
import { afterAll, describe, it } from "vitest";
import { onPostgres } from "../setup/engine";
import { countsAcrossProcesses } from "./throttle-shared";

// RATE_LIMIT_STORE=postgres: the counts live in the rate_limits table of DATABASE_URL's database
// (migration 20261219000000_hosted). Runs on the PostgreSQL pass.
process.env.RATE_LIMIT_STORE = "postgres";
process.env.RATE_LIMIT_KEY_PREFIX = `sw-test-${crypto.randomBytes(3).toString("hex")}:`;

describe.runIf(onPostgres)("the PostgreSQL throttle store", () => {
  afterAll(async () => {
    const { closeRateLimitStores } = await import("~/utils/rate-limit.server");
    await closeRateLimitStores();
  });

  it("counts across processes: five tries over two limiters, the sixth is locked 30 s, clearing on one frees both", countsAcrossProcesses);
});
