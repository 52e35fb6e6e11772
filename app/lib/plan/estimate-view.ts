// What the plan editor and the API show for one plan: the estimate with its verdict, a torque sweep
// around the plan's torque, and the scatter run. Pure; SI throughout (the page converts for display).
import { prepare, SI_WORDING, type Ceiling, type PlanEstimate, type PlanInput, type Wording } from "../clamp";
import { evaluatePrepared } from "../clamp/evaluate";
import { sweepPrepared } from "../clamp/sweep";
import { cachedUncertainty } from "../clamp/uncertainty-cache";

export interface SweepRow {
  torqueNm: number;
  /** Weakest seal margin at the bottom of the scatter band, hot and fired (the verdict's basis). */
  weakestMargin: number;
  weakestMarginNominal: number;
  /** Of the clamp +10 % torque adds, the share still on the weakest seal line under firing. */
  gainShare: number;
  studUtilizationMax: number;
  studWorkingUtilization: number;
  bearingUtilizationMax: number;
  mostlySqueezing: boolean;
}

export interface EstimateView {
  torqueNm: number;
  estimate: PlanEstimate;
  sweep: SweepRow[];
  ceiling: Ceiling;
  /** Lowest torque where more torque mostly squeezes the head, or null when it never does in reach. */
  headSqueezeOnsetNm: number | null;
  targetMargin: number;
  probabilityMarginBelowOne: number;
  probabilityStudOverLimit: number;
  weakestMarginBand: { p5: number; p50: number; p95: number };
  /** Sampled preload over nominal, 2.5th to 97.5th percentile: it spans the tightening band. */
  preloadSpread: { p2_5: number; p97_5: number };
}

export const SWEEP_POINTS = 41;
export const UNCERTAINTY_SAMPLES = 2000;
// Fixed seed: the same plan always shows the same chance, so two views can be compared.
const SEED = 20261201;

/** The sweep runs from 40 % to 160 % of the plan's torque, stretched to show the ceiling (never past 5000 N·m). */
export function sweepRange(torqueNm: number, ceilingNm = Infinity): { fromNm: number; toNm: number } {
  const reach = Number.isFinite(ceilingNm) ? Math.min(ceilingNm * 1.15, torqueNm * 3) : 0;
  return { fromNm: torqueNm * 0.4, toNm: Math.min(5000, Math.max(torqueNm * 1.6, reach)) };
}

export function estimateView(input: PlanInput, wording: Wording = SI_WORDING): EstimateView {
  // one preparation for the evaluation, the sweep and the scatter run (the ceiling is kept on it)
  const p = prepare(input);
  const estimate = evaluatePrepared(p, undefined, wording);
  const torqueNm = estimate.tightening.torqueNm;
  const sweep = sweepPrepared(p, { ...sweepRange(torqueNm, estimate.ceiling.torqueNm), points: SWEEP_POINTS }, wording);
  const run = cachedUncertainty(input, () => p, { samples: UNCERTAINTY_SAMPLES, seed: SEED });
  return {
    torqueNm,
    estimate,
    sweep: sweep.points.map((pt) => ({
      torqueNm: pt.torqueNm,
      weakestMargin: pt.weakestMargin,
      weakestMarginNominal: pt.weakestMarginNominal,
      gainShare: pt.gainShare,
      studUtilizationMax: pt.studUtilizationMax,
      studWorkingUtilization: pt.studWorkingUtilization,
      bearingUtilizationMax: pt.bearingUtilizationMax,
      mostlySqueezing: pt.mostlySqueezing,
    })),
    ceiling: estimate.ceiling,
    headSqueezeOnsetNm: sweep.headSqueezeOnsetNm,
    targetMargin: input.targetMargin,
    probabilityMarginBelowOne: run.probabilityMarginBelowOne,
    probabilityStudOverLimit: run.probabilityStudOverLimit,
    weakestMarginBand: run.weakestMargin,
    preloadSpread: run.preloadSpread,
  };
}
