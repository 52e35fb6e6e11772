// The torque ceiling (the first limit torque reaches), what +10 % torque buys at the seal line, and
// whether more torque now mostly squeezes the head. Kept apart on purpose: a ceiling set by the stud
// says nothing about whether torque still helps the seal.
import { crushApplies, TORSION_RELIEF, weakestAtMin, workingState } from "./limits";
import { hotSettledPreload, preloadForTorque, torqueForPreloadNm, type Prepared } from "./model";
import { preloadBand } from "./torque";
import { SI_WORDING, type Wording } from "./wording";
import { boreCrush, boreFiredLine } from "./cylinders";

import { CEILING_WORDS, type CeilingCause } from "./ceiling-words";

export { CEILING_WORDS, type CeilingCause };

export interface Ceiling {
  torqueNm: number;
  cause: CeilingCause;
  /** Torque at every limit (Infinity where it never binds). */
  torques: Record<CeilingCause, number>;
  explanation: string;
}

export interface SealGain {
  /** Of the clamp +10 % torque adds on the weakest bore, the share still on its seal line hot and fired. */
  share: number;
  lineGainN: number;
  clampGainN: number;
  /** 0-based bore it was taken on (the weakest at the bottom of the band). */
  bore: number;
}

export interface HeadSqueeze {
  mostlySqueezing: boolean;
  reason: "line-at-limit" | "head-strain" | null;
  /** Mean compressive strain of the head's boss at the nominal preload (compression over thickness). */
  headStrain: number;
  headCompressionMm: number;
  strainLimit: number;
  /** The seal gained per +10 % torque it was judged on. */
  gain: SealGain;
}

const maxOverNominal = (p: Prepared) => (2 * p.tighteningFactor) / (1 + p.tighteningFactor);

/** Nominal preload whose band top equals Fmax. */
const nominalForMax = (p: Prepared, maxN: number) => maxN / maxOverNominal(p);

/** Smallest torque in [0, hi] at which `fails` turns true (monotone), or Infinity when it never does. */
function firstFailing(fails: (T: number) => boolean, hi: number): number {
  if (!fails(hi)) return Infinity;
  let lo = 0;
  if (fails(lo)) return 0;
  for (let i = 0; i < 50; i++) {
    const mid = (lo + hi) / 2;
    if (fails(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** Any bore crushed at the top of the band for this nominal preload (bandSeal's atMax, on scalars). */
function crushedAtMax(p: Prepared, nominalN: number): boolean {
  const band = preloadBand(nominalN, p.tighteningFactor);
  const hotMax = hotSettledPreload(p, band.maxN);
  for (let b = 0; b < p.cylinders; b++) {
    if (p.sameWeightAs[b] < b) continue;
    const w = p.boreStudWeight[b];
    if (boreCrush(p, w * band.maxN, w * hotMax) >= 1) return true;
  }
  return false;
}

/** The torque ceiling; with words false its explanation is "" (lists read only the torque and the cause). */
export function torqueCeiling(p: Prepared, w: Wording = SI_WORDING, words = true): Ceiling {
  // the ceiling's torques do not depend on the torque: once per prepared plan (the sentence per wording)
  const found = (p.memo.ceiling ??= ceilingFor(p));
  const torqueNm = found.torques[found.cause];
  const cause = found.cause;
  return {
    torqueNm,
    cause,
    torques: { ...found.torques },
    explanation: words ? ceilingSentence(p, cause, torqueNm, w) : "",
  };
}

function ceilingFor(p: Prepared): { torques: Record<CeilingCause, number>; cause: CeilingCause } {
  const f = p.plan.fastener;
  const fa = p.peakFiringN;
  const extra = Math.max(0, p.thermalChangeN) + p.phi * fa;
  const toT = (maxN: number) => Math.max(0, torqueForPreloadNm(p, nominalForMax(p, maxN)));
  // VDI 2230: σred(FMmax) = ν·Rp0.2
  const studAssembly = toT((p.plan.model.studLimitFraction * f.yieldMpa) / p.stressPerN.equivalent);
  // VDI 2230: (FMmax + heat + Φn·FA)/Ap = pG
  const bearing = toT(p.bearingCapacityN - extra);
  const work0 = workingState(p, 1);
  const strip = work0.stripCapacityN === null ? Infinity : toT(work0.stripCapacityN - extra);
  const hi = Math.max(studAssembly, 1) * 4;
  // VDI 2230 working state: ((Fmax + extra)/A0)² + 3·(kτ·τ₁·Fmax)² = Rp0.2², a quadratic in Fmax
  const a0 = p.section.areaMm2;
  const kt = TORSION_RELIEF * p.stressPerN.torsion;
  const qa = 1 / (a0 * a0) + 3 * kt * kt;
  const qb = (2 * extra) / (a0 * a0);
  const qc = (extra * extra) / (a0 * a0) - f.yieldMpa * f.yieldMpa;
  const studWorking = qc >= 0 ? 0 : toT((-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa));
  const crush = crushApplies(p) ? firstFailing((T) => crushedAtMax(p, preloadForTorque(p, T)), hi) : Infinity;
  const torques: Record<CeilingCause, number> = {
    "stud-assembly": studAssembly,
    "stud-working": studWorking,
    bearing,
    "thread-strip": strip,
    crush,
  };
  let cause: CeilingCause = "stud-assembly";
  for (const c of Object.keys(torques) as CeilingCause[]) if (torques[c] < torques[cause]) cause = c;
  return { torques, cause };
}

function ceilingSentence(p: Prepared, cause: CeilingCause, T: number, w: Wording): string {
  const at = `Past ${w.torque(T)}`;
  switch (cause) {
    case "stud-assembly":
      return `${at} the stud at the top of the scatter band passes ${Math.round(p.plan.model.studLimitFraction * 100)} % of its yield in equivalent stress while it is tightened.`;
    case "stud-working":
      return `${at} the stud at the top of the scatter band passes its yield hot and under firing.`;
    case "bearing":
      return `${at} the washer presses the head harder than its alloy's ${w.stress(p.plan.head.limitingSurfacePressureMpa)} limit hot and under firing: the washer sinks into the head.`;
    case "thread-strip":
      return `${at} the load at the top of the band could strip the thread in the block: more engagement or a thread insert.`;
    case "crush":
      return `${at} the seal line at the top of the band is pressed past what it takes without damage.`;
  }
}

/**
 * Seal gained per +10 % torque on the weakest bore, at the bottom of the band, hot and fired. The
 * evaluation passes the weakest bore it has already found (its band's), saving a pass over the bores.
 */
export function sealGainPer10(p: Prepared, torqueNm: number, weakestBore?: number): SealGain {
  const F = preloadForTorque(p, torqueNm);
  const bore = weakestBore ?? weakestAtMin(p, F).bore;
  const w = p.boreStudWeight[bore];
  const at = (Fn: number) => {
    const min = preloadBand(Fn, p.tighteningFactor).minN;
    const hot = w * hotSettledPreload(p, min);
    // ours: where firing lifts the gasket off, count how far it is from closing (negative), so torque that
    // shrinks the gap counts as gain and "squeezes the head" is never said of a joint that opens
    const left = hot - p.reliefPerBoreN;
    return { clamp: w * min, line: left < 0 ? left : boreFiredLine(p, w * min, hot).firedLineN };
  };
  const a = at(F);
  const b = at(F * 1.1);
  const clampGainN = b.clamp - a.clamp;
  const lineGainN = b.line - a.line;
  return { share: clampGainN > 0 ? Math.max(0, Math.min(1, lineGainN / clampGainN)) : 0, lineGainN, clampGainN, bore };
}

/**
 * "More torque now mostly squeezes the head" — true only when +10 % torque puts (almost) nothing more
 * on the seal line because the line is at its indentation or stopper limit, or when the head's own
 * compression at the boss passes the stated strain limit (an assumption: see the model options).
 */
export function headSqueeze(p: Prepared, torqueNm: number, gainAtTorque?: SealGain): HeadSqueeze {
  const F = preloadForTorque(p, torqueNm);
  // the caller may have it already (the evaluation reports both)
  const gain = gainAtTorque ?? sealGainPer10(p, torqueNm);
  const min = preloadBand(F, p.tighteningFactor).minN;
  const w = p.boreStudWeight[gain.bore];
  const lineAtLimit = boreFiredLine(p, w * min, w * hotSettledPreload(p, min)).lineAtLimit;
  // Shigley §8-5: the head layer's share of the member compression, δ = F·c_head
  const headCompressionMm = F * p.headComplianceMmPerN;
  const headStrain = headCompressionMm / p.plan.head.thicknessAtStudMm;
  const strainLimit = p.plan.model.headStrainLimit;
  const squeezedByLine = lineAtLimit && gain.share < p.plan.model.squeezeGainThreshold;
  const squeezedHead = headStrain > strainLimit;
  return {
    mostlySqueezing: squeezedByLine || squeezedHead,
    reason: squeezedByLine ? "line-at-limit" : squeezedHead ? "head-strain" : null,
    headStrain,
    headCompressionMm,
    strainLimit,
    gain,
  };
}

/** Lowest torque at which more torque mostly squeezes the head (scan, then bisect), or null below `upToNm`. */
export function headSqueezeOnset(p: Prepared, upToNm: number): number | null {
  const steps = 24;
  let prev = 0;
  for (let i = 1; i <= steps; i++) {
    const T = (upToNm * i) / steps;
    if (headSqueeze(p, T).mostlySqueezing) {
      let lo = prev;
      let hi = T;
      for (let k = 0; k < 20; k++) {
        const mid = (lo + hi) / 2;
        if (headSqueeze(p, mid).mostlySqueezing) hi = mid;
        else lo = mid;
      }
      return hi;
    }
    prev = T;
  }
  return null;
}
