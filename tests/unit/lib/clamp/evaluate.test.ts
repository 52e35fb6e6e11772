// The plan estimate (app/lib/clamp/evaluate.ts): one evaluation of every figure, consistent with itself.
import { describe, expect, it } from "vitest";
import { evaluatePlan, evaluatePrepared, targetTorqueAndPreload } from "../../../../app/lib/clamp/evaluate";
import { prepare } from "../../../../app/lib/clamp/model";
import type { PlanInput } from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { workedExample } from "./fixtures";

const atTorque = (p: PlanInput, torqueNm: number): PlanInput => ({
  ...p,
  tightening: { ...p.tightening, target: { mode: "torque", torqueNm } },
});

describe("targetTorqueAndPreload", () => {
  const plan = workedExample();
  const p = prepare(plan);
  it("a torque target gives its preload through the long form (180 N·m → 81 811.5 N, docs/clamp-model.md)", () => {
    const t = targetTorqueAndPreload(p);
    expect(t.torqueNm).toBe(180);
    expect(relErr(t.preloadN, 81_811.5)).toBeLessThan(1e-5);
  });
  it("a preload target gives the torque for it, and the two targets agree", () => {
    const byPreload = prepare({ ...plan, tightening: { ...plan.tightening, target: { mode: "preload", preloadN: 81_811.5 } } });
    expect(relErr(targetTorqueAndPreload(byPreload).torqueNm, 180)).toBeLessThan(1e-5);
    const a = evaluatePrepared(byPreload, undefined);
    const b = evaluatePlan(plan);
    expect(relErr(a.weakestMargin, b.weakestMargin)).toBeLessThan(1e-4);
  });
});

describe("evaluatePlan, the worked example", () => {
  const plan = workedExample();
  const e = evaluatePlan(plan);
  it("the weakest margin is the least cylinder margin, at the bottom of the band, and the named cylinder has it", () => {
    const least = Math.min(...e.cylinders.map((c) => c.sealMargin));
    expect(e.weakestMargin).toBeCloseTo(least, 12);
    expect(e.cylinders[e.weakestCylinder - 1]!.sealMargin).toBeCloseTo(least, 12);
    expect(e.weakestMargin).toBeLessThanOrEqual(e.weakestMarginNominal);
  });
  it("the preload band is the method's: αA 1.5 for torque with tested friction (VDI 2230 via docs/references.md §2)", () => {
    expect(e.tightening.preload.tighteningFactor).toBe(1.5);
    expect(e.tightening.preload.maxN / e.tightening.preload.minN).toBeCloseTo(1.5, 12);
  });
  it("one cylinder and stud entry each, and the verdict's headline names the short seal (docs/clamp-model.md)", () => {
    expect(e.cylinders).toHaveLength(4);
    expect(e.studs).toHaveLength(10);
    expect(e.verdict.status).toBe("short");
    expect(e.verdict.headline).toBe("Seal short under firing in cylinder 2");
  });
  it("sentences can be left out without changing a figure", () => {
    const bare = evaluatePlan(plan, undefined, { sentences: false });
    expect(bare.weakestMargin).toBe(e.weakestMargin);
    expect(bare.ceiling.torqueNm).toBe(e.ceiling.torqueNm);
  });
});

describe("behaviour", () => {
  const plan = workedExample();
  it("more torque: more preload in proportion, a higher nominal seal margin (the example's seal is short), a higher stud utilisation", () => {
    const lo = evaluatePlan(atTorque(plan, 120));
    const hi = evaluatePlan(atTorque(plan, 180));
    expect(hi.tightening.preload.nominalN / lo.tightening.preload.nominalN).toBeCloseTo(1.5, 9);
    expect(hi.weakestMarginNominal).toBeGreaterThan(lo.weakestMarginNominal);
    expect(hi.studStress.nominal.utilization).toBeGreaterThan(lo.studStress.nominal.utilization);
  });
  it("more peak pressure: a lower seal margin; and the estimate is continuous in the pressure (no step)", () => {
    const at = (peak: number) => evaluatePlan({ ...plan, firing: { mode: "entered", peakPressureMpa: peak } }).weakestMargin;
    expect(at(18)).toBeLessThan(at(12));
    const d1 = Math.abs(at(16.01) - at(16));
    const d2 = Math.abs(at(16.001) - at(16));
    expect(d1 / at(16)).toBeLessThan(5e-3);
    // ten times smaller a step, about ten times smaller a change: no jump between them
    expect(d2).toBeLessThan(d1 / 5);
  });
});
