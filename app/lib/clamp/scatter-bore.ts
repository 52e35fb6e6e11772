// The scatter run's bore solve in closed form. leanBore (seal.ts) finds each closure by sorting the
// paths' breakpoints and summing every path at each one; here the loading curve from a fresh bore is
// tabulated once per prepared plan (it does not depend on the clamp), and the unloading branches are
// straight sums of springs, so one bore costs a few passes over its handful of paths.
//
// The same elastic–perfectly-plastic paths as seal.ts (ours, DESIGN.md "Seal paths"):
// - loading a fresh bore is path-independent: path i carries min(kᵢ·(x − eᵢ), Lᵢ) past engagement, whatever
//   the clamp went through on the way up (a path that has flowed stays at its limit while loading goes on);
// - unloading from a closure c keeps the sets: path i carries kᵢ·(x − aᵢ) past aᵢ = eᵢ + setᵢ, where
//   setᵢ = c − eᵢ − Lᵢ/kᵢ for a path that flowed (it leaves its limit the moment unloading starts) and 0 else.
// The figures agree with leanBore's to rounding (tests/unit/lib/clamp/scatter-bore.test.ts), not to the
// last bit: the scatter run is a statistic of samples, and the sweep and the evaluation keep leanBore.
import type { Prepared } from "./model";

export interface ScatterBore {
  n: number;
  k: Float64Array;
  engage: Float64Array;
  limit: Float64Array;
  /** 1 for a seal path (ring, bead, stopper). */
  seal: Uint8Array;
  /** The fresh loading curve: closures and the bore load there, rising; past the last, slope kFree. */
  curveX: Float64Array;
  curveF: Float64Array;
  kFree: number;
  seatingN: number;
  operatingN: number;
  reliefN: number;
}

/** The tabulated bore of a prepared plan (once per plan, kept on it). */
export function scatterBore(p: Prepared): ScatterBore {
  const memo = p.memo as { scatterBore?: ScatterBore };
  if (memo.scatterBore) return memo.scatterBore;
  const els = p.paths.elements;
  const n = els.length;
  const k = new Float64Array(n);
  const engage = new Float64Array(n);
  const limit = new Float64Array(n);
  const seal = new Uint8Array(n);
  let kFree = 0;
  const xs: number[] = [];
  for (let i = 0; i < n; i++) {
    k[i] = els[i].kNPerMm;
    engage[i] = els[i].engageMm;
    limit[i] = els[i].limitN;
    seal[i] = els[i].seal ? 1 : 0;
    xs.push(engage[i]);
    if (Number.isFinite(limit[i])) xs.push(engage[i] + limit[i] / k[i]);
    else kFree += k[i];
  }
  xs.sort((a, b) => a - b);
  const curveF = new Float64Array(xs.length);
  for (let j = 0; j < xs.length; j++) curveF[j] = freshLoad(k, engage, limit, xs[j]);
  const out: ScatterBore = {
    n,
    k,
    engage,
    limit,
    seal,
    curveX: Float64Array.from(xs),
    curveF,
    kFree,
    seatingN: p.requirement.seatingLoadN,
    operatingN: p.requirement.operatingContactN,
    reliefN: p.reliefPerBoreN,
  };
  memo.scatterBore = out;
  return out;
}

function freshLoad(k: Float64Array, engage: Float64Array, limit: Float64Array, x: number): number {
  let F = 0;
  for (let i = 0; i < k.length; i++) {
    const d = x - engage[i];
    if (d <= 0) continue;
    const f = k[i] * d;
    F += f < limit[i] ? f : limit[i];
  }
  return F;
}

/** The closure at which a fresh bore carries F (F ≥ 0), on the tabulated curve. */
function freshClosure(b: ScatterBore, F: number): number {
  const X = b.curveX;
  const C = b.curveF;
  if (F <= 0) return X[0];
  for (let j = 1; j < X.length; j++) {
    if (C[j] >= F) return C[j] > C[j - 1] ? X[j - 1] + ((F - C[j - 1]) * (X[j] - X[j - 1])) / (C[j] - C[j - 1]) : X[j];
  }
  const last = X.length - 1;
  return X[last] + (F - C[last]) / b.kFree;
}

// the unloading branch from a closure: each path's start aᵢ, sorted with its stiffness (the core is synchronous)
const starts = new Float64Array(16);
const order = new Int32Array(16);

/** Fills `starts` with the unloading branch's path starts from closure c on the fresh curve. */
function unloadingFrom(b: ScatterBore, c: number): void {
  for (let i = 0; i < b.n; i++) {
    const flowed = b.k[i] * (c - b.engage[i]) >= b.limit[i];
    starts[i] = flowed ? c - b.limit[i] / b.k[i] : b.engage[i];
    // insertion by start
    let j = i;
    while (j > 0 && starts[order[j - 1]] > starts[i]) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
}

/** The closure at which the unloading branch in `starts` carries F (0 ≤ F ≤ the load it started from). */
function unloadClosure(b: ScatterBore, F: number): number {
  let x = starts[order[0]];
  if (F <= 0) return x;
  let K = 0;
  let load = 0;
  for (let j = 0; j < b.n; j++) {
    const i = order[j];
    const a = starts[i];
    const at = load + K * (a - x);
    if (at >= F && K > 0) return x + (F - load) / K;
    load = at;
    x = a;
    K += b.k[i];
  }
  return x + (F - load) / K;
}

/** The seal-line load on the unloading branch at closure x. */
function unloadLine(b: ScatterBore, x: number): number {
  let line = 0;
  for (let i = 0; i < b.n; i++) if (b.seal[i] && x > starts[i]) line += b.k[i] * (x - starts[i]);
  return line;
}

/** The seal-line load on the fresh curve at closure x. */
function freshLine(b: ScatterBore, x: number): number {
  let line = 0;
  for (let i = 0; i < b.n; i++) {
    if (!b.seal[i]) continue;
    const d = x - b.engage[i];
    if (d <= 0) continue;
    const f = b.k[i] * d;
    line += f < b.limit[i] ? f : b.limit[i];
  }
  return line;
}

/**
 * The seal margin of one bore (boreSealMargin's figure: min of seating cold and contact hot and fired)
 * for a cold and a hot clamp, from the tabulated curve.
 */
export function scatterSealMargin(b: ScatterBore, clampColdN: number, clampHotN: number): number {
  const F0 = clampColdN > 0 ? clampColdN : 0;
  const F1 = clampHotN > 0 ? clampHotN : 0;
  const F2 = clampHotN - b.reliefN > 0 ? clampHotN - b.reliefN : 0;
  const c0 = freshClosure(b, F0);
  const coldLine = freshLine(b, c0);
  // the highest point reached sets the sets: the cold closure, or the hot one where heat adds clamp
  const top = F1 > F0 ? freshClosure(b, F1) : c0;
  let firedLine: number;
  if (F2 >= (F1 > F0 ? F1 : F0)) firedLine = freshLine(b, freshClosure(b, F2));
  else {
    unloadingFrom(b, top);
    firedLine = unloadLine(b, unloadClosure(b, F2));
  }
  const seating = coldLine / b.seatingN;
  const operating = firedLine / b.operatingN;
  return seating < operating ? seating : operating;
}
