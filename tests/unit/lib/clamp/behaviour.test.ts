// What the model must show a builder: protrusion moves load onto the seal line, heat helps an
// aluminium head, the squeeze point names its cause, the uncertainty run is deterministic.
import { describe, expect, it } from "vitest";
import { evaluatePlan, PlanInputSchema, prepare, suggest, torqueSweep, uncertainty } from "../../../../app/lib/clamp";
import { splitClamp, unloadSealLine } from "../../../../app/lib/clamp/seal";
import { v8Raw, workedExample } from "./fixtures";

const withProtrusion = (mm: number) => {
  const p = workedExample();
  return { ...p, sealing: { ...p.sealing, sleeveProtrusionMm: mm } };
};

describe("seal paths (ours, DESIGN.md)", () => {
  it("hand case: k_r 1e7, k_b 1e7, g 0.01 → touch at 100 kN; 150 kN clamp → 125 kN on the line", () => {
    const s = { lineNPerMm: 1e7, bodyNPerMm: 1e7, gapMm: 0.01, lineLimitN: 1e9 };
    expect(splitClamp(80_000, s).lineN).toBe(80_000); // F ≤ k_r·g → F_r = F
    const a = splitClamp(150_000, s); // F_r = 100 000 + 50 000·½
    expect(a.lineN).toBeCloseTo(125_000, 6);
    expect(a.marginalShare).toBeCloseTo(0.5, 12);
    // firing takes 40 kN: both touch, so half from each → 105 kN; 120 kN: the body (25 kN) is gone
    // after 50 kN of relief, then the line alone: 125 − 25 − 70 = 30 kN
    expect(unloadSealLine(a, 40_000, s)).toBeCloseTo(105_000, 6);
    expect(unloadSealLine(a, 120_000, s)).toBeCloseTo(30_000, 6);
    // only the line touching: the relief comes off it alone
    expect(unloadSealLine(splitClamp(80_000, s), 30_000, s)).toBeCloseTo(50_000, 6);
    // indentation limit: the line stops at 110 kN and the rest goes to the body
    const y = splitClamp(150_000, { ...s, lineLimitN: 110_000 });
    expect(y).toEqual({ lineN: 110_000, bodyN: 40_000, marginalShare: 0, lineYielded: true });
  });
  it("protrusion visibly moves clamp onto the seal line (worked example, cylinder 2)", () => {
    const lines = [0, 0.005, 0.01, 0.02].map((g) => evaluatePlan(withProtrusion(g)).cylinders[1].sealLineN);
    for (let i = 1; i < lines.length; i++) expect(lines[i]).toBeGreaterThan(lines[i - 1]);
    // at 0.02 mm the body no longer touches: k_r·g = 221 007 N > 155 765 N of clamp → all on the line
    expect(lines[3]).toBeCloseTo(evaluatePlan(withProtrusion(0.02)).cylinders[1].clampN, 6);
  });
});

describe("heat and settling", () => {
  it("an aluminium head on steel studs gains preload hot; an iron head on the same studs hardly does", () => {
    const al = evaluatePlan(workedExample()).hotSettled.thermalChangeN;
    const p = workedExample();
    const iron = evaluatePlan({ ...p, head: { ...p.head, modulusMpa: 100_000, expansionUmPerMC: 10.8 } }).hotSettled.thermalChangeN;
    expect(al).toBeGreaterThan(0);
    expect(iron).toBeLessThan(al / 5);
  });
  it("a copper relaxation allowance takes its percent of preload", () => {
    const p = workedExample();
    const e = evaluatePlan({ ...p, gasket: { ...p.gasket, relaxationPercent: 5 } });
    expect(e.hotSettled.relaxationLossN).toBeCloseTo(0.05 * e.tightening.preload.nominalN, 6);
  });
});

describe("squeeze point and sweep", () => {
  it("each cause can govern", () => {
    const base = workedExample();
    // bigger washer → the head bearing limit moves up past the stud limit (252 N·m in the docs)
    const stud = torqueSweep({ ...base, fastener: { ...base.fastener, washerOdMm: 30 } }, { fromNm: 0, toNm: 400, points: 5 });
    expect(stud.squeezePoint?.cause).toBe("stud-yield");
    // a soft, well-supported body that touches at once: the share (0.35 < 0.5) governs from the start
    const soft = PlanInputSchema.parse({ ...base, sealing: { sleeveProtrusionMm: 0 }, gasket: { ...base.gasket, bodyModulusMpa: 20_000 } });
    const s = torqueSweep({ ...soft, model: { ...soft.model, shareBasis: "assembled" } }, { fromNm: 0, toNm: 300, points: 5 });
    expect(s.squeezePoint?.cause).toBe("share");
    expect(s.squeezePoint?.torqueNm).toBe(0);
    expect(s.squeezePoint?.explanation).toMatch(/squeezes/);
    // the range stops short of every limit → null
    expect(torqueSweep(base, { fromNm: 0, toNm: 150, points: 3 }).squeezePoint).toBeNull();
  });
  it("gives the requested number of evenly spaced points", () => {
    const s = torqueSweep(workedExample(), { fromNm: 50, toNm: 250, points: 100 });
    expect(s.points).toHaveLength(100);
    expect(s.points[0].torqueNm).toBe(50);
    expect(s.points[99].torqueNm).toBeCloseTo(250, 9);
    expect(s.shareThreshold).toBe(0.5);
  });
});

describe("uncertainty", () => {
  it("is deterministic for a seed and varies with it", () => {
    const p = PlanInputSchema.parse(v8Raw());
    const a = uncertainty(p, { samples: 2000, seed: 7 });
    expect(uncertainty(p, { samples: 2000, seed: 7 })).toEqual(a);
    expect(uncertainty(p, { samples: 2000, seed: 8 }).weakestMargin.p50).not.toBe(a.weakestMargin.p50);
    expect(a.weakestMargin.p5).toBeLessThanOrEqual(a.weakestMargin.p50);
    expect(a.weakestMargin.p50).toBeLessThanOrEqual(a.weakestMargin.p95);
  });
  it("a plan well above margin 1 rarely falls below it; one far below nearly always does", () => {
    const good = uncertainty(workedExample(), { samples: 3000, seed: 1 });
    expect(good.probabilityMarginBelowOne).toBe(0); // nominal 2.12; ±3σ friction cannot halve the clamp
    const p = workedExample();
    const weak = uncertainty({ ...p, tightening: { ...p.tightening, target: { mode: "torque", torqueNm: 60 } } }, { samples: 3000, seed: 1 });
    expect(weak.probabilityMarginBelowOne).toBeGreaterThan(0.99);
    // the median sits near the nominal estimate (friction spread is symmetric)
    expect(Math.abs(good.weakestMargin.p50 - evaluatePlan(p).weakestMargin) / evaluatePlan(p).weakestMargin).toBeLessThan(0.05);
  });
});

describe("suggest", () => {
  it("names what must change when no torque can", () => {
    const p = workedExample();
    const r = suggest({ ...p, firing: { mode: "entered", peakPressureMpa: 40 } }, { targetMargin: 1.5 });
    expect(r.reachable).toBe(false);
    expect(r.torqueNm).toBeNull();
    expect(r.changes.join(" ")).toMatch(/more stud load|different gasket/);
    expect(r.summary).toMatch(/No torque reaches/);
  });
  it("reports a protrusion that would reach an otherwise unreachable target", () => {
    // soft body, no protrusion, assembled share basis: the share governs at 0 N·m, so only protrusion helps
    // (a dry sleeve, since only a sleeve can stand proud of the deck)
    const base = workedExample();
    const soft = { ...base, sleeve: { kind: "dry" as const, modulusMpa: 169_000, wallMm: 6 }, sealing: { ...base.sealing, sleeveProtrusionMm: 0 }, gasket: { ...base.gasket, bodyModulusMpa: 20_000 }, model: { ...base.model, shareBasis: "assembled" as const } };
    const r = suggest(soft, { targetMargin: 1.0 });
    expect(r.reachable).toBe(false);
    expect(r.protrusion).not.toBeNull();
    expect(r.protrusion?.protrusionMm).toBeGreaterThan(0);
    expect(r.changes.join(" ")).toMatch(/sleeve protrusion/);
  });
  it("never suggests sleeve protrusion for an engine without sleeves", () => {
    const base = workedExample();
    const soft = { ...base, sealing: { ...base.sealing, sleeveProtrusionMm: 0 }, gasket: { ...base.gasket, bodyModulusMpa: 20_000 }, model: { ...base.model, shareBasis: "assembled" as const } };
    const r = suggest(soft, { targetMargin: 1.0 });
    expect(base.sleeve.kind).toBe("none");
    expect(r.protrusion).toBeNull();
    expect(r.changes.join(" ")).not.toMatch(/protrusion/);
  });
  it("prepare() is pure: the same input gives the same prepared figures", () => {
    const a = prepare(workedExample());
    const b = prepare(workedExample());
    expect(a.C).toBe(b.C);
    expect(a.springs).toEqual(b.springs);
  });
});
