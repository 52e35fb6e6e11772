// Torque ↔ preload, tightening scatter and the stud's stress while it is tightened.
import type { ThreadGeometry } from "./thread";

export interface TorqueGeometry {
  pitchMm: number;
  pitchDiameterMm: number;
  /** Effective bearing diameter DKm = (dw + dh)/2 of the nut face. */
  bearingDiameterMm: number;
}

export interface Friction {
  /** μG, thread friction. */
  thread: number;
  /** μK, bearing (nut face) friction. */
  bearing: number;
}

const COS_30 = Math.cos(Math.PI / 6);

/** Mean bearing diameter of the face that turns: DKm = (dw + dh)/2. */
export function bearingDiameterMm(faceOdMm: number, holeMm: number): number {
  // ISO 16047 / VDI 2230 Part 1: DKm = (dw + dh)/2
  return (faceOdMm + holeMm) / 2;
}

/**
 * Outer diameter of the face where bearing friction acts: the nut's own face on a washer that stays
 * put, the washer's face when it turns with the nut. Without a nut face figure we take 1.45·d, about
 * a hex nut's bearing-face diameter (ISO 4032 dw,min ≈ 1.4–1.5·d, from memory), never past the washer.
 */
export function frictionFaceOdMm(f: { diameterMm: number; washerOdMm: number; nutFaceOdMm?: number; washerTurns: boolean }): number {
  if (f.washerTurns) return f.washerOdMm;
  return Math.min(f.washerOdMm, f.nutFaceOdMm ?? 1.45 * f.diameterMm);
}

/** Torque per unit preload, in N·mm per N (i.e. mm): the bracket of the long form. */
export function torquePerPreloadMm(g: TorqueGeometry, f: Friction): number {
  // ISO 16047 / VDI 2230 Part 1: T = F·[P/(2π) + μG·d2/(2·cos 30°) + μK·DKm/2]
  return g.pitchMm / (2 * Math.PI) + (f.thread * g.pitchDiameterMm) / (2 * COS_30) + (f.bearing * g.bearingDiameterMm) / 2;
}

/** Tightening torque (N·m) that gives the preload (N). */
export function torqueForPreload(preloadN: number, g: TorqueGeometry, f: Friction): number {
  return (preloadN * torquePerPreloadMm(g, f)) / 1000;
}

/** Preload (N) that the torque (N·m) gives. */
export function preloadFromTorque(torqueNm: number, g: TorqueGeometry, f: Friction): number {
  return (torqueNm * 1000) / torquePerPreloadMm(g, f);
}

/** The short-form nut factor that matches the long form: K = T/(F·d). */
export function equivalentNutFactor(g: TorqueGeometry, f: Friction, diameterMm: number): number {
  // Shigley eq. 8-27: T = K·F·d, solved for K
  return torquePerPreloadMm(g, f) / diameterMm;
}

export const TIGHTENING_METHODS = ["torque-estimated-friction", "torque-tested-friction", "angle-or-yield", "stretch-measured"] as const;
export type TighteningMethod = (typeof TIGHTENING_METHODS)[number];

/**
 * Tightening factor αA = FMmax/FMmin by method. VDI 2230 via a fastener supplier's table
 * (docs/references.md §2): the value is a point we chose inside each published range.
 */
export const TIGHTENING_FACTOR: Record<TighteningMethod, number> = {
  // torque wrench, friction estimated: ±23–28 % → αA 1.6–1.8; we take 1.7 (±25.9 %)
  "torque-estimated-friction": 1.7,
  // torque set by test on the real parts: ±17–23 % → αA 1.41–1.60; we take 1.5 (±20 %)
  "torque-tested-friction": 1.5,
  // angle- or yield-controlled: ±5–12 % → αA 1.11–1.27; we take 1.2 (±9.1 %)
  "angle-or-yield": 1.2,
  // stud elongation measured: ±9–23 % → αA 1.2–1.6; we take 1.4 (±16.7 %)
  "stretch-measured": 1.4,
};

export interface PreloadBand {
  minN: number;
  nominalN: number;
  maxN: number;
  tighteningFactor: number;
}

export function preloadBand(nominalN: number, tighteningFactor: number): PreloadBand {
  // VDI 2230 tightening factor: αA = Fmax/Fmin about the nominal: Fmin = 2F/(1+αA), Fmax = αA·Fmin
  const minN = (2 * nominalN) / (1 + tighteningFactor);
  return { minN, nominalN, maxN: tighteningFactor * minN, tighteningFactor };
}

export interface StudSection {
  /** Smallest load-carrying area A0 (stress area or reduced shank). */
  areaMm2: number;
  /** Diameter d0 that goes with A0 for the torsion modulus. */
  diameterMm: number;
}

export interface TighteningStress {
  axialMpa: number;
  torsionMpa: number;
  equivalentMpa: number;
  /** Equivalent stress over yield. */
  utilization: number;
}

/**
 * VDI 2230 Part 1's FMzul takes the tightening torsion on the plastic section modulus π·d0³/12 (the
 * factor 3/2 in its formula); docs/references.md §2 writes the elastic π·d0³/16. The VDI tables of assembly
 * preload (fine threads, 2001/2003 edition, tests/unit/lib/clamp/references.test.ts) follow the former
 * to 0.2 %, so the tightening check uses it; the working state keeps the elastic τ (with kτ).
 */
export const PLASTIC_TORSION_FACTOR = 12 / 16;

/** Equivalent stress per newton of preload while tightening (linear in F). */
export function tighteningStressPerN(
  thread: ThreadGeometry,
  section: StudSection,
  threadFriction: number,
): { axial: number; torsion: number; equivalent: number } {
  // VDI 2230: σ = F/A0
  const axial = 1 / section.areaMm2;
  // VDI 2230: MG = F·(d2/2)·(P/(π·d2) + 1.155·μG)
  const threadTorquePerN = (thread.pitchDiameterMm / 2) * (thread.pitchMm / (Math.PI * thread.pitchDiameterMm) + 1.155 * threadFriction);
  // VDI 2230: τ = MG/Wp, Wp = π·d0³/16 (elastic)
  const wp = (Math.PI * section.diameterMm ** 3) / 16;
  const torsion = threadTorquePerN / wp;
  // VDI 2230 Part 1 (FMzul, von Mises): σred = √(σ² + 3·(3/4·τ)²), the torsion on π·d0³/12
  const t = PLASTIC_TORSION_FACTOR * torsion;
  const equivalent = Math.sqrt(axial * axial + 3 * t * t);
  return { axial, torsion, equivalent };
}

export function tighteningStress(
  preloadN: number,
  perN: { axial: number; torsion: number; equivalent: number },
  yieldMpa: number,
): TighteningStress {
  const equivalentMpa = perN.equivalent * preloadN;
  return {
    axialMpa: perN.axial * preloadN,
    torsionMpa: perN.torsion * preloadN,
    equivalentMpa,
    utilization: equivalentMpa / yieldMpa,
  };
}
