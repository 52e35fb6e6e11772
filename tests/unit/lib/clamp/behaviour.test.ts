// What the model must show a builder: heat helps an aluminium head, friction acts at the nut face, the
// cones stop at the stud spacing, the scatter run reproduces the tightening band, suggest keeps to the
// ceiling and to what the engine has.
import { describe, expect, it } from "vitest";
import {
  evaluatePlan,
  frictionFaceOdMm,
  memberStiffness,
  PlanInputSchema,
  preloadBand,
  prepare,
  suggest,
  torqueCeiling,
  torqueSweep,
  uncertainty,
  type PlanInput,
} from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { demoFourRaw, v8Raw, workedExample } from "./fixtures";

const atTorque = (p: PlanInput, torqueNm: number): PlanInput => ({
  ...p,
  tightening: { ...p.tightening, target: { mode: "torque", torqueNm } },
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
    // VDI 2230: F hot = F·(1 − relax) − FZ + ΔFth
    const h = e.hotSettled;
    expect(h.preloadN).toBeCloseTo(e.tightening.preload.nominalN * 0.95 - h.embeddingLossN + h.thermalChangeN, 6);
  });
});

describe("bearing friction at the nut face (ISO 16047 DKm from the face that turns)", () => {
  it("nut face when the washer stays put, washer OD when it turns, 1.45·d without a nut-face figure (ISO 4032 dw,min ≈ 1.4–1.5·d, from memory)", () => {
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, washerTurns: false })).toBeCloseTo(20.3, 12);
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, nutFaceOdMm: 21, washerTurns: false })).toBe(21);
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, nutFaceOdMm: 21, washerTurns: true })).toBe(24);
    // never wider than the washer
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 18, washerTurns: false })).toBe(18);
  });
  it("the worked example's friction diameter is DKm = (20.3 + 15)/2 = 17.65 mm, and a turning washer needs more torque", () => {
    const p = workedExample();
    const e = evaluatePlan(p);
    expect(e.tightening.frictionDiameterMm).toBeCloseTo(17.65, 12);
    const turns = evaluatePlan({ ...p, fastener: { ...p.fastener, washerTurns: true } });
    expect(turns.tightening.frictionDiameterMm).toBeCloseTo((24 + 15) / 2, 12);
    // same torque, larger friction radius → less preload: 0.12·(19.5 − 17.65)/2 = 0.111 mm more per newton
    expect(turns.tightening.torquePerPreloadMm - e.tightening.torquePerPreloadMm).toBeCloseTo((0.12 * (19.5 - 17.65)) / 2, 9);
    expect(turns.tightening.preload.nominalN).toBeLessThan(e.tightening.preload.nominalN);
  });
});

describe("member cones limited to the stud spacing (VDI 2230 limiting outside diameter DA)", () => {
  const layers = [
    { name: "head", thicknessMm: 90, modulusMpa: 72_400 },
    { name: "block", thicknessMm: 30, modulusMpa: 100_000 },
  ];
  it("a limit wider than the cones reach changes nothing; a tighter one makes the stack softer", () => {
    // cones from 24 mm at the top and 21 mm at the bottom grow 1.155 per mm of depth: at mid-grip (60 mm) 93 mm wide
    const free = memberStiffness(layers, 14, 24, 21);
    expect(memberStiffness(layers, 14, 24, 21, 200).complianceMmPerN).toBeCloseTo(free.complianceMmPerN, 15);
    const limited = memberStiffness(layers, 14, 24, 21, 60);
    expect(limited.complianceMmPerN).toBeGreaterThan(free.complianceMmPerN);
    // continuous in the limit: a 0.1 % narrower DA moves the compliance by well under 1 %
    const a = memberStiffness(layers, 14, 24, 21, 60).complianceMmPerN;
    const b = memberStiffness(layers, 14, 24, 21, 59.94).complianceMmPerN;
    expect(relErr(b, a)).toBeLessThan(0.002);
  });
  it("with DA at the washer face the whole stack is a sleeve: δ = Σ l/(E·π/4·(DA² − dh²)) (VDI 2230)", () => {
    const m = memberStiffness(layers, 14, 24, 24, 24);
    // DA is held a hair above the cone start (×1.0001): a 0.002 mm cone stub, then the sleeve (1e-6 covers the stub)
    const DA = 24 * 1.0001;
    const ring = (Math.PI / 4) * (DA * DA - 14 * 14);
    expect(relErr(m.complianceMmPerN, 90 / (72_400 * ring) + 30 / (100_000 * ring))).toBeLessThan(1e-6);
  });
  it("a plan's cones stop at its stud spacing, given or from the pattern", () => {
    const p = workedExample();
    const given = prepare({ ...p, engine: { ...p.engine, studSpacingMm: 55 } });
    expect(given.coneLimitMm).toBe(55);
    expect(given.studSpacingAssumed).toBe(false);
    const assumed = prepare(p);
    // common practice: bores 1.15 bores apart; 5 studs a side over 4 × 1.15 × 96 mm → 110.4 mm apart
    expect(assumed.coneLimitMm).toBeCloseTo((4 * 1.15 * 96) / 4, 9);
    expect(assumed.studSpacingAssumed).toBe(true);
    expect(given.member.complianceMmPerN).toBeGreaterThan(assumed.member.complianceMmPerN);
  });
});

describe("Shigley's joint constant is kept for display beside Φn", () => {
  it("C = kS/(kS + kM) and Φn < C when the head is on the stud's side", () => {
    const e = evaluatePlan(workedExample());
    const s = e.stiffness;
    expect(s.jointConstant).toBeCloseTo(s.studNPerMm / (s.studNPerMm + s.memberNPerMm), 12);
    expect(s.loadFactor).toBeGreaterThan(0);
    expect(s.loadFactor).toBeLessThan(s.jointConstant);
    // each stud takes Φn of the firing load it sees at once (one bore fires at a time: its biggest
    // bore's share); its clamp on the gasket falls by (1 − Φn) of it
    for (const st of e.studs) {
      expect(st.peakFiringN).toBeLessThanOrEqual(st.externalN * (1 + 1e-12));
      expect(st.firedLoadN - st.preloadN).toBeCloseTo(s.loadFactor * st.peakFiringN, 6);
      expect(st.preloadN - st.memberFiredN).toBeCloseTo((1 - s.loadFactor) * st.peakFiringN, 6);
    }
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
  it("reproduces the tightening band shown beside it: torque with tested friction, αA 1.5 → 0.80 … 1.20 (VDI 2230 via a supplier's table)", () => {
    const u = uncertainty(workedExample(), { samples: 20_000, seed: 11 });
    const band = preloadBand(1, 1.5);
    // the band is ±2σ of the sampled preload, so its ends are the 2.3 % and 97.7 % points; the spread reported
    // is 2.5–97.5 % (±1.96σ): inside the band by 0.04σ = 0.4 % of nominal, plus sampling noise (~0.3 % at 20 000)
    expect(Math.abs(u.preloadSpread.p2_5 - band.minN)).toBeLessThan(0.012);
    expect(Math.abs(u.preloadSpread.p97_5 - band.maxN)).toBeLessThan(0.012);
  });
  it("a stretch-measured plan is sampled by its stretch scatter (αA 1.4 → 0.833 … 1.167), whatever the friction spread", () => {
    const p = PlanInputSchema.parse(demoFourRaw());
    const band = preloadBand(1, 1.4);
    const a = uncertainty(p, { samples: 20_000, seed: 5, frictionCv: 0 });
    const b = uncertainty(p, { samples: 20_000, seed: 5, frictionCv: 0.3 });
    expect(Math.abs(a.preloadSpread.p2_5 - band.minN)).toBeLessThan(0.012);
    expect(Math.abs(a.preloadSpread.p97_5 - band.maxN)).toBeLessThan(0.012);
    expect(b.preloadSpread).toEqual(a.preloadSpread);
    // friction still varies the stud's torsion: more friction spread, more studs over their tightening limit
    expect(b.probabilityStudOverLimit).toBeGreaterThan(a.probabilityStudOverLimit);
  });
  it("a plan well above margin 1 rarely falls below it; one far below nearly always does", () => {
    const p = workedExample();
    const good = uncertainty({ ...p, firing: { mode: "entered", peakPressureMpa: 4 } }, { samples: 3000, seed: 1 });
    expect(good.probabilityMarginBelowOne).toBeLessThan(0.01);
    const weak = uncertainty(atTorque(p, 60), { samples: 3000, seed: 1 });
    expect(weak.probabilityMarginBelowOne).toBeGreaterThan(0.99);
  });
});

describe("torque sweep", () => {
  it("gives the requested number of evenly spaced points, each on the estimate's basis", () => {
    const p = workedExample();
    const s = torqueSweep(p, { fromNm: 50, toNm: 250, points: 100 });
    expect(s.points).toHaveLength(100);
    expect(s.points[0].torqueNm).toBe(50);
    expect(s.points[99].torqueNm).toBeCloseTo(250, 9);
    // the point at the plan's own 180 N·m reads as the estimate does
    const at = torqueSweep(p, { fromNm: 180, toNm: 180, points: 2 }).points[0];
    const e = evaluatePlan(p);
    expect(at.weakestMargin).toBeCloseTo(e.weakestMargin, 12);
    expect(at.weakestMarginNominal).toBeCloseTo(e.weakestMarginNominal, 12);
    expect(at.gainShare).toBeCloseTo(e.gain.share, 12);
    expect(at.studWorkingUtilization).toBeCloseTo(e.studStress.working.utilization, 12);
  });
});

describe("suggest", () => {
  it("names what must change when no torque can", () => {
    const p = workedExample();
    const r = suggest({ ...p, firing: { mode: "entered", peakPressureMpa: 40 } }, { targetMargin: 1.5 });
    expect(r.reachable).toBe(false);
    expect(r.torqueNm).toBeNull();
    expect(r.changes.join(" ")).toMatch(/ceiling is set by the washer bearing on the head/);
    expect(r.summary).toMatch(/No torque reaches/);
  });
  it("a reachable target: the smallest torque that reaches it at the bottom of the band, under the ceiling", () => {
    const p = workedExample();
    const q: PlanInput = { ...p, firing: { mode: "entered", peakPressureMpa: 6 }, head: { ...p.head, limitingSurfacePressureMpa: 900 } };
    const r = suggest(q, { targetMargin: 1.5 });
    expect(r.reachable).toBe(true);
    const T = r.torqueNm as number;
    expect(T).toBeLessThanOrEqual(torqueCeiling(prepare(q)).torqueNm);
    expect(evaluatePlan(atTorque(q, T)).weakestMargin).toBeGreaterThanOrEqual(1.5 * (1 - 1e-9));
    // the smallest: 1 % less torque falls short
    expect(evaluatePlan(atTorque(q, 0.99 * T)).weakestMargin).toBeLessThan(1.5);
  });
  it("offers sleeve protrusion that reaches an otherwise unreachable target, and it does reach it", () => {
    const p = workedExample();
    const dry: PlanInput = {
      ...p,
      firing: { mode: "entered", peakPressureMpa: 4 },
      sleeve: { kind: "dry", modulusMpa: 169_000, wallMm: 6 },
      sealing: { ...p.sealing, sleeveProtrusionMm: 0 },
    };
    const r = suggest(dry, { targetMargin: 1.2 });
    expect(r.reachable).toBe(false);
    expect(r.protrusion).not.toBeNull();
    const { protrusionMm, torqueNm } = r.protrusion as { protrusionMm: number; torqueNm: number };
    expect(protrusionMm).toBeGreaterThan(0);
    expect(r.changes.join(" ")).toMatch(/sleeve protrusion/);
    const at = atTorque({ ...dry, sealing: { ...dry.sealing, sleeveProtrusionMm: protrusionMm } }, torqueNm);
    expect(evaluatePlan(at).weakestMargin).toBeGreaterThanOrEqual(1.2 * (1 - 1e-9));
    expect(torqueNm).toBeLessThanOrEqual(torqueCeiling(prepare(at)).torqueNm);
  });
  it("never suggests sleeve protrusion for an engine without sleeves (review fix, kept)", () => {
    const base = workedExample();
    const r = suggest({ ...base, sealing: { ...base.sealing, sleeveProtrusionMm: 0 } }, { targetMargin: 1.0 });
    expect(base.sleeve.kind).toBe("none");
    expect(r.protrusion).toBeNull();
    expect(r.changes.join(" ")).not.toMatch(/sleeve protrusion/);
  });
  it("prepare() is pure: the same input gives the same prepared figures", () => {
    const a = prepare(workedExample());
    const b = prepare(workedExample());
    expect(a.C).toBe(b.C);
    expect(a.phi).toBe(b.phi);
    expect(a.paths).toEqual(b.paths);
  });
});
