// What the editor and the API show for a plan (app/lib/plan/estimate-view.ts).
import { describe, expect, it } from "vitest";
import { evaluatePlan } from "../../../../app/lib/clamp";
import { estimateView, SWEEP_POINTS, sweepRange, UNCERTAINTY_SAMPLES } from "../../../../app/lib/plan/estimate-view";
import { workedExample } from "../clamp/fixtures";

describe("sweepRange", () => {
  it("40 % to 160 % of the plan's torque when the ceiling is near", () => {
    expect(sweepRange(100, 120)).toEqual({ fromNm: 40, toNm: 160 });
    expect(sweepRange(100)).toEqual({ fromNm: 40, toNm: 160 });
  });
  it("stretched to show a farther ceiling (115 % of it, at most 3 × the torque), never past 5000 N·m", () => {
    expect(sweepRange(100, 200).toNm).toBeCloseTo(230, 9);
    expect(sweepRange(100, 1000).toNm).toBe(300);
    expect(sweepRange(4000, 4500).toNm).toBe(5000);
  });
});

describe("estimateView", () => {
  const plan = workedExample();
  const v = estimateView(plan);
  it("the estimate is evaluatePlan's, the sweep has 41 points over the range, the scatter run 2000 samples", () => {
    const e = evaluatePlan(plan);
    expect(v.estimate.weakestMargin).toBe(e.weakestMargin);
    expect(v.torqueNm).toBe(180);
    expect(SWEEP_POINTS).toBe(41);
    expect(UNCERTAINTY_SAMPLES).toBe(2000);
    expect(v.sweep).toHaveLength(41);
    const r = sweepRange(180, e.ceiling.torqueNm);
    expect(v.sweep[0]!.torqueNm).toBeCloseTo(r.fromNm, 9);
    expect(v.sweep[40]!.torqueNm).toBeCloseTo(r.toNm, 9);
    expect(v.ceiling).toEqual(v.estimate.ceiling);
    expect(v.targetMargin).toBe(plan.targetMargin);
  });
  it("the same plan shows the same chances (a fixed seed)", () => {
    const again = estimateView(workedExample());
    expect(again.probabilityMarginBelowOne).toBe(v.probabilityMarginBelowOne);
    expect(again.weakestMarginBand).toEqual(v.weakestMarginBand);
  });
  it("the scatter band brackets the sampled preload the way the tightening band does", () => {
    expect(v.preloadSpread.p2_5).toBeLessThan(1);
    expect(v.preloadSpread.p97_5).toBeGreaterThan(1);
    expect(v.weakestMarginBand.p5).toBeLessThanOrEqual(v.weakestMarginBand.p95);
  });
});
