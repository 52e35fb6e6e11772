// The estimate over a torque range (app/lib/clamp/sweep.ts): it agrees with the single-point estimate
// at each torque and moves the way the model says it must.
import { describe, expect, it } from "vitest";
import { evaluatePlan, type PlanInput } from "../../../../app/lib/clamp";
import { torqueSweep } from "../../../../app/lib/clamp/sweep";
import { workedExample } from "./fixtures";

const atTorque = (p: PlanInput, torqueNm: number): PlanInput => ({
  ...p,
  tightening: { ...p.tightening, target: { mode: "torque", torqueNm } },
});

describe("torqueSweep", () => {
  const plan = workedExample();
  const s = torqueSweep(plan, { fromNm: 60, toNm: 240, points: 7 });

  it("spaces its points evenly from the start to the end, both ends included", () => {
    expect(s.points.map((x) => x.torqueNm)).toEqual([60, 90, 120, 150, 180, 210, 240]);
  });
  it("at 180 N·m it matches evaluatePlan at 180 N·m (same weakest margin, cylinder and preload band), to 1e-9", () => {
    const e = evaluatePlan(atTorque(plan, 180));
    const pt = s.points[4]!;
    expect(pt.weakestMargin).toBeCloseTo(e.weakestMargin, 9);
    expect(pt.preloadN).toBeCloseTo(e.tightening.preload.nominalN, 6);
    expect(pt.preloadMinN).toBeCloseTo(e.tightening.preload.minN, 6);
    expect(pt.preloadMaxN).toBeCloseTo(e.tightening.preload.maxN, 6);
    expect(pt.gainShare).toBeCloseTo(e.gain.share, 9);
  });
  it("preload rises in proportion to torque; stud utilisation rises with it", () => {
    const [a, b] = [s.points[0]!, s.points[6]!];
    expect(b.preloadN / a.preloadN).toBeCloseTo(4, 9);
    for (let i = 1; i < s.points.length; i++) {
      expect(s.points[i]!.studUtilizationMax).toBeGreaterThan(s.points[i - 1]!.studUtilizationMax);
      expect(s.points[i]!.bearingUtilizationMax).toBeGreaterThan(s.points[i - 1]!.bearingUtilizationMax);
    }
  });
  it("the bottom of the band is never better than the nominal", () => {
    for (const p of s.points) expect(p.weakestMargin).toBeLessThanOrEqual(p.weakestMarginNominal + 1e-12);
  });
  it("the ceiling is the same as evaluatePlan's", () => {
    expect(s.ceiling.torqueNm).toBeCloseTo(evaluatePlan(plan).ceiling.torqueNm, 6);
  });
  it("takes at least two points, never a negative torque, and an end below the start as the start", () => {
    expect(torqueSweep(plan, { fromNm: 100, toNm: 200, points: 1 }).points.map((x) => x.torqueNm)).toEqual([100, 200]);
    expect(torqueSweep(plan, { fromNm: -50, toNm: 100, points: 2 }).points[0]!.torqueNm).toBe(0);
    expect(torqueSweep(plan, { fromNm: 150, toNm: 100, points: 3 }).points.map((x) => x.torqueNm)).toEqual([150, 150, 150]);
  });
});
