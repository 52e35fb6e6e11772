// The estimate over a torque range, for charts: margins at the bottom of the band and nominal, the
// stud and washer limits at the top, and what +10 % torque buys at the seal line.
import { headSqueeze, headSqueezeOnset, torqueCeiling, type Ceiling } from "./ceiling";
import { weakestAtMin, workingState } from "./limits";
import { preloadBand } from "./torque";
import { hotSettledPreload, prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { boreSealMargin } from "./cylinders";
import { SI_WORDING, type Wording } from "./wording";

export interface SweepPoint {
  torqueNm: number;
  preloadMinN: number;
  preloadN: number;
  preloadMaxN: number;
  /** Weakest seal margin at the bottom of the band, hot and fired (the verdict's basis). */
  weakestMargin: number;
  weakestCylinder: number;
  /** The same at the nominal preload. */
  weakestMarginNominal: number;
  /** σred/yield at the top of the band while tightened. */
  studUtilizationMax: number;
  /** σred,B/yield hot and fired at the top of the band. */
  studWorkingUtilization: number;
  bearingUtilizationMax: number;
  /** Share of the clamp +10 % torque adds that stays on the weakest seal line under firing. */
  gainShare: number;
  headStrain: number;
  mostlySqueezing: boolean;
}

export interface SweepResult {
  points: SweepPoint[];
  ceiling: Ceiling;
  /** Lowest torque where more torque mostly squeezes the head, if within twice the range's end. */
  headSqueezeOnsetNm: number | null;
}

export interface SweepOptions {
  fromNm: number;
  toNm: number;
  points: number;
}

export function torqueSweep(input: PlanInput, options: SweepOptions, wording: Wording = SI_WORDING): SweepResult {
  return sweepPrepared(prepare(input), options, wording);
}

export function sweepPrepared(p: Prepared, o: SweepOptions, wording: Wording = SI_WORDING): SweepResult {
  const n = Math.max(2, Math.floor(o.points));
  const from = Math.max(0, o.fromNm);
  const to = Math.max(from, o.toNm);
  const points: SweepPoint[] = [];
  for (let i = 0; i < n; i++) {
    const T = from + ((to - from) * i) / (n - 1);
    // ISO 16047 long form solved for F
    const F = (T * 1000) / p.torquePerPreloadMm;
    const band = preloadBand(F, p.tighteningFactor);
    const weak = weakestAtMin(p, F);
    const work = workingState(p, band.maxN);
    let nominal = Infinity;
    const Fhs = hotSettledPreload(p, F);
    for (let b = 0; b < p.cylinders; b++) {
      if (p.sameWeightAs[b] < b) continue;
      const w = p.boreStudWeight[b];
      nominal = Math.min(nominal, boreSealMargin(p, w * F, w * Fhs));
    }
    const sq = headSqueeze(p, T);
    points.push({
      torqueNm: T,
      preloadMinN: band.minN,
      preloadN: F,
      preloadMaxN: band.maxN,
      weakestMargin: weak.margin,
      weakestCylinder: weak.bore + 1,
      weakestMarginNominal: nominal,
      studUtilizationMax: (p.stressPerN.equivalent * band.maxN) / p.plan.fastener.yieldMpa,
      studWorkingUtilization: work.utilization,
      bearingUtilizationMax: work.studLoadN / p.bearingCapacityN,
      gainShare: sq.gain.share,
      headStrain: sq.headStrain,
      mostlySqueezing: sq.mostlySqueezing,
    });
  }
  return { points, ceiling: torqueCeiling(p, wording), headSqueezeOnsetNm: headSqueezeOnset(p, Math.max(to, 1) * 2) };
}
