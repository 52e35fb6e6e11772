// The squeeze point: the torque past which more torque mostly compresses the head (ours, DESIGN.md).
import { boreSeal } from "./cylinders";
import { SI_WORDING, type Wording } from "./wording";
import { hotSettledPreload, type Prepared } from "./model";

export type SqueezeCause = "share" | "head-bearing" | "stud-yield";

/** The causes in words, for sentences. */
export const CAUSE_WORDS: Record<SqueezeCause, string> = {
  share: "seal-line share",
  "head-bearing": "head bearing pressure",
  "stud-yield": "stud stress",
};

export interface SqueezePoint {
  torqueNm: number;
  cause: SqueezeCause;
  explanation: string;
}

/** Index of the bore with the least clamp at equal stud preload (it reaches every threshold last). */
export function leastClampedBore(p: Prepared): number {
  let b = 0;
  for (let i = 1; i < p.cylinders; i++) if (p.boreStudWeight[i] < p.boreStudWeight[b]) b = i;
  return b;
}

/**
 * Torque at each limit, from the closed forms (preload is linear in torque, stress and bearing
 * pressure linear in preload, the seal split piecewise linear in clamp).
 */
export function squeezeTorques(p: Prepared): Record<SqueezeCause, number> {
  const toTorque = (preloadN: number) => (preloadN * p.torquePerPreloadMm) / 1000;
  // VDI 2230 tightening factor: Fmax = 2·αA/(1 + αA)·F
  const maxOverNominal = (2 * p.tighteningFactor) / (1 + p.tighteningFactor);
  // VDI 2230: σred(Fmax) = ν·Rp0.2
  const studN = p.studLimitMpa / p.stressPerN.equivalent / maxOverNominal;
  // VDI 2230: Fmax/Ap = limiting surface pressure pG
  const bearingN = (p.plan.head.limitingSurfacePressureMpa * p.bearingAreaMm2) / maxOverNominal;
  // ours: share falls under the threshold where the body touches (if k_r/(k_r+k_b) is under it) or the line flows
  const threshold = p.plan.model.shareThreshold;
  const clampAtShareDrop = p.contactShare < threshold ? Math.min(p.bodyTouchClampN, p.lineYieldClampN) : p.lineYieldClampN;
  const bore = leastClampedBore(p);
  let shareNm = toTorque(clampAtShareDrop / p.boreStudWeight[bore]);
  if (p.plan.model.shareBasis === "assembled-or-fired") {
    // ours: under firing each added newton of clamp reaches the seal line in full until the body
    // carries (1 − s)·relief hot and settled; only past that does the assembled share decide
    shareNm = Math.max(shareNm, bufferTorque(p, bore, toTorque(studN) * 10));
  }
  return { share: shareNm, "head-bearing": toTorque(bearingN), "stud-yield": toTorque(studN) };
}

/** Torque at which the bore's hot, settled body load first covers (1 − s)·relief (bisection). */
export function bufferTorque(p: Prepared, bore: number, ceilingNm: number): number {
  const need = (1 - p.contactShare) * p.reliefPerBoreN;
  const w = p.boreStudWeight[bore];
  const covered = (T: number) => {
    const F = (T * 1000) / p.torquePerPreloadMm;
    return boreSeal(p, w * F, w * hotSettledPreload(p, F)).hot.bodyN >= need;
  };
  if (!covered(ceilingNm)) return ceilingNm;
  let lo = 0;
  let hi = ceilingNm;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (covered(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}


/** The first limit reached as torque rises, with a plain explanation. */
export function squeezePoint(p: Prepared, w: Wording = SI_WORDING): SqueezePoint {
  const nm = w.torque;
  const t = squeezeTorques(p);
  let cause: SqueezeCause = "share";
  if (t["head-bearing"] < t[cause]) cause = "head-bearing";
  if (t["stud-yield"] < t[cause]) cause = "stud-yield";
  const torqueNm = t[cause];
  const bore = leastClampedBore(p) + 1;
  const threshold = Math.round(p.plan.model.shareThreshold * 100);
  let explanation: string;
  if (cause === "share") {
    const yielded = p.contactShare >= p.plan.model.shareThreshold || p.lineYieldClampN <= p.bodyTouchClampN;
    const fired = p.plan.model.shareBasis === "assembled-or-fired";
    explanation = yielded
      ? `Past ${nm(torqueNm)} the seal line on cylinder ${bore} reaches its indentation limit and stops taking load; added torque goes into the gasket body and the head${fired ? ", and the body already carries enough to ride out firing" : ""}.`
      : `Past ${nm(torqueNm)} the gasket body touches on cylinder ${bore}; then only ${Math.round(p.contactShare * 100)} % of added clamp (under the ${threshold} % threshold) reaches the seal line, the rest squeezes the body and head.`;
    if (torqueNm === 0)
      explanation = `From the first turn, under ${threshold} % of added clamp reaches the seal line (it does not stand proud of the body): more torque mostly squeezes the body and head.`;
  } else if (cause === "head-bearing") {
    explanation = `Past ${nm(torqueNm)} the washer at the top of the preload band presses the head harder than its alloy's ${w.stress(p.plan.head.limitingSurfacePressureMpa)} limit; more torque sinks the washer into the head.`;
  } else {
    explanation = `Past ${nm(torqueNm)} the stud at the top of the preload band passes ${Math.round(p.plan.model.studLimitFraction * 100)} % of its yield strength in equivalent stress.`;
  }
  return { torqueNm, cause, explanation };
}
