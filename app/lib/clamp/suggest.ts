// Suggest: the smallest torque that gets the weakest bore to the target margin (at the bottom of the
// scatter band, hot and fired) below the torque ceiling, or what has to change when no torque can.
import { CEILING_WORDS, torqueCeiling, type Ceiling } from "./ceiling";
import { bandSeal } from "./limits";
import { prepare, preloadForTorque, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import { remediesFor } from "./warnings";
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
  limit: Ceiling;
  marginAtLimit: number;
  /** Sleeve protrusion that would reach the target (or lower the torque), with its torque. */
  protrusion: { protrusionMm: number; torqueNm: number } | null;
  /** What must change, in plain words with figures; empty when the plan already works. */
  changes: string[];
  summary: string;
}

/** Weakest seal margin (bottom of the band, hot and fired) and worst body margin at a torque. */
function marginsAtTorque(p: Prepared, torqueNm: number): { seal: number; body: number } {
  const b = bandSeal(p, preloadForTorque(p, torqueNm));
  return { seal: b.atMin[b.weakestAtMin].sealMargin, body: b.atMin[b.worstBodyAtMin].bodyMargin };
}

function weakestMarginAtTorque(p: Prepared, torqueNm: number): number {
  return marginsAtTorque(p, torqueNm).seal;
}

const passes = (p: Prepared, T: number, target: number) => {
  const m = marginsAtTorque(p, T);
  return m.seal >= target && m.body >= 1;
};

/** Smallest torque in [0, limit] where both seals pass, or null. */
function smallestTorque(p: Prepared, target: number, limitNm: number): number | null {
  if (!Number.isFinite(limitNm) || !passes(p, limitNm, target)) return null;
  let lo = 0;
  let hi = limitNm;
  for (let i = 0; i < 50; i++) {
    const mid = (lo + hi) / 2;
    if (passes(p, mid, target)) hi = mid;
    else lo = mid;
  }
  return hi;
}

function withProtrusion(input: PlanInput, protrusionMm: number): PlanInput {
  return { ...input, sealing: { ...input.sealing, sleeveProtrusionMm: protrusionMm } };
}

/** Protrusion (current … current + 0.30 mm, 0.01 mm steps) that reaches the target at the lowest torque. */
function protrusionSearch(input: PlanInput, target: number): { protrusionMm: number; torqueNm: number } | null {
  // Only a sleeve can stand proud of the deck.
  if (input.sleeve.kind === "none") return null;
  const now = input.sealing.sleeveProtrusionMm;
  let best: { protrusionMm: number; torqueNm: number } | null = null;
  for (let i = 1; i <= 30; i++) {
    const g = Math.round((now + 0.01 * i) * 1000) / 1000;
    if (g > 1) break;
    const q = prepare(withProtrusion(input, g));
    const t = smallestTorque(q, target, torqueCeiling(q).torqueNm);
    if (t !== null && (best === null || t < best.torqueNm * 0.995)) best = { protrusionMm: g, torqueNm: t };
  }
  return best;
}

export function suggest(input: PlanInput, options: SuggestOptions): Suggestion {
  const wording = options.wording ?? SI_WORDING;
  const { torque: nm, length: mm } = wording;
  const target = options.targetMargin;
  const p = prepare(input);
  const limit = torqueCeiling(p, wording);
  const marginAtLimit = Number.isFinite(limit.torqueNm) ? weakestMarginAtTorque(p, limit.torqueNm) : NaN;
  const torqueNm = smallestTorque(p, target, limit.torqueNm);
  const found = protrusionSearch(input, target);
  const ceilingWords = `${nm(limit.torqueNm)}, ${CEILING_WORDS[limit.cause]}`;
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
        `${nm(torqueNm)} gives a seal margin of ${target.toFixed(2)} on the weakest cylinder at the bottom of the scatter band, below the torque ceiling (${ceilingWords}).` +
        (helps ? ` With ${mm(helps.protrusionMm)} sleeve protrusion it would take ${nm(helps.torqueNm)}.` : ""),
    };
  }
  const changes: string[] = [];
  const atLimit = marginsAtTorque(p, limit.torqueNm);
  if (atLimit.body < 1) {
    changes.push(
      `The gasket body does not keep enough clamp to seal coolant and oil. Try ${remediesFor("body-seal", input).join("; or ")}.`,
    );
  }
  // the ceiling's own remedies first: they raise the torque the plan may use
  changes.push(
    `The ceiling is set by the ${CEILING_WORDS[limit.cause]}: ${limit.explanation} To raise it: ${remediesFor(limit.cause, input).join("; or ")}.`,
  );
  if (atLimit.seal < target) {
    changes.push(
      `At the ceiling the weakest seal margin is ${atLimit.seal.toFixed(2)}. For more seal: ${remediesFor("seal", input).slice(1).join("; or ")}.`,
    );
  }
  if (found) {
    changes.push(
      `With ${mm(found.protrusionMm)} sleeve protrusion (now ${mm(input.sealing.sleeveProtrusionMm)}) ${nm(found.torqueNm)} would reach the target below the ceiling.`,
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
    summary: `No torque reaches a seal margin of ${target.toFixed(2)} below the ceiling: at ${ceilingWords} the weakest cylinder has ${marginAtLimit.toFixed(2)}.`,
  };
}
