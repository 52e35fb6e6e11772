import { expect } from "vitest";

// The check both network stores must pass (throttle-redis / throttle-postgres tests): two Throttle
// objects on one store stand in for two app processes behind a load balancer.
export async function countsAcrossProcesses(): Promise<void> {
  const { RULES, Throttle } = await import("~/utils/rate-limit.server");
  const first = new Throttle("shared-account", RULES.signInAccount);
  const second = new Throttle("shared-account", RULES.signInAccount);
  // five tries spread over both "processes"; the sixth, on either, is the one that locks for 30 s
  for (let i = 0; i < 5; i++) expect(await (i % 2 ? first : second).take("owner@example.com")).toBe(0);
  expect(await second.take("owner@example.com")).toBe(30_000);
  const wait = await first.take("owner@example.com");
  expect(wait).toBeGreaterThan(28_000);
  expect(wait).toBeLessThanOrEqual(30_000);
  // another account is untouched, and clearing on one ends the lock for both
  expect(await first.take("builder@example.com")).toBe(0);
  await second.clear("owner@example.com");
  expect(await first.take("owner@example.com")).toBe(0);
  // clear forgot the day's locks too (a right password): five more failures lock 30 s again, not 60 s
  for (let i = 0; i < 4; i++) expect(await second.take("owner@example.com")).toBe(0);
  expect(await first.take("owner@example.com")).toBe(30_000);
}
