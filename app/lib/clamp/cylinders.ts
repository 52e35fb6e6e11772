// Per-bore clamp and seal margin: studs to bores, then the two-spring seal under firing.
import type { Prepared } from "./model";
import { splitClamp, unloadSealLine, type SealSplit } from "./seal";

export interface BoreSeal {
  cold: SealSplit;
  /** Seal-line load left under firing with the cold clamp. */
  remainingColdN: number;
  hot: SealSplit;
  /** Seal-line load left under firing, hot and settled: the running case. */
  remainingHotN: number;
  seatingMargin: number;
  operatingMargin: number;
  /** min(seating, operating): the seal margin. */
  sealMargin: number;
}

/** Bore clamps from per-stud loads: F_bore = Σ share·F_stud. */
export function boreClamps(p: Prepared, studLoads: ArrayLike<number>, out: Float64Array): Float64Array {
  out.fill(0);
  for (let s = 0; s < p.studCount; s++) {
    const F = studLoads[s];
    // ours (DESIGN.md "Studs to bores"): each stud's load goes to its bores by share
    for (let j = p.start[s]; j < p.start[s + 1]; j++) out[p.boreOf[j]] += p.shareOf[j] * F;
  }
  return out;
}

function settle(cold: SealSplit, clampColdN: number, clampHotN: number, p: Prepared): SealSplit {
  // ours: a rising clamp keeps loading along the split; a falling one unloads elastically
  if (clampHotN >= clampColdN) return splitClamp(clampHotN, p.springs);
  const line = Math.max(0, unloadSealLine(cold, clampColdN - clampHotN, p.springs));
  const lineN = Math.min(line, clampHotN);
  return { lineN, bodyN: clampHotN - lineN, marginalShare: cold.marginalShare, lineYielded: cold.lineYielded };
}

export function boreSeal(p: Prepared, clampColdN: number, clampHotN: number): BoreSeal {
  const cold = splitClamp(clampColdN, p.springs);
  const relief = p.reliefPerBoreN;
  const remainingColdN = Math.max(0, unloadSealLine(cold, relief, p.springs));
  const hot = settle(cold, clampColdN, clampHotN, p);
  const remainingHotN = Math.max(0, unloadSealLine(hot, relief, p.springs));
  // ASME VIII-1 App. 2 (flange values, conservative criterion): seating ≥ Wm2, contact under pressure ≥ Hp
  const seatingMargin = cold.lineN / p.asme.seatingLoadN;
  const operatingMargin = remainingHotN / p.asme.operatingContactN;
  return {
    cold,
    remainingColdN,
    hot,
    remainingHotN,
    seatingMargin,
    operatingMargin,
    sealMargin: Math.min(seatingMargin, operatingMargin),
  };
}

/** Weakest seal margin over the bores for given per-bore cold and hot clamps (lean, no allocation). */
export function weakestMargin(p: Prepared, coldClamps: Float64Array, hotClamps: Float64Array): { margin: number; bore: number } {
  let margin = Infinity;
  let bore = 0;
  for (let b = 0; b < p.cylinders; b++) {
    const m = boreSeal(p, coldClamps[b], hotClamps[b]).sealMargin;
    if (m < margin) {
      margin = m;
      bore = b;
    }
  }
  return { margin, bore };
}
