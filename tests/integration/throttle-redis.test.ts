import crypto from "node:crypto";
import { Redis } from "ioredis";
import { afterAll, describe, it } from "vitest";
import { answers } from "../setup/reachable";
import { countsAcrossProcesses } from "./throttle-shared";

// RATE_LIMIT_STORE=redis: the counts live in Redis, so the limits hold across every app process.
// Needs a Redis at REDIS_URL (127.0.0.1:6379 here); without one this file says so and skips.
const prefix = `sw-hosted-test:${process.pid}-${crypto.randomBytes(3).toString("hex")}:`;
process.env.RATE_LIMIT_STORE = "redis";
process.env.RATE_LIMIT_KEY_PREFIX = prefix;
const url = process.env.REDIS_URL ?? "redis://127.0.0.1:6379";
const redisUp = await answers(new URL(url).hostname, Number(new URL(url).port || 6379));
if (!redisUp) console.info(`No Redis answers at ${url}: the Redis throttle store test is skipped.`);

describe.runIf(redisUp)("the Redis throttle store", () => {
  afterAll(async () => {
    const { closeRateLimitStores } = await import("~/utils/rate-limit.server");
    await closeRateLimitStores();
    const redis = new Redis(url);
    const keys = await redis.keys(`${prefix}*`);
    if (keys.length) await redis.del(...keys);
    await redis.quit();
  });

  it("counts across processes: five tries over two limiters, the sixth is locked 30 s, clearing on one frees both", countsAcrossProcesses);
});
