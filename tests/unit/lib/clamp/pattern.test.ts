// The default stud pattern (app/lib/clamp/pattern.ts; DESIGN.md "Studs to bores").
import { describe, expect, it } from "vitest";
import { defaultStudPattern } from "../../../../app/lib/clamp/pattern";

describe("defaultStudPattern", () => {
  it("an inline four: five studs a side, the end studs serve one bore, the ones between serve two at ½", () => {
    const s = defaultStudPattern("inline", 4);
    expect(s).toHaveLength(10);
    expect(s.map((x) => x.label)).toEqual(["A1", "A2", "A3", "A4", "A5", "B1", "B2", "B3", "B4", "B5"]);
    expect(s[0]!.serves).toEqual([{ cylinder: 1, share: 1 }]);
    expect(s[1]!.serves).toEqual([
      { cylinder: 1, share: 0.5 },
      { cylinder: 2, share: 0.5 },
    ]);
    expect(s[4]!.serves).toEqual([{ cylinder: 4, share: 1 }]);
  });
  it("every stud's shares add up to 1; an end bore holds 3 studs' worth, a middle bore 2", () => {
    for (const [layout, n] of [
      ["inline", 4],
      ["inline", 6],
      ["V", 8],
    ] as const) {
      const s = defaultStudPattern(layout, n);
      for (const st of s) expect(st.serves.reduce((a, b) => a + b.share, 0)).toBeCloseTo(1, 12);
      const perBore = new Array<number>(n).fill(0);
      for (const st of s) for (const v of st.serves) perBore[v.cylinder - 1]! += v.share;
      // an end bore: end stud (1) + half of the next on each of two sides = 3; a middle bore: 2 halves × 2 sides = 2
      expect(perBore[0]).toBeCloseTo(3, 12);
      if (n / (layout === "V" ? 2 : 1) > 2) expect(perBore[1]).toBeCloseTo(2, 12);
      expect(perBore.reduce((a, b) => a + b, 0)).toBeCloseTo(s.length, 12);
    }
  });
  it("a V8 numbers the banks L and R, bank B's bores 5…8", () => {
    const s = defaultStudPattern("V", 8);
    expect(s).toHaveLength(20);
    expect(s[0]!.label).toBe("LA1");
    expect(s[10]!.label).toBe("RA1");
    expect(s[10]!.serves).toEqual([{ cylinder: 5, share: 1 }]);
    expect(s[19]!.serves).toEqual([{ cylinder: 8, share: 1 }]);
  });
  it("fewer studs than bores + 1: a stud between two bore lines serves the bore it falls beside", () => {
    // 4 bores, 3 studs a side at x = 0, 2, 4: ends serve one bore, the middle one sits on the line between 2 and 3
    const s = defaultStudPattern("inline", 4, 3);
    expect(s[1]!.serves).toEqual([
      { cylinder: 2, share: 0.5 },
      { cylinder: 3, share: 0.5 },
    ]);
    // 4 studs: x = 0, 4/3, 8/3, 4 → the inner two fall inside bores 2 and 3
    const f = defaultStudPattern("inline", 4, 4);
    expect(f[1]!.serves).toEqual([{ cylinder: 2, share: 1 }]);
    expect(f[2]!.serves).toEqual([{ cylinder: 3, share: 1 }]);
  });
  it("refuses an odd V, a fractional count and fewer than two studs a side", () => {
    expect(() => defaultStudPattern("V", 6)).not.toThrow();
    expect(() => defaultStudPattern("V", 5)).toThrow("A V engine needs an even number of cylinders");
    expect(() => defaultStudPattern("inline", 0)).toThrow("Cylinder count must be a whole number ≥ 1");
    expect(() => defaultStudPattern("inline", 2.5)).toThrow(RangeError);
    expect(() => defaultStudPattern("inline", 4, 1)).toThrow("At least two studs per side");
  });
});
