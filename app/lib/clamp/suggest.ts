// Suggest: the smallest torque that gets the weakest bore to a target margin within the limits,
// or what has to change when no torque can.
import { boreSeal } from "./cylinders";
import { prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { CAUSE_WORDS, leastClampedBore, squeezePoint, type SqueezePoint } from "./squeeze";
import { SI_WORDING, type Wording } from "./wording";

export interface SuggestOptions {
  targetMargin: number;
  /** How figures read in the sentences (SI unless given). */
  wording?: Wording;
}

export interface Suggestion {
  reachable: boolean;
  /** Smallest torque reaching the target within the limits (null when none does). */
  torqueNm: number | null;
  limit: SqueezePoint;
  marginAtLimit: number;
  /** Sleeve protrusion that would reach the target (or lower the torque), with its torque. */
  protrusion: { protrusionMm: number; torqueNm: number } | null;
  /** What must change, in plain words with figures; empty when the plan already works. */
  changes: string[];
  summary: string;
}

/** Weakest seal margin at equal nominal torque on every stud. */
export function weakestMarginAtTorque(p: Prepared, torqueNm: number): number {
  const F = (torqueNm * 1000) / p.torquePerPreloadMm;
  return weakestMarginAtPreload(p, F);
}

function weakestMarginAtPreload(p: Prepared, F: number): number {
  const Fhs = Math.max(0, F * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN);
  let m = Infinity;
  for (let b = 0; b < p.cylinders; b++) {
    const w = p.boreStudWeight[b];
    m = Math.min(m, boreSeal(p, w * F, w * Fhs).sealMargin);
  }
  return m;
}

/** Smallest torque in [0, limit] whose weakest margin reaches the target, or null. */
function smallestTorque(p: Prepared, target: number, limitNm: number): number | null {
  if (weakestMarginAtTorque(p, limitNm) < target) return null;
  let lo = 0;
  let hi = limitNm;
  for (let i = 0; i < 50; i++) {
    const mid = (lo + hi) / 2;
    if (weakestMarginAtTorque(p, mid) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}


function withProtrusion(input: PlanInput, protrusionMm: number): PlanInput {
  return { ...input, sealing: { ...input.sealing, sleeveProtrusionMm: protrusionMm } };
}

/** Protrusion (current … current + 0.30 mm, 0.005 mm steps) that reaches the target at the lowest torque. */
function protrusionSearch(input: PlanInput, target: number): { protrusionMm: number; torqueNm: number } | null {
  // Only a sleeve can stand proud of the deck.
  if (input.sleeve.kind === "none") return null;
  const now = input.sealing.sleeveProtrusionMm;
  let best: { protrusionMm: number; torqueNm: number } | null = null;
  for (let i = 1; i <= 60; i++) {
    const g = Math.round((now + 0.005 * i) * 1000) / 1000;
    if (g > 1) break;
    const q = prepare(withProtrusion(input, g));
    const t = smallestTorque(q, target, squeezePoint(q).torqueNm);
    if (t !== null && (best === null || t < best.torqueNm * 0.995)) best = { protrusionMm: g, torqueNm: t };
  }
  return best;
}

export function suggest(input: PlanInput, options: SuggestOptions): Suggestion {
  const { torque: nm, force: kN, length: mm } = options.wording ?? SI_WORDING;
  const target = options.targetMargin;
  const p = prepare(input);
  const limit = squeezePoint(p, options.wording);
  const marginAtLimit = weakestMarginAtTorque(p, limit.torqueNm);
  const torqueNm = smallestTorque(p, target, limit.torqueNm);
  const found = protrusionSearch(input, target);
  if (torqueNm !== null) {
    const helps = found !== null && found.torqueNm < 0.9 * torqueNm ? found : null;
    return {
      reachable: true,
      torqueNm,
      limit,
      marginAtLimit,
      protrusion: helps,
      changes: [],
      summary:
        `${nm(torqueNm)} reaches a seal margin of ${target.toFixed(2)} on the weakest cylinder, below the squeeze point (${nm(limit.torqueNm)}, ${CAUSE_WORDS[limit.cause]}).` +
        (helps ? ` With ${mm(helps.protrusionMm)} sleeve protrusion it would take ${nm(helps.torqueNm)}.` : ""),
    };
  }
  const changes: string[] = [];
  // What the weakest bore would need, regardless of the stud
  const bore = leastClampedBore(p);
  const w = p.boreStudWeight[bore];
  const F = (limit.torqueNm * 1000) / p.torquePerPreloadMm;
  const share = p.contactShare;
  const seatingCap = p.springs.lineLimitN / p.asme.seatingLoadN;
  // ours: with unlimited clamp the body absorbs the firing relief first; the line keeps its limit less its share
  const bodyBuffer = p.springs.lineLimitN - share * p.reliefPerBoreN;
  const operatingCap = Math.max(0, bodyBuffer) / p.asme.operatingContactN;
  if (Math.min(seatingCap, operatingCap) < target) {
    changes.push(
      `No clamp is enough with this gasket: its seal line flows at ${kN(p.springs.lineLimitN)}, which gives at most a seal margin of ${Math.min(seatingCap, operatingCap).toFixed(2)} (seating needs ${kN(p.asme.seatingLoadN)}, firing needs ${kN(p.asme.operatingContactN)} left on the seal line). Choose a different gasket: a wider or harder ring, or a different seal diameter.`,
    );
  } else {
    let hi = w * F;
    const marginAtClamp = (clamp: number) => {
      const Fs = clamp / w;
      const Fhs = Math.max(0, Fs * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN);
      return boreSeal(p, clamp, w * Fhs).sealMargin;
    };
    for (let i = 0; i < 60 && marginAtClamp(hi) < target; i++) hi *= 1.5;
    let lo = 0;
    for (let i = 0; i < 50; i++) {
      const mid = (lo + hi) / 2;
      if (marginAtClamp(mid) >= target) hi = mid;
      else lo = mid;
    }
    const more = hi / (w * F) - 1;
    changes.push(
      `Cylinder ${bore + 1} needs ${kN(hi)} of clamp for a seal margin of ${target.toFixed(2)}; at the limit (${nm(limit.torqueNm)}, ${CAUSE_WORDS[limit.cause]}) its studs give ${kN(w * F)}. That is ${Math.round(more * 100)} % more stud load around that bore: more studs there, or larger studs that can carry more.`,
    );
  }
  if (found) {
    changes.push(
      `With ${mm(found.protrusionMm)} sleeve protrusion (now ${mm(input.sealing.sleeveProtrusionMm)}) ${nm(found.torqueNm)} would reach the target within the limits.`,
    );
  } else if (input.sleeve.kind !== "none") {
    changes.push(`More sleeve protrusion (up to ${mm(0.3)} more) does not reach the target by itself.`);
  }
  return {
    reachable: false,
    torqueNm: null,
    limit,
    marginAtLimit,
    protrusion: found,
    changes,
    summary: `No torque reaches a seal margin of ${target.toFixed(2)} before the limit: at ${nm(limit.torqueNm)} (${CAUSE_WORDS[limit.cause]}) the weakest cylinder has ${marginAtLimit.toFixed(2)}.`,
  };
}
