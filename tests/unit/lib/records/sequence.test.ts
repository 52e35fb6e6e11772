import { describe, expect, it } from "vitest";
import { defaultStudPattern } from "~/lib/clamp";
import { layoutStuds } from "~/lib/records/sequence";

describe("tightening sequence", () => {
  it("an inline four with five studs a side starts at the middle pair and works outward, alternating sides", () => {
    const l = layoutStuds(defaultStudPattern("inline", 4), 4, "inline");
    expect(l.banks).toBe(1);
    expect(l.studs).toHaveLength(10);
    const order = [...l.studs].sort((a, b) => a.order - b.order);
    // the middle studs (x = 2 bore pitches) first, one on each side
    expect(order.slice(0, 2).map((s) => [s.x, s.side])).toEqual([
      [2, 0],
      [2, 1],
    ]);
    // distance from the middle never decreases along the sequence
    for (let i = 1; i < order.length; i++) expect(Math.abs(order[i]!.x - 2)).toBeGreaterThanOrEqual(Math.abs(order[i - 1]!.x - 2) - 1e-9);
    // consecutive studs change side
    for (let i = 1; i < order.length; i++) expect(order[i]!.side).not.toBe(order[i - 1]!.side);
    // the end studs are last
    expect(order.slice(-4).every((s) => s.x === 0 || s.x === 4)).toBe(true);
    expect(new Set(l.studs.map((s) => s.order)).size).toBe(10);
  });

  it("a V8 gets one sequence per bank, each numbered from 1", () => {
    const l = layoutStuds(defaultStudPattern("V", 8, 5), 8, "V");
    expect(l.banks).toBe(2);
    for (const bank of [0, 1]) {
      const own = l.studs
        .filter((s) => s.bank === bank)
        .map((s) => s.order)
        .sort((a, b) => a - b);
      expect(own).toEqual(Array.from({ length: 10 }, (_, i) => i + 1));
    }
  });

  it("studs without side labels are split into the two sides by their order in the list", () => {
    const studs = defaultStudPattern("inline", 2).map((s, i) => ({ ...s, label: `S${i + 1}` }));
    const l = layoutStuds(studs, 2, "inline");
    expect(l.studs.filter((s) => s.side === 0).map((s) => s.label)).toEqual(["S1", "S2", "S3"]);
    expect(l.studs.filter((s) => s.side === 1).map((s) => s.label)).toEqual(["S4", "S5", "S6"]);
  });
});
