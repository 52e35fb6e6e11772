// A bare-loop reference of the evaluation's equations (the torque-dependent part: band, every bore cold,
// hot and fired, margins, the stud checks, the ceiling and the +10 % gain) on plain numbers and one
// scratch array, with nothing the product needs for display. The bench times evaluatePrepared against it
// and checks that both give identical numbers (referenceFigures / coreFigures).
import type { Prepared } from "../../app/lib/clamp/model";
import type { PlanEstimate } from "../../app/lib/clamp/evaluate";

const set = new Float64Array(8);
const pts = new Float64Array(16);
let lineN = 0;
let bodyN = 0;
let stopN = 0;

// the paths' force at closure x with the sets in `set` (elastic–perfectly-plastic)
function force(p: Prepared, x: number, which: 0 | 1 | 2): number {
  const els = p.paths.elements;
  let F = 0;
  if (which) {
    lineN = 0;
    bodyN = 0;
    stopN = 0;
  }
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    const d = x - e.engageMm - set[i];
    const kd = e.kNPerMm * d;
    const f = d <= 0 ? 0 : kd < e.limitN ? kd : e.limitN;
    F += f;
    if (which) {
      if (e.seal) lineN += f;
      else bodyN += f;
      if (e.kind === "stopper") stopN = f;
    }
  }
  return F;
}

function closure(p: Prepared, F: number): number {
  const els = p.paths.elements;
  let n = 0;
  let kFree = 0;
  for (let i = 0; i < els.length; i++) {
    const s = els[i].engageMm + set[i];
    pts[n++] = s;
    if (Number.isFinite(els[i].limitN)) pts[n++] = s + els[i].limitN / els[i].kNPerMm;
    else kFree += els[i].kNPerMm;
  }
  for (let i = 1; i < n; i++) {
    const x = pts[i];
    let j = i;
    while (j > 0 && pts[j - 1] > x) {
      pts[j] = pts[j - 1];
      j--;
    }
    pts[j] = x;
  }
  if (F <= 0) return pts[0];
  let px = pts[0];
  let pf = 0;
  for (let j = 1; j < n; j++) {
    const f = force(p, pts[j], 0);
    if (f >= F) return f > pf ? px + ((F - pf) * (pts[j] - px)) / (f - pf) : pts[j];
    px = pts[j];
    pf = f;
  }
  return px + (F - pf) / kFree;
}

function grow(p: Prepared, x: number): void {
  const els = p.paths.elements;
  for (let i = 0; i < els.length; i++)
    if (Number.isFinite(els[i].limitN)) set[i] = Math.max(set[i], x - els[i].engageMm - els[i].limitN / els[i].kNPerMm);
}

// one bore: assembly, hot and settled, fired; leaves the figures in `out` at offset o
function bore(p: Prepared, cold: number, hot: number, out: Float64Array, o: number): void {
  set.fill(0);
  const F0 = Math.max(0, cold);
  const c0 = closure(p, F0);
  grow(p, c0);
  force(p, c0, 1);
  out[o] = lineN;
  out[o + 1] = bodyN;
  out[o + 5] = stopN;
  const F1 = Math.max(0, hot);
  const c1 = closure(p, F1);
  if (F1 > F0) grow(p, c1);
  force(p, c1, 1);
  out[o + 6] = Math.max(out[o], lineN);
  out[o + 7] = stopN;
  const F2 = Math.max(0, hot - p.reliefPerBoreN);
  const c2 = closure(p, F2);
  if (F2 > F1) grow(p, c2);
  force(p, c2, 1);
  out[o + 2] = lineN;
  out[o + 3] = bodyN;
  out[o + 4] = Math.min(out[o] / p.requirement.seatingLoadN, lineN / p.requirement.operatingContactN);
}

const hotOf = (p: Prepared, F: number) => Math.max(0, F * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN);
const scratch = new Float64Array(8);
const clamps = new Float64Array(256);

// a capped path carries its limit to the last bit of rounding: within 1e-9 counts as reaching it
const reached = (u: number) => (u > 1 - 1e-9 && u < 1 ? 1 : u);

function crushed(p: Prepared, nominalN: number): boolean {
  const minN = (2 * nominalN) / (1 + p.tighteningFactor);
  const maxN = p.tighteningFactor * minN;
  const hot = hotOf(p, maxN);
  const stop = p.stopperIndex >= 0 ? p.paths.elements[p.stopperIndex].limitN : 0;
  for (let b = 0; b < p.cylinders; b++) {
    const w = p.boreStudWeight[b];
    bore(p, w * maxN, w * hot, scratch, 0);
    let u = p.requirement.maxLoadN !== null ? reached(scratch[6] / p.requirement.maxLoadN) : 0;
    if (stop) u = Math.max(u, reached(scratch[5] / stop), reached(scratch[7] / stop));
    if (u >= 1) return true;
  }
  return false;
}

/**
 * The reference figures: per bore [cold line, cold body, fired line (nominal), sealMarginNominal,
 * sealMargin (min of band), bodyMargin (min)], then weakest margin, stud assembly ratio, working
 * utilisation, ceiling torque and gain share.
 */
export function referenceFigures(p: Prepared, out: Float64Array): Float64Array {
  const t = p.plan.tightening.target;
  const F = t.mode === "torque" ? (t.torqueNm * 1000) / p.torquePerPreloadMm : t.preloadN;
  const minN = (2 * F) / (1 + p.tighteningFactor);
  const maxN = p.tighteningFactor * minN;
  const hot = hotOf(p, F);
  const hotMin = hotOf(p, minN);
  let weakest = Infinity;
  let weakBore = 0;
  // the nominal bore clamps stud by stud, Σ share·F (equal preload, so the same for cold and hot)
  clamps.fill(0, 0, 2 * p.cylinders);
  for (let s = 0; s < p.studCount; s++)
    for (let j = p.start[s]; j < p.start[s + 1]; j++) {
      clamps[p.boreOf[j]] += p.shareOf[j] * F;
      clamps[p.cylinders + p.boreOf[j]] += p.shareOf[j] * hot;
    }
  for (let b = 0; b < p.cylinders; b++) {
    const w = p.boreStudWeight[b];
    const o = b * 6;
    bore(p, clamps[b], clamps[p.cylinders + b], scratch, 0);
    out[o] = scratch[0];
    out[o + 1] = scratch[1];
    out[o + 2] = scratch[2];
    out[o + 3] = scratch[4];
    bore(p, w * minN, w * hotMin, scratch, 0);
    out[o + 4] = scratch[4];
    out[o + 5] = p.bodyRequirementN > 0 ? scratch[3] / p.bodyRequirementN : Infinity;
    if (scratch[4] < weakest) {
      weakest = scratch[4];
      weakBore = b;
    }
  }
  let k = p.cylinders * 6;
  const f = p.plan.fastener;
  out[k++] = weakest;
  out[k++] = 1 / ((p.stressPerN.equivalent * maxN) / f.yieldMpa);
  const extra = Math.max(0, p.thermalChangeN) + p.phi * p.peakFiringN;
  const ax = (maxN + Math.max(0, p.thermalChangeN) + p.phi * p.peakFiringN) / p.section.areaMm2;
  const tor = 0.5 * p.stressPerN.torsion * maxN;
  out[k++] = Math.sqrt(ax * ax + 3 * tor * tor) / f.yieldMpa;
  // the ceiling: the closed forms and the crush bisection, as torqueCeiling
  const mOverN = (2 * p.tighteningFactor) / (1 + p.tighteningFactor);
  const toT = (m: number) => Math.max(0, ((m / mOverN) * p.torquePerPreloadMm) / 1000);
  const studAssembly = toT((p.plan.model.studLimitFraction * f.yieldMpa) / p.stressPerN.equivalent);
  let ceiling = studAssembly;
  ceiling = Math.min(ceiling, toT(p.plan.head.limitingSurfacePressureMpa * p.bearingAreaMm2 - extra));
  const blk = p.plan.block;
  const shear = blk.shearStrengthMpa ?? (blk.yieldMpa !== undefined ? blk.yieldMpa / Math.sqrt(3) : null);
  if (shear !== null) {
    const perLength = Math.PI * f.diameterMm * (0.5 + (0.57735 * (f.diameterMm - p.thread.pitchDiameterMm)) / p.thread.pitchMm);
    ceiling = Math.min(ceiling, toT(shear * perLength * f.engagementMm - extra));
  }
  const a0 = p.section.areaMm2;
  const kt = 0.5 * p.stressPerN.torsion;
  const qa = 1 / (a0 * a0) + 3 * kt * kt;
  const qb = (2 * extra) / (a0 * a0);
  const qc = (extra * extra) / (a0 * a0) - f.yieldMpa * f.yieldMpa;
  ceiling = Math.min(ceiling, qc >= 0 ? 0 : toT((-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa)));
  if (p.requirement.maxLoadN !== null || p.stopperIndex >= 0) {
    let hi = Math.max(studAssembly, 1) * 4;
    let crush = Infinity;
    const at = (T: number) => crushed(p, (T * 1000) / p.torquePerPreloadMm);
    if (at(hi)) {
      let lo = 0;
      if (at(lo)) hi = 0;
      else
        for (let i = 0; i < 50; i++) {
          const mid = (lo + hi) / 2;
          if (at(mid)) hi = mid;
          else lo = mid;
        }
      crush = hi;
    }
    ceiling = Math.min(ceiling, crush);
  }
  out[k++] = ceiling;
  // +10 % torque on the weakest bore at the bottom of the band, hot and fired
  const w = p.boreStudWeight[weakBore];
  const gain = (Fn: number): [number, number] => {
    const m = (2 * Fn) / (1 + p.tighteningFactor);
    const h = w * hotOf(p, m);
    if (h - p.reliefPerBoreN < 0) return [w * m, h - p.reliefPerBoreN];
    bore(p, w * m, h, scratch, 0);
    return [w * m, scratch[2]];
  };
  // taken at the plan's torque: in preload mode, F through the torque and back
  const Ft = ((t.mode === "torque" ? t.torqueNm : (t.preloadN * p.torquePerPreloadMm) / 1000) * 1000) / p.torquePerPreloadMm;
  const [ca, la] = gain(Ft);
  const [cb, lb] = gain(Ft * 1.1);
  out[k++] = cb - ca > 0 ? Math.max(0, Math.min(1, (lb - la) / (cb - ca))) : 0;
  return out;
}

/** The same figures read off the product's evaluation. */
export function coreFigures(e: PlanEstimate, out: Float64Array): Float64Array {
  let k = 0;
  for (const c of e.cylinders) {
    out[k++] = c.sealLineN;
    out[k++] = c.bodyN;
    out[k++] = c.remainingSealLineHotSettledN;
    out[k++] = c.sealMarginNominal;
    out[k++] = c.sealMargin;
    out[k++] = c.bodyMargin;
  }
  out[k++] = e.weakestMargin;
  out[k++] = e.verdict.checks.find((c) => c.id === "stud-assembly")!.ratio;
  out[k++] = e.studStress.working.utilization;
  out[k++] = e.ceiling.torqueNm;
  out[k++] = e.gain.share;
  return out;
}
