import { describe, expect, it } from "vitest";
import { LruCache } from "../../../app/lib/lru-cache";

describe("LruCache", () => {
  it("keeps the newest entries up to its capacity and moves a hit to the newest end", () => {
    const c = new LruCache<number>(2);
    c.set("a", 1);
    c.set("b", 2);
    expect(c.get("a")).toBe(1);
    c.set("c", 3);
    expect(c.get("b")).toBeUndefined();
    expect(c.get("a")).toBe(1);
    expect(c.size).toBe(2);
  });
});
