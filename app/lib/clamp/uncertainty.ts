// Tightening is never exact: sample each stud's preload from the method's scatter band (and the
// friction that goes with it), and see how often the weakest bore falls below a seal margin of 1 or a
// stud passes its limit.
import { scatterBore, scatterSealMargin } from "./scatter-bore";
import { workingState } from "./limits";
import { prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { PLASTIC_TORSION_FACTOR } from "./torque";

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

/**
 * Fills `out` with standard normal deviates, both values of each Box–Muller pair (Box & Muller 1958:
 * r·cos θ and r·sin θ are independent standard normals), half the logarithms and draws of `normal`.
 */
export function fillNormals(rand: () => number, out: Float64Array): Float64Array {
  for (let i = 0; i < out.length; i += 2) {
    const u = 1 - rand(); // (0, 1]
    const theta = 2 * Math.PI * rand();
    const r = Math.sqrt(-2 * Math.log(u));
    out[i] = r * Math.cos(theta);
    if (i + 1 < out.length) out[i + 1] = r * Math.sin(theta);
  }
  return out;
}

/**
 * Fills `out` with standard normal deviates by Marsaglia's polar method (Marsaglia & Bray 1964): a point
 * (u, v) uniform in the unit disc gives u·√(−2·ln s / s) and v·√(−2·ln s / s), two independent standard
 * normals, with one logarithm and one square root and no sine or cosine (about 1.27 draws per pair).
 */
export function fillNormalsPolar(rand: () => number, out: Float64Array): Float64Array {
  for (let i = 0; i < out.length; i += 2) {
    let u = 0;
    let v = 0;
    let q = 0;
    do {
      u = 2 * rand() - 1;
      v = 2 * rand() - 1;
      q = u * u + v * v;
    } while (q >= 1 || q === 0);
    const r = Math.sqrt((-2 * Math.log(q)) / q);
    out[i] = u * r;
    if (i + 1 < out.length) out[i + 1] = v * r;
  }
  return out;
}

/**
 * fillNormalsPolar on mulberry32 with the generator inline and its state in `state[0]` (what
 * mulberry32(seed) starts from is seed >>> 0): the same deviates to the last bit, a third of the time
 * (no call through a closure per draw).
 */
export function fillNormalsPolarInline(state: Uint32Array, out: Float64Array): void {
  let a = state[0];
  for (let i = 0; i < out.length; i += 2) {
    let u = 0;
    let v = 0;
    let q = 0;
    do {
      a = (a + 0x6d2b79f5) >>> 0;
      let t = a;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      u = 2 * (((t ^ (t >>> 14)) >>> 0) / 4294967296) - 1;
      a = (a + 0x6d2b79f5) >>> 0;
      t = a;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      v = 2 * (((t ^ (t >>> 14)) >>> 0) / 4294967296) - 1;
      q = u * u + v * v;
    } while (q >= 1 || q === 0);
    const r = Math.sqrt((-2 * Math.log(q)) / q);
    out[i] = u * r;
    if (i + 1 < out.length) out[i + 1] = v * r;
  }
  state[0] = a;
}

export interface UncertaintyOptions {
  samples: number;
  seed: number;
  /** Coefficient of variation of thread friction where it varies on its own (stretch-measured plans). */
  frictionCv?: number;
}

export interface UncertaintyResult {
  samples: number;
  probabilityMarginBelowOne: number;
  /** Chance that some stud passes its tightening limit (ν·Rp0.2) or yields hot and fired. */
  probabilityStudOverLimit: number;
  weakestMargin: { p5: number; p50: number; p95: number };
  /** Sampled stud preloads over the nominal: 2.5th and 97.5th percentiles (the band is ±2σ). */
  preloadSpread: { p2_5: number; p97_5: number };
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

/**
 * Moves a's k-th smallest value to a[k], the smaller ones before it and the larger after, between lo
 * and hi (Hoare's selection, FIND, CACM 1961): the percentiles without sorting every sample. No NaN.
 */
function selectKth(a: Float64Array, k: number, lo = 0, hi = a.length - 1): void {
  while (hi > lo) {
    const pivot = a[(lo + hi) >>> 1];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

/**
 * percentile() of the sorted values, found by selection: the same two order statistics it reads, so
 * the same figure. The quantiles in rising order; `a` is reordered. A NaN anywhere: sorted instead.
 */
export function percentiles(a: Float64Array, qs: number[]): number[] {
  for (let i = 0; i < a.length; i++) {
    if (a[i] !== a[i]) {
      a.sort();
      return qs.map((q) => percentile(a, q));
    }
  }
  const out: number[] = [];
  let lo = 0;
  for (const q of qs) {
    const x = q * (a.length - 1);
    const i = Math.floor(x);
    const j = Math.min(a.length - 1, i + 1);
    selectKth(a, i, lo);
    // the next larger value: the smallest of those after a[i]
    let next = a[i];
    if (j > i) {
      next = a[j];
      for (let m = j + 1; m < a.length; m++) if (a[m] < next) next = a[m];
    }
    out.push(a[i] + (next - a[i]) * (x - i));
    lo = i;
  }
  return out;
}

const clamp3 = (z: number) => (z > 3 ? 3 : z < -3 ? -3 : z);

export function uncertaintyPrepared(p: Prepared, o: UncertaintyOptions): UncertaintyResult {
  const n = Math.max(1, Math.floor(o.samples));
  // mulberry32(o.seed)'s state, drawn from inline (fillNormalsPolarInline)
  const rng = Uint32Array.of(o.seed >>> 0);
  const target = p.plan.tightening.target;
  const g = p.torqueGeometry;
  const F0 = target.mode === "torque" ? (target.torqueNm * 1000) / p.torquePerPreloadMm : target.preloadN;
  // VDI 2230: the band F·(1 ± (αA − 1)/(αA + 1)); ours: the band taken as ±2 standard deviations
  const sigma = (p.tighteningFactor - 1) / (p.tighteningFactor + 1) / 2;
  const cv = Math.min(0.3, Math.max(0, o.frictionCv ?? 0.1));
  const torqueControlled = p.plan.tightening.method !== "stretch-measured" && target.mode === "torque";
  // ISO 16047 bracket split into the pitch part and the friction part (which scales with μ)
  const pitchPart = g.pitchMm / (2 * Math.PI);
  const frictionPart = p.torquePerPreloadMm - pitchPart;
  const cold = new Float64Array(p.cylinders);
  const hot = new Float64Array(p.cylinders);
  const bore = scatterBore(p);
  const { start, boreOf, shareOf, studCount, cylinders } = p;
  const embedMinusThermal = p.embeddingLossN - p.thermalChangeN;
  const margins = new Float64Array(n);
  const spread = new Float64Array(n);
  const limitAssembly = p.studLimitMpa;
  const { axial, torsion } = p.stressPerN;
  const base = p.thread.pitchMm / (Math.PI * p.thread.pitchDiameterMm);
  // the stud preload at which the working state reaches yield (rises with preload: bisection once)
  let lo = 0;
  let hi = F0 * 4;
  if (workingState(p, hi).utilization < 1) lo = hi;
  else
    for (let i = 0; i < 50; i++) {
      const mid = (lo + hi) / 2;
      if (workingState(p, mid).utilization >= 1) hi = mid;
      else lo = mid;
    }
  const workingLimitN = lo === hi ? Infinity : hi;
  let below = 0;
  let over = 0;
  // the deviates of one sample: one per stud, and one more per stud where friction varies on its own
  const z = new Float64Array(torqueControlled ? p.studCount : 2 * p.studCount);
  // constant factors of the stud check, hoisted: σred per newton = √(σ² + 3·(kp·τ(μG))²)
  const tauPerScale = (torsion * 1.155 * p.friction.thread) / (base + 1.155 * p.friction.thread);
  const tauBase = (torsion * base) / (base + 1.155 * p.friction.thread);
  const axial2 = axial * axial;
  const limit2 = limitAssembly * limitAssembly;
  const hotFactor = 1 - p.relaxationFraction;
  const torqueF0 = p.torquePerPreloadMm * F0;
  // Torque-controlled, a stud's friction follows from its preload, so its check σred·F is a function of F
  // alone, and a convex one: the squared stress (σ² + 3·τ²)·F² with τ·F linear in F (and, where the friction
  // floor of 0.05 holds, τ constant), the larger of two convex quadratics. Its largest value over a
  // sample's studs is at the smallest or the largest preload, so only those two are checked.
  const studOverLimit = (F: number, zFriction: number): boolean => {
    // the friction that gives this preload at this torque (torque-controlled), else friction on its own
    const scale = torqueControlled ? Math.max(0.05, (torqueF0 / F - pitchPart) / frictionPart) : 1 + cv * clamp3(zFriction);
    // VDI 2230: MG ∝ (P/(π·d2) + 1.155·μG); the torsion rescaled from the entered μG (μG = μ·scale)
    const tau = tauBase + tauPerScale * scale;
    // VDI 2230 FMzul (von Mises, torsion on π·d0³/12): σred = √(σ² + 3·(¾τ)²) per newton, times this preload
    const tp = PLASTIC_TORSION_FACTOR * tau;
    // σred·F > limit, squared (both sides positive): no square root per stud
    return (axial2 + 3 * tp * tp) * F * F > limit2;
  };
  const loF = F0 * (1 - 3 * sigma);
  const hiF = F0 * (1 + 3 * sigma);
  for (let i = 0; i < n; i++) {
    let studOver = false;
    let maxF = 0;
    let minF = Infinity;
    fillNormalsPolarInline(rng, z);
    cold.fill(0);
    hot.fill(0);
    for (let s = 0; s < studCount; s++) {
      const zs = z[s];
      const F = zs >= 3 ? hiF : zs <= -3 ? loF : F0 * (1 + sigma * zs);
      // friction on its own: each stud's own check (once one stud is over, the sample counts)
      if (!torqueControlled && !studOver && studOverLimit(F, z[studCount + s])) studOver = true;
      // as hotSettledPreload: VDI 2230 F_running = F_M − F_Z − relaxation + ΔF_thermal
      const Fh = F * hotFactor - embedMinusThermal;
      const hotF = Fh > 0 ? Fh : 0;
      // ours (DESIGN.md "Studs to bores"): each stud's load goes to its bores by share
      for (let j = start[s]; j < start[s + 1]; j++) {
        const b = boreOf[j];
        const share = shareOf[j];
        cold[b] += share * F;
        hot[b] += share * hotF;
      }
      if (F > maxF) maxF = F;
      if (F < minF) minF = F;
    }
    const z0 = z[0];
    spread[i] = (z0 >= 3 ? hiF : z0 <= -3 ? loF : F0 * (1 + sigma * z0)) / F0;
    if (torqueControlled && (studOverLimit(minF, 0) || studOverLimit(maxF, 0))) studOver = true;
    if (maxF > workingLimitN) studOver = true;
    let m = Infinity;
    for (let b = 0; b < cylinders; b++) {
      const mb = scatterSealMargin(bore, cold[b], hot[b]);
      if (mb < m) m = mb;
    }
    margins[i] = m;
    if (m < 1) below++;
    if (studOver) over++;
  }
  const [p5, p50, p95] = percentiles(margins, [0.05, 0.5, 0.95]);
  const [p2_5, p97_5] = percentiles(spread, [0.025, 0.975]);
  return {
    samples: n,
    probabilityMarginBelowOne: below / n,
    probabilityStudOverLimit: over / n,
    weakestMargin: { p5, p50, p95 },
    preloadSpread: { p2_5, p97_5 },
  };
}
