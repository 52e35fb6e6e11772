// What the plan editor and the API show for one plan: the estimate, a torque sweep around the
// plan's torque, and the uncertainty run. Pure; SI throughout (the page converts for display).
import { evaluatePlan, prepare, SI_WORDING, squeezePoint, torqueSweep, uncertainty, type PlanInput, type PlanEstimate, type SqueezePoint, type Wording } from "../clamp";

export interface SweepRow {
  torqueNm: number;
  weakestMargin: number;
  /** dF_r/dF as assembled, on the plan's weakest cylinder. */
  marginalShareWeakest: number;
  /** Of added clamp on that cylinder, the share still on its seal line under firing, hot and settled. */
  firedShareWeakest: number;
  studUtilizationMax: number;
  bearingUtilizationMax: number;
}

export interface EstimateView {
  torqueNm: number;
  estimate: PlanEstimate;
  /** firedShareWeakest at the plan's torque. */
  firedShare: number;
  sweep: SweepRow[];
  /** The first limit as torque rises, wherever it falls (also outside the swept range). */
  squeezePoint: SqueezePoint;
  shareThreshold: number;
  probabilityMarginBelowOne: number;
  weakestMarginBand: { p5: number; p50: number; p95: number };
}

export const SWEEP_POINTS = 41;
export const UNCERTAINTY_SAMPLES = 2000;
// Fixed seed: the same plan always shows the same chance, so two views can be compared.
const SEED = 20261201;

/** The sweep runs from 40 % to 160 % of the plan's torque (never past 5000 N·m). */
export function sweepRange(torqueNm: number): { fromNm: number; toNm: number } {
  return { fromNm: torqueNm * 0.4, toNm: Math.min(5000, torqueNm * 1.6) };
}

export function estimateView(input: PlanInput, wording: Wording = SI_WORDING): EstimateView {
  const estimate = evaluatePlan(input, wording);
  const torqueNm = estimate.tightening.torqueNm;
  const sweep = torqueSweep(input, { ...sweepRange(torqueNm), points: SWEEP_POINTS });
  const run = uncertainty(input, { samples: UNCERTAINTY_SAMPLES, seed: SEED });
  const limit = input.head.limitingSurfacePressureMpa;
  const bore = estimate.weakestCylinder - 1;
  const pts = sweep.points;
  // ours: central differences of the seal-line load left under firing against the bore's clamp
  const firedShare = (i: number) => {
    const a = pts[Math.max(0, i - 1)]!;
    const b = pts[Math.min(pts.length - 1, i + 1)]!;
    const dClamp = b.clampN[bore]! - a.clampN[bore]!;
    return dClamp > 0 ? Math.min(1, Math.max(0, (b.remainingSealLineN[bore]! - a.remainingSealLineN[bore]!) / dClamp)) : 0;
  };
  const rows = pts.map((pt, i) => ({
    torqueNm: pt.torqueNm,
    weakestMargin: pt.weakestMargin,
    marginalShareWeakest: pt.marginalShareWeakest,
    firedShareWeakest: firedShare(i),
    studUtilizationMax: pt.studUtilizationMax,
    bearingUtilizationMax: pt.bearingPressureMaxMpa / limit,
  }));
  return {
    torqueNm,
    estimate,
    firedShare: rows[Math.floor(rows.length / 2)]!.firedShareWeakest,
    sweep: rows,
    squeezePoint: squeezePoint(prepare(input), wording),
    shareThreshold: sweep.shareThreshold,
    probabilityMarginBelowOne: run.probabilityMarginBelowOne,
    weakestMarginBand: run.weakestMargin,
  };
}
