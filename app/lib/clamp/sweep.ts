// The estimate over a torque range, for charts.
import { boreClamps, boreSeal } from "./cylinders";
import { hotSettledPreload, prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { squeezePoint, type SqueezePoint } from "./squeeze";
import { preloadBand } from "./torque";

export interface SweepPoint {
  torqueNm: number;
  preloadMinN: number;
  preloadN: number;
  preloadMaxN: number;
  /** σred/yield at the top of the band. */
  studUtilizationMax: number;
  bearingPressureMaxMpa: number;
  headCompressionMm: number;
  /** Per cylinder, same order as the plan. */
  clampN: number[];
  sealLineN: number[];
  remainingSealLineN: number[];
  sealMargin: number[];
  weakestCylinder: number;
  weakestMargin: number;
  marginalShareWeakest: number;
}

export interface SweepResult {
  points: SweepPoint[];
  /** First limit in the range, or null when none is reached by toNm. */
  squeezePoint: SqueezePoint | null;
  /** The share threshold used (documented default 0.5). */
  shareThreshold: number;
}

export interface SweepOptions {
  fromNm: number;
  toNm: number;
  points: number;
}

export function torqueSweep(input: PlanInput, options: SweepOptions): SweepResult {
  return sweepPrepared(prepare(input), options);
}

export function sweepPrepared(p: Prepared, o: SweepOptions): SweepResult {
  const n = Math.max(2, Math.floor(o.points));
  const from = Math.max(0, o.fromNm);
  const to = Math.max(from, o.toNm);
  const studLoads = new Float64Array(p.studCount);
  const hotLoads = new Float64Array(p.studCount);
  const cold = new Float64Array(p.cylinders);
  const hot = new Float64Array(p.cylinders);
  const points: SweepPoint[] = [];
  for (let i = 0; i < n; i++) {
    const T = from + ((to - from) * i) / (n - 1);
    // ISO 16047 long form solved for F
    const F = (T * 1000) / p.torquePerPreloadMm;
    const band = preloadBand(F, p.tighteningFactor);
    studLoads.fill(F);
    hotLoads.fill(hotSettledPreload(p, F));
    boreClamps(p, studLoads, cold);
    boreClamps(p, hotLoads, hot);
    const clampN: number[] = new Array(p.cylinders);
    const sealLineN: number[] = new Array(p.cylinders);
    const remaining: number[] = new Array(p.cylinders);
    const margin: number[] = new Array(p.cylinders);
    let wb = 0;
    let share = 1;
    for (let b = 0; b < p.cylinders; b++) {
      const s = boreSeal(p, cold[b], hot[b]);
      clampN[b] = cold[b];
      sealLineN[b] = s.cold.lineN;
      remaining[b] = s.remainingHotN;
      margin[b] = s.sealMargin;
      if (b === 0 || s.sealMargin < margin[wb]) {
        wb = b;
        share = s.cold.marginalShare;
      }
    }
    points.push({
      torqueNm: T,
      preloadMinN: band.minN,
      preloadN: F,
      preloadMaxN: band.maxN,
      studUtilizationMax: (p.stressPerN.equivalent * band.maxN) / p.plan.fastener.yieldMpa,
      bearingPressureMaxMpa: band.maxN / p.bearingAreaMm2,
      headCompressionMm: F * p.headComplianceMmPerN,
      clampN,
      sealLineN,
      remainingSealLineN: remaining,
      sealMargin: margin,
      weakestCylinder: wb + 1,
      weakestMargin: margin[wb],
      marginalShareWeakest: share,
    });
  }
  const sq = squeezePoint(p);
  return { points, squeezePoint: sq.torqueNm <= to ? sq : null, shareThreshold: p.plan.model.shareThreshold };
}
