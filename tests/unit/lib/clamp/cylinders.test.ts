// Per-bore clamp and seal (app/lib/clamp/cylinders.ts): studs to bores, then each bore's seal.
import { describe, expect, it } from "vitest";
import { boreClamps, boreCrush, boreSeal, boreSealMargin, weakestMargin } from "../../../../app/lib/clamp/cylinders";
import { prepare } from "../../../../app/lib/clamp/model";
import { workedExample } from "./fixtures";

const p = prepare(workedExample());

describe("boreClamps", () => {
  it("F_bore = Σ share·F_stud: equal stud loads give each bore its stud weight × F (3, 2, 2, 3 on the I4)", () => {
    const out = boreClamps(p, new Float64Array(p.studCount).fill(50_000), new Float64Array(p.cylinders));
    expect([...out]).toEqual([150_000, 100_000, 100_000, 150_000]);
  });
  it("one stud's load goes to the bores it serves by share, and the total is kept", () => {
    const loads = new Float64Array(p.studCount);
    loads[1] = 10_000; // A2: between bores 1 and 2
    const out = boreClamps(p, loads, new Float64Array(p.cylinders).fill(7));
    expect([...out]).toEqual([5_000, 5_000, 0, 0]);
  });
});

describe("boreSeal", () => {
  it("the seal margin is the lesser of seating and operating, and the lean form gives the same", () => {
    const s = boreSeal(p, 160_000, 150_000);
    expect(s.sealMargin).toBe(Math.min(s.seatingMargin, s.operatingMargin));
    expect(s.seatingMargin).toBeCloseTo(s.cold.lineN / p.requirement.seatingLoadN, 12);
    expect(s.operatingMargin).toBeCloseTo(s.fired.lineN / p.requirement.operatingContactN, 12);
    expect(boreSealMargin(p, 160_000, 150_000)).toBeCloseTo(s.sealMargin, 9);
    expect(boreCrush(p, 160_000, 150_000)).toBeCloseTo(s.crushUtilization, 9);
  });
  it("firing lifts the head (lift ≥ 0) and leaves less on the line than hot", () => {
    const s = boreSeal(p, 160_000, 150_000);
    expect(s.liftMm).toBeGreaterThanOrEqual(0);
    expect(s.fired.lineN).toBeLessThanOrEqual(s.hot.lineN);
    expect(s.remainingHotN).toBe(s.fired.lineN);
    expect(s.beadReserveMm).toBeNull(); // a fire ring, no bead
  });
  it("more clamp never lowers the seal margin (trend), and is continuous: 1 N more moves it by under 1e-4", () => {
    let last = -Infinity;
    for (let c = 40_000; c <= 240_000; c += 20_000) {
      const m = boreSealMargin(p, c, c * 0.95);
      expect(m).toBeGreaterThanOrEqual(last - 1e-12);
      last = m;
      expect(Math.abs(boreSealMargin(p, c + 1, (c + 1) * 0.95) - m)).toBeLessThan(1e-4);
    }
  });
});

describe("weakestMargin", () => {
  it("picks the bore with the least seal margin: with equal studs, a middle bore (weight 2)", () => {
    const cold = boreClamps(p, new Float64Array(p.studCount).fill(60_000), new Float64Array(p.cylinders));
    const hot = boreClamps(p, new Float64Array(p.studCount).fill(57_000), new Float64Array(p.cylinders));
    const w = weakestMargin(p, cold, hot);
    expect(w.bore).toBe(1);
    for (let b = 0; b < p.cylinders; b++) expect(boreSealMargin(p, cold[b]!, hot[b]!)).toBeGreaterThanOrEqual(w.margin);
  });
});
