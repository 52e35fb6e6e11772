// The worked example of docs/clamp-model.md, step by step. Every expected figure below is the
// hand arithmetic written out in the docs (not the code's output); tolerance 0.05 % unless stated.
import { describe, expect, it } from "vitest";
import { evaluatePlan, suggest, torqueSweep } from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { workedExample } from "./fixtures";

const TOL = 5e-4;
const e = evaluatePlan(workedExample());
const close = (actual: number, expected: number, tol = TOL) => expect(relErr(actual, expected)).toBeLessThan(tol);

describe("worked example (docs/clamp-model.md): invented inline four, bore 96, M14×1.5 studs", () => {
  it("step 1 thread: d2 13.0257, d3 12.1597, As 124.546 mm² (ISO 68-1, ISO 898-1)", () => {
    close(e.thread.pitchDiameterMm, 13.025721);
    close(e.thread.minorDiameterMm, 12.159696);
    close(e.thread.stressAreaMm2, 124.5456);
  });
  it("step 2 torque: T/F = 0.238732 + 0.902448 + 1.170000 = 2.311181 mm; F = 77 882 N; K = 0.16508", () => {
    close(e.tightening.torquePerPreloadMm, 2.311181);
    close(e.tightening.preload.nominalN, 77_882.3);
    close(e.tightening.equivalentNutFactor, 0.165084);
    // αA 1.5: Fmin = 2·77 882.3/2.5 = 62 305.8; Fmax = 1.5·62 305.8 = 93 458.7
    close(e.tightening.preload.minN, 62_305.8);
    close(e.tightening.preload.maxN, 93_458.7);
  });
  it("step 3 stud stress: σ 625.33, τ 226.72, σred 738.41 MPa; 53.5 % of yield, 64.3 % at Fmax", () => {
    close(e.studStress.nominal.axialMpa, 625.332);
    close(e.studStress.nominal.torsionMpa, 226.723);
    close(e.studStress.nominal.equivalentMpa, 738.41);
    close(e.studStress.atMax.utilization, 0.64256);
  });
  it("step 4 stiffness: kS 240 087 N/mm, kM 243 435 N/mm, C 0.49654", () => {
    close(e.stiffness.gripMm, 91.3, 1e-12);
    close(e.stiffness.studNPerMm, 240_086.8);
    close(e.stiffness.memberNPerMm, 243_435.2);
    close(e.stiffness.jointConstant, 0.496538);
  });
  it("step 5 seal springs: k_r 11.050e6, k_b 6.154e6 N/mm, s 0.64231, body touches at 55 252 N, line flows at 489 853 N", () => {
    close(e.seal.lineNPerMm, 11_050_356);
    close(e.seal.bodyNPerMm, 6_153_846);
    close(e.seal.contactShare, 0.642306);
    close(e.seal.bodyTouchClampN, 55_251.8);
    close(e.seal.lineLimitN, 489_852.8);
  });
  it("step 6 ASME: H 123 163 N, Hp 41 054 N, Wm2 28 949 N; relief (1 − C)·H = 62 008 N", () => {
    close(e.seal.asme.pressureForceN, 123_163.0);
    close(e.seal.asme.operatingContactN, 41_054.3);
    close(e.seal.asme.seatingLoadN, 28_949.3);
    close(e.cylinders[0].clampReliefN, 62_007.9);
  });
  it("step 7 heat and settling: ΔF +6 926 N, FZ 1 571 N, hot settled 83 237 N", () => {
    close(e.hotSettled.thermalChangeN, 6_926.4, 1e-3);
    close(e.hotSettled.embeddingLossN, 1_571.4, 1e-3);
    close(e.hotSettled.preloadN, 83_237.3);
  });
  it("step 8 cylinder 1 (end bore, 3 studs' worth): clamp 233 647, line 169 836, margin 3.418", () => {
    const c = e.cylinders[0];
    close(c.effectiveStuds, 3, 1e-12);
    close(c.clampN, 233_646.8);
    close(c.sealLineN, 169_835.9);
    close(c.bodyN, 63_810.9);
    close(c.remainingSealLineHotSettledN, 140_326.6);
    close(c.seatingMargin, 5.8667);
    close(c.operatingMargin, 3.4181);
    close(c.sealMargin, 3.4181);
  });
  it("step 8 cylinder 2 (middle bore, 2 studs' worth) is the weakest: margin 2.116", () => {
    const c = e.cylinders[1];
    close(c.clampN, 155_764.5);
    close(c.sealLineN, 119_811.7);
    close(c.clampHotSettledN, 166_474.7);
    close(c.sealLineHotSettledN, 126_690.9);
    close(c.remainingSealLineHotSettledN, 86_862.8);
    close(c.sealMargin, 2.1158);
    expect(e.weakestCylinder).toBe(2);
    // cylinders 2 and 3 are mirror images, 1 and 4 too
    close(e.cylinders[2].sealMargin, c.sealMargin, 1e-12);
    close(e.cylinders[3].sealMargin, e.cylinders[0].sealMargin, 1e-12);
  });
  it("step 9 head: 282.5 MPa under the washer, 339.0 MPa at Fmax (89 % of 380); head compresses 0.0864 mm", () => {
    close(e.head.bearingPressureMpa, 282.515);
    close(e.head.bearingPressureMaxMpa, 339.018);
    close(e.head.compressionPerStudMm, 0.086353);
    expect(e.squeeze.mostlySqueezing).toBe(false);
    expect(e.warnings).toEqual([]);
  });
  it("step 10 squeeze point: head bearing at 201.8 N·m (stud limit 252.1 N·m comes later)", () => {
    const s = torqueSweep(workedExample(), { fromNm: 100, toNm: 260, points: 17 });
    expect(s.squeezePoint?.cause).toBe("head-bearing");
    close(s.squeezePoint?.torqueNm ?? 0, 201.759);
    expect(s.squeezePoint?.explanation).toMatch(/380 MPa/);
  });
  it("step 11 suggest: margin 1.5 on cylinder 2 is reached below the squeeze point", () => {
    const r = suggest(workedExample(), { targetMargin: 1.5 });
    expect(r.reachable).toBe(true);
    // hand check of the answer: at the suggested torque the weakest margin is 1.5 (bisection to 1e-9)
    const at = evaluatePlan({ ...workedExample(), tightening: { ...workedExample().tightening, target: { mode: "torque", torqueNm: r.torqueNm ?? 0 } } });
    expect(at.weakestMargin).toBeCloseTo(1.5, 6);
    expect(r.torqueNm ?? Infinity).toBeLessThan(201.759);
  });
});
