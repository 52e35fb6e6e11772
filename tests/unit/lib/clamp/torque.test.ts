// Torque ↔ preload, the tightening band and the stud's stress while tightened (app/lib/clamp/torque.ts).
import { describe, expect, it } from "vitest";
import {
  bearingDiameterMm,
  equivalentNutFactor,
  frictionFaceOdMm,
  PLASTIC_TORSION_FACTOR,
  preloadBand,
  preloadFromTorque,
  TIGHTENING_FACTOR,
  tighteningStress,
  tighteningStressPerN,
  torqueForPreload,
  torquePerPreloadMm,
} from "../../../../app/lib/clamp/torque";
import { threadGeometry } from "../../../../app/lib/clamp/thread";
import { IN_TO_MM, relErr } from "../nist";

describe("the long form (ISO 16047 / VDI 2230 Part 1)", () => {
  // docs/references.md §2 check (computed from the ISO 16047 form): 1/2-20, μG = μK = 0.12, dw 0.75 in, dh 0.53 in
  const d2 = (0.5 - 0.649519 / 20) * IN_TO_MM;
  const g = { pitchMm: IN_TO_MM / 20, pitchDiameterMm: d2, bearingDiameterMm: bearingDiameterMm(0.75 * IN_TO_MM, 0.53 * IN_TO_MM) };
  const mu = { thread: 0.12, bearing: 0.12 };
  it("1/2-20 at μ 0.12: T/F = 0.07875 in, K = 0.1575 (docs/references.md §2, computed), ±0.1 %", () => {
    expect(relErr(torquePerPreloadMm(g, mu) / IN_TO_MM, 0.07875)).toBeLessThan(1e-3);
    expect(relErr(equivalentNutFactor(g, mu, 0.5 * IN_TO_MM), 0.1575)).toBeLessThan(1e-3);
  });
  it("torque and preload are inverse: 50 kN → T → 50 kN to 1e-12", () => {
    const T = torqueForPreload(50_000, g, mu);
    expect(T).toBeCloseTo((50_000 * torquePerPreloadMm(g, mu)) / 1000, 9);
    expect(preloadFromTorque(T, g, mu)).toBeCloseTo(50_000, 6);
  });
  it("more friction takes more torque for the same preload, and zero friction leaves only the pitch term P/(2π)", () => {
    expect(torquePerPreloadMm(g, { thread: 0.16, bearing: 0.12 })).toBeGreaterThan(torquePerPreloadMm(g, mu));
    expect(torquePerPreloadMm(g, { thread: 0.12, bearing: 0.16 })).toBeGreaterThan(torquePerPreloadMm(g, mu));
    expect(torquePerPreloadMm(g, { thread: 0, bearing: 0 })).toBeCloseTo(g.pitchMm / (2 * Math.PI), 12);
  });
  it("DKm is the mean of the face and the hole: (24 + 15)/2 = 19.5 mm", () => {
    expect(bearingDiameterMm(24, 15)).toBe(19.5);
  });
});

describe("the friction face", () => {
  it("a turning washer: its own outer diameter", () => {
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, washerTurns: true, nutFaceOdMm: 20 })).toBe(24);
  });
  it("a washer that stays put: the nut face, 1.45·d when none is given (ISO 4032 dw, from memory), never past the washer", () => {
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, washerTurns: false, nutFaceOdMm: 20 })).toBe(20);
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 24, washerTurns: false })).toBeCloseTo(20.3, 12);
    expect(frictionFaceOdMm({ diameterMm: 14, washerOdMm: 19, washerTurns: false })).toBe(19);
  });
});

describe("the tightening band (VDI 2230 tightening factor αA = Fmax/Fmin)", () => {
  it("the factors sit inside the published ranges (VDI 2230 via a supplier's table, docs/references.md §2)", () => {
    expect(TIGHTENING_FACTOR["torque-estimated-friction"]).toBeGreaterThanOrEqual(1.6);
    expect(TIGHTENING_FACTOR["torque-estimated-friction"]).toBeLessThanOrEqual(1.8);
    expect(TIGHTENING_FACTOR["torque-tested-friction"]).toBeGreaterThanOrEqual(1.41);
    expect(TIGHTENING_FACTOR["torque-tested-friction"]).toBeLessThanOrEqual(1.6);
    expect(TIGHTENING_FACTOR["angle-or-yield"]).toBeGreaterThanOrEqual(1.11);
    expect(TIGHTENING_FACTOR["angle-or-yield"]).toBeLessThanOrEqual(1.27);
    expect(TIGHTENING_FACTOR["stretch-measured"]).toBeGreaterThanOrEqual(1.2);
    expect(TIGHTENING_FACTOR["stretch-measured"]).toBeLessThanOrEqual(1.6);
  });
  it("100 kN at αA 1.5: Fmin = 80 kN, Fmax = 120 kN (±20 %), the nominal their mean", () => {
    const b = preloadBand(100_000, 1.5);
    expect(b.minN).toBeCloseTo(80_000, 6);
    expect(b.maxN).toBeCloseTo(120_000, 6);
    expect((b.minN + b.maxN) / 2).toBeCloseTo(b.nominalN, 6);
    expect(b.maxN / b.minN).toBeCloseTo(1.5, 12);
  });
  it("αA = 1 is no scatter; a larger αA widens the band both ways", () => {
    expect(preloadBand(50_000, 1)).toMatchObject({ minN: 50_000, maxN: 50_000 });
    const a = preloadBand(50_000, 1.4);
    const b = preloadBand(50_000, 1.7);
    expect(b.minN).toBeLessThan(a.minN);
    expect(b.maxN).toBeGreaterThan(a.maxN);
  });
});

describe("stress while tightening (VDI 2230)", () => {
  const t = threadGeometry(12, 1.75);
  const section = { areaMm2: t.stressAreaMm2, diameterMm: t.stressDiameterMm };
  it("σ = F/A0 and τ = MG/(π·d0³/16) per newton, by hand", () => {
    const perN = tighteningStressPerN(t, section, 0.12);
    expect(perN.axial).toBeCloseTo(1 / t.stressAreaMm2, 15);
    const mg = (t.pitchDiameterMm / 2) * (t.pitchMm / (Math.PI * t.pitchDiameterMm) + 1.155 * 0.12);
    expect(perN.torsion).toBeCloseTo(mg / ((Math.PI * t.stressDiameterMm ** 3) / 16), 15);
    const tau = PLASTIC_TORSION_FACTOR * perN.torsion;
    expect(perN.equivalent).toBeCloseTo(Math.sqrt(perN.axial ** 2 + 3 * tau ** 2), 15);
  });
  it("is linear in the preload and its utilisation is σred over yield", () => {
    const perN = tighteningStressPerN(t, section, 0.12);
    const a = tighteningStress(40_000, perN, 940);
    const b = tighteningStress(80_000, perN, 940);
    expect(b.equivalentMpa / a.equivalentMpa).toBeCloseTo(2, 12);
    expect(a.utilization).toBeCloseTo(a.equivalentMpa / 940, 12);
    expect(a.axialMpa).toBeCloseTo(40_000 / t.stressAreaMm2, 9);
  });
  it("more thread friction raises the equivalent stress for the same preload (more torsion)", () => {
    expect(tighteningStressPerN(t, section, 0.16).equivalent).toBeGreaterThan(tighteningStressPerN(t, section, 0.1).equivalent);
  });
});
