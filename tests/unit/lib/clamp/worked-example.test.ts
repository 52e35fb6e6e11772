// The worked example of docs/clamp-model.md, step by step. Every expected figure below is the hand
// arithmetic written out in the docs (worked from the documented equations, not the code's output);
// tolerance 0.05 % unless a step says otherwise.
import { describe, expect, it } from "vitest";
import { evaluatePlan, suggest, torqueSweep } from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { workedExample } from "./fixtures";

const TOL = 5e-4;
const e = evaluatePlan(workedExample());
const close = (actual: number | null | undefined, expected: number, tol = TOL) => {
  expect(actual).toBeTypeOf("number");
  expect(relErr(actual as number, expected)).toBeLessThan(tol);
};
const check = (id: string) => {
  const c = e.verdict.checks.find((x) => x.id === id);
  if (!c) throw new Error(`no check ${id}`);
  return c;
};

describe("worked example (docs/clamp-model.md): invented inline four, bore 96, M14×1.5 studs", () => {
  it("step 1 thread: d2 13.0257, d3 12.1597, As 124.546 mm² (ISO 68-1, ISO 898-1)", () => {
    expect(e.threadForm).toBe("iso");
    close(e.thread.pitchDiameterMm, 13.025721);
    close(e.thread.minorDiameterMm, 12.159696);
    close(e.thread.stressAreaMm2, 124.5456);
    close(e.thread.minorAreaMm2, 116.1276);
    close(e.thread.nominalAreaMm2, 153.938);
  });

  it("step 2 torque: friction on the nut face 1.45·d = 20.3 mm, DKm 17.65; T/F 2.200181 mm; F 81 811 N; K 0.15716", () => {
    close(e.tightening.frictionDiameterMm, 17.65, 1e-9);
    close(e.tightening.torquePerPreloadMm, 2.200181);
    close(e.tightening.preload.nominalN, 81_811.5);
    close(e.tightening.equivalentNutFactor, 0.157156);
    // αA 1.5: Fmin = 2·81 811.5/2.5 = 65 449.2; Fmax = 1.5·65 449.2 = 98 173.7
    close(e.tightening.preload.minN, 65_449.2);
    close(e.tightening.preload.maxN, 98_173.7);
  });

  it("step 3 stud while tightened: σ 656.88, τ 238.16 (elastic), σred 726.09 MPa with VDI's ¾·τ; 52.7 % of yield, 63.2 % at Fmax", () => {
    close(e.studStress.nominal.axialMpa, 656.88);
    close(e.studStress.nominal.torsionMpa, 238.161);
    close(e.studStress.nominal.equivalentMpa, 726.09);
    close(e.studStress.nominal.utilization, 0.526534);
    close(e.studStress.atMax.equivalentMpa, 871.308);
    close(e.studStress.atMax.utilization, 0.631841);
    close(e.studStress.limitMpa, 1241.1, 1e-9);
  });

  it("step 4 stiffness: kS 240 087, kM 243 435 N/mm, C 0.49654; cone limit 110.4 mm does not bind (cones reach 76.7 mm)", () => {
    close(e.stiffness.gripMm, 91.3, 1e-12);
    close(e.stiffness.studNPerMm, 240_086.8);
    close(e.stiffness.coneLimitMm, 110.4, 1e-9);
    expect(e.stiffness.studSpacingAssumed).toBe(true);
    close(e.stiffness.memberNPerMm, 243_435.2);
    close(e.stiffness.jointConstant, 0.496538);
    const layer = (n: string) => e.stiffness.layers.find((l) => l.name === n)?.complianceMmPerN;
    // head: 1/1 903 473 + 1/1 714 083; gasket: 1/333 432
    close(layer("head"), 1.108758e-6);
    close(layer("gasket"), 2.999112e-6);
  });

  it("step 5 load at the gasket plane: Φn = δ_gasket/(δS + δP) = 0.36252; relief (1 − Φn)·H = 78 514 N per bore", () => {
    close(e.stiffness.loadFactor, 0.362517);
    close(e.cylinders[0].clampReliefN, 78_514.3);
    close(e.cylinders[1].clampReliefN, 78_514.3);
  });

  it("step 6 ASME stand-in: H 123 163 N, Hp 41 054 N, Wm2 28 949 N; firing load per stud 41 054 / 51 318 / 61 581 N", () => {
    expect(e.seal.requirement.basis).toBe("asme-stand-in");
    close(e.seal.requirement.pressureForceN, 123_163.0);
    close(e.seal.requirement.operatingContactN, 41_054.33);
    close(e.seal.requirement.seatingLoadN, 28_949.28);
    // default pattern, side A: end stud | between 1 and 2 | between 2 and 3 | between 3 and 4 | end stud
    const fa = e.studs.slice(0, 5).map((s) => s.externalN);
    close(fa[0], 41_054.33);
    close(fa[1], 51_317.92);
    close(fa[2], 61_581.5);
    close(fa[3], 51_317.92);
    // one bore fires at a time: the most a stud sees at once is its biggest bore's share, H/3 at the end studs
    const peak = e.studs.slice(0, 5).map((s) => s.peakFiringN);
    close(peak[0], 41_054.33);
    close(peak[1], 30_790.75);
    close(peak[2], 30_790.75);
    close(fa[4], 41_054.33);
  });

  it("step 7 seal springs: deck plates (head 2.835e-7, block 2.053e-7 mm/N) make k_r 1.726e6 N/mm, softer than k_b 6.154e6; s 0.21908", () => {
    expect(e.seal.paths).toEqual(["ring", "body"]);
    close(e.seal.deck.thicknessMm, 12, 1e-12);
    close(e.seal.deck.outerRadiusMm, 66.2, 1e-12);
    expect(e.seal.deck.assumed).toBe(true);
    close(e.seal.lineNPerMm, 1_726_360);
    close(e.seal.bodyNPerMm, 6_153_846);
    close(e.seal.gapMm, 0.005, 1e-9);
    close(e.seal.lineLimitN, 489_852.8);
    // the body touches at k_r·g = 8 632 N of bore clamp: every bore here carries both paths
    close(e.cylinders[1].marginalSealLineShare, 0.219075);
    expect(e.cylinders[1].sealLineAtLimit).toBe(false);
    close(e.seal.bodyRequirementN, 40_000, 1e-12);
  });

  it("step 8 heat and settling: ΔF +6 926 N, FZ 1 571 N, hot settled 87 167 N (nominal)", () => {
    close(e.hotSettled.thermalChangeN, 6_926.4, 1e-3);
    close(e.hotSettled.embeddingMm, 0.013, 1e-9);
    close(e.hotSettled.embeddingLossN, 1_571.4, 1e-3);
    close(e.hotSettled.preloadN, 87_166.5);
  });

  it("step 9 cylinder 2 (middle bore, 2 studs' worth): margin 0.501 at Fmin (firing decides), 0.676 nominal", () => {
    const c = e.cylinders[1];
    close(c.effectiveStuds, 2, 1e-12);
    // nominal, cold / hot / fired
    close(c.clampN, 163_622.9);
    close(c.sealLineN, 42_586.6);
    close(c.bodyN, 121_036.4);
    close(c.clampHotSettledN, 174_333.1);
    close(c.sealLineHotSettledN, 44_932.9);
    close(c.remainingSealLineHotSettledN, 27_732.3);
    close(c.bodyFiredN, 68_086.4);
    close(c.liftMm, 0.0099635);
    close(c.sealMarginNominal, 0.6755);
    // bottom of the band: line 35 417 N cold, 20 563 N hot and fired; body 42 531 N fired
    close(c.seatingMargin, 1.22343);
    close(c.operatingMargin, 0.500877);
    close(c.sealMargin, 0.500877);
    close(c.bodyMargin, 1.06327);
    expect(e.weakestCylinder).toBe(2);
    close(e.weakestMargin, 0.500877);
    close(e.weakestMarginNominal, 0.6755);
    // cylinders 2 and 3 are mirror images, 1 and 4 too
    close(e.cylinders[2].sealMargin, c.sealMargin, 1e-12);
    close(e.cylinders[3].sealMargin, e.cylinders[0].sealMargin, 1e-12);
  });

  it("step 9 cylinder 1 (end bore, 3 studs' worth): margin 0.879 at Fmin, 1.141 nominal", () => {
    const c = e.cylinders[0];
    close(c.effectiveStuds, 3, 1e-12);
    close(c.clampN, 245_434.4);
    close(c.sealLineN, 60_509.4);
    close(c.remainingSealLineHotSettledN, 46_828.4);
    close(c.sealMarginNominal, 1.14064);
    close(c.seatingMargin, 1.71872);
    close(c.operatingMargin, 0.8787);
    close(c.sealMargin, 0.8787);
    close(c.bodyMargin, 2.44559);
  });

  it("step 10 stud hot and fired at Fmax: 119 983 N, σ 963.4, kτ·τ 142.9, σred 994.7 MPa = 72.1 % of yield", () => {
    const w = e.studStress.working;
    close(w.studLoadN, 119_983.08);
    close(w.axialMpa, 963.367);
    close(w.torsionMpa, 142.896);
    close(w.equivalentMpa, 994.653);
    close(w.utilization, 0.721286);
  });

  it("step 10 fatigue: σa = Φn·FA/(2·As) = 59.75 MPa against σASV 47.36 MPa", () => {
    const w = e.studStress.working;
    close(w.amplitudeMpa, 59.7488);
    close(w.enduranceMpa, 47.3571);
    expect(w.stripCapacityN).toBeNull();
    expect(w.minEngagementMm).toBeNull();
  });

  it("step 10 washer bearing: 296.8 MPa at assembly, 435.2 MPa hot and fired at Fmax (115 % of 380)", () => {
    close(e.head.bearingAreaMm2, 275.6748);
    close(e.head.bearingPressureMpa, 296.768);
    close(e.head.bearingPressureMaxMpa, 435.234);
    close(e.head.bearingUtilizationMax, 1.145353);
  });

  it("step 10 every check of the verdict with its figure", () => {
    const seal = check("seal");
    close(seal.ratio, 0.500877);
    expect(seal.status).toBe("short");
    expect(seal.cylinder).toBe(2);
    const body = check("body-seal");
    close(body.ratio, 1.06327);
    expect(body.status).toBe("holds");
    const asm = check("stud-assembly");
    close(asm.ratio, 1.582678);
    expect(asm.status).toBe("holds");
    const work = check("stud-working");
    close(work.ratio, 1.386413);
    expect(work.status).toBe("holds");
    const fat = check("fatigue");
    close(fat.ratio, 0.792605);
    expect(fat.status).toBe("short");
    const brg = check("bearing");
    close(brg.ratio, 0.873093);
    expect(brg.status).toBe("short");
    expect(check("thread-strip").checked).toBe(false);
    expect(check("crush").checked).toBe(false);
  });

  it("step 11 verdict: short, the seal under firing in cylinder 2 (0.501 is further under its limit than fatigue 0.793 and bearing 0.873)", () => {
    expect(e.verdict.status).toBe("short");
    expect(e.verdict.limiting).toBe("seal");
    expect(e.verdict.headline).toBe("Seal short under firing in cylinder 2");
  });

  it("step 12 torque ceiling: washer bearing at 152.08 N·m (stud tightened 256.39, stud hot and fired 263.82)", () => {
    close(e.ceiling.torqueNm, 152.082);
    expect(e.ceiling.cause).toBe("bearing");
    close(e.ceiling.torques.bearing, 152.082);
    close(e.ceiling.torques["stud-assembly"], 256.394);
    close(e.ceiling.torques["stud-working"], 263.82);
    expect(e.ceiling.torques["thread-strip"]).toBe(Infinity);
    expect(e.ceiling.torques.crush).toBe(Infinity);
    expect(e.ceiling.explanation).toMatch(/380 MPa/);
    const s = torqueSweep(workedExample(), { fromNm: 100, toNm: 260, points: 17 });
    close(s.ceiling.torqueNm, 152.082);
    // head strain reaches 0.2 % at F = 0.002·90/1.108758e-6 = 162 344 N, i.e. 357.19 N·m: far past the ceiling
    close(s.headSqueezeOnsetNm, 357.186);
  });

  it("step 13 seal gained per +10 % torque: 21.9 % (2 868 of 13 090 N), the line's stiffness share", () => {
    expect(e.gain.bore).toBe(1);
    close(e.gain.clampGainN, 13_089.83);
    close(e.gain.lineGainN, 2_867.66);
    close(e.gain.share, 0.219075);
  });

  it("step 14 head: compresses 0.0907 mm at the boss, strain 0.101 % under the 0.2 % limit; not 'mostly squeezing'", () => {
    close(e.squeeze.headCompressionMm, 0.0907091);
    close(e.head.compressionPerStudMm, 0.0907091);
    close(e.squeeze.headStrain, 0.00100788);
    close(e.squeeze.strainLimit, 0.002, 1e-12);
    expect(e.squeeze.mostlySqueezing).toBe(false);
    expect(e.squeeze.reason).toBeNull();
  });

  it("step 15 suggest for 1.5: no torque reaches it below the 152 N·m ceiling (it would take 437.5 N·m); at the ceiling 0.393", () => {
    const r = suggest(workedExample(), { targetMargin: 1.5 });
    expect(r.reachable).toBe(false);
    expect(r.torqueNm).toBeNull();
    expect(r.limit.cause).toBe("bearing");
    close(r.limit.torqueNm, 152.082);
    close(r.marginAtLimit, 0.392539);
    expect(r.protrusion).toBeNull();
    // at the ceiling the body keeps 26 676 N of the 40 000 N it needs (0.667): the body message comes first
    expect(r.changes[0]).toMatch(/coolant and oil/);
    expect(r.changes.some((c) => /washer bearing on the head/.test(c))).toBe(true);
    expect(r.changes.some((c) => /0\.39/.test(c))).toBe(true);
    expect(r.summary).toMatch(/No torque reaches a seal margin of 1\.50/);
  });

  it("warnings and assumptions: the three failing checks, and the five figures the plan did not give", () => {
    expect(e.warnings.filter((x) => /fails/.test(x))).toHaveLength(3);
    expect(e.assumptions).toHaveLength(5);
  });
});
