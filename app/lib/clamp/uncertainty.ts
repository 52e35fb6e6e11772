// Friction is never known exactly: sample it, per stud, and see how often the weakest bore
// falls below a seal margin of 1.
import { boreClamps, weakestMargin } from "./cylinders";
import { hotSettledPreload, prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { torquePerPreloadMm } from "./torque";

/** mulberry32: a tiny deterministic 32-bit generator (public-domain construction). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviate by Box–Muller. */
export function normal(rand: () => number): number {
  const u = 1 - rand(); // (0, 1]
  const v = rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

export interface UncertaintyOptions {
  samples: number;
  seed: number;
  /** Coefficient of variation of each friction value (default 0.10). */
  frictionCv?: number;
}

export interface UncertaintyResult {
  samples: number;
  probabilityMarginBelowOne: number;
  /** Chance that a stud at its sampled preload passes the equivalent-stress limit. */
  probabilityStudOverLimit: number;
  weakestMargin: { p5: number; p50: number; p95: number };
}

export function uncertainty(input: PlanInput, options: UncertaintyOptions): UncertaintyResult {
  return uncertaintyPrepared(prepare(input), options);
}

/** Linear-interpolated percentile of a sorted array. */
function percentile(sorted: Float64Array, q: number): number {
  const x = q * (sorted.length - 1);
  const i = Math.floor(x);
  const j = Math.min(sorted.length - 1, i + 1);
  return sorted[i] + (sorted[j] - sorted[i]) * (x - i);
}

export function uncertaintyPrepared(p: Prepared, o: UncertaintyOptions): UncertaintyResult {
  const n = Math.max(1, Math.floor(o.samples));
  // capped at 0.3 so that a −3σ friction stays positive
  const cv = Math.min(0.3, Math.max(0, o.frictionCv ?? 0.1));
  const rand = mulberry32(o.seed);
  const target = p.plan.tightening.target;
  const g = p.torqueGeometry;
  const mu = p.friction;
  // ours: a preload-controlled method's band taken as ±2 standard deviations
  const bandHalf = (p.tighteningFactor - 1) / (p.tighteningFactor + 1);
  const studLoads = new Float64Array(p.studCount);
  const hotLoads = new Float64Array(p.studCount);
  const cold = new Float64Array(p.cylinders);
  const hot = new Float64Array(p.cylinders);
  const margins = new Float64Array(n);
  const limitPerN = p.studLimitMpa;
  let below = 0;
  let over = 0;
  for (let i = 0; i < n; i++) {
    let studOver = false;
    for (let s = 0; s < p.studCount; s++) {
      // ours: each friction value normal about its entered value, cut at ±3 standard deviations
      const muG = mu.thread * (1 + cv * clamp3(normal(rand)));
      let F: number;
      if (target.mode === "torque") {
        const muK = mu.bearing * (1 + cv * clamp3(normal(rand)));
        // ISO 16047 long form with the sampled friction
        F = (target.torqueNm * 1000) / torquePerPreloadMm(g, { thread: muG, bearing: muK });
      } else {
        F = target.preloadN * (1 + (bandHalf / 2) * clamp3(normal(rand)));
      }
      studLoads[s] = F;
      hotLoads[s] = hotSettledPreload(p, F);
      // VDI 2230: σred with this stud's thread friction (torsion scales with μG)
      if (equivalentPerN(p, muG) * F > limitPerN) studOver = true;
    }
    boreClamps(p, studLoads, cold);
    boreClamps(p, hotLoads, hot);
    const m = weakestMargin(p, cold, hot).margin;
    margins[i] = m;
    if (m < 1) below++;
    if (studOver) over++;
  }
  margins.sort();
  return {
    samples: n,
    probabilityMarginBelowOne: below / n,
    probabilityStudOverLimit: over / n,
    weakestMargin: { p5: percentile(margins, 0.05), p50: percentile(margins, 0.5), p95: percentile(margins, 0.95) },
  };
}

const clamp3 = (z: number) => (z > 3 ? 3 : z < -3 ? -3 : z);

/** σred per newton for another thread friction (the tension part is unchanged). */
function equivalentPerN(p: Prepared, muG: number): number {
  const { axial, torsion } = p.stressPerN;
  const t = p.thread;
  // VDI 2230: MG ∝ (P/(π·d2) + 1.155·μG); rescale the torsion from the entered μG
  const base = t.pitchMm / (Math.PI * t.pitchDiameterMm);
  const tau = (torsion * (base + 1.155 * muG)) / (base + 1.155 * p.friction.thread);
  return Math.sqrt(axial * axial + 3 * tau * tau);
}
