// Per-bore clamp and seal: studs to bores, then the bore's paths through assembly, heat and firing.
import type { Prepared } from "./model";
import { elementForce, leanBore, leanBoreRecord, loadBore, moveBore, type BoreState } from "./seal";

export interface BoreSeal {
  cold: BoreState;
  hot: BoreState;
  /** Hot, settled and fired: the running case. */
  fired: BoreState;
  /** Seal-line load left under firing, hot and settled. */
  remainingHotN: number;
  /** How far firing lifts the head off the seal line, hot. */
  liftMm: number;
  /** MLS: bead compression left under firing (hot closure less the lift, past first contact); null without a bead. */
  beadReserveMm: number | null;
  seatingMargin: number;
  operatingMargin: number;
  /** min(seating, operating): the combustion seal margin. */
  sealMargin: number;
  /** Body load left hot and fired over what seals coolant and oil. */
  bodyMargin: number;
  /** Largest seal-line load over its damage limit (EN 13555 QSmax, or the MLS stopper's), 0 when none applies. */
  crushUtilization: number;
}

/** Bore clamps from per-stud loads: F_bore = Σ share·F_stud. */
export function boreClamps(p: Prepared, studLoads: ArrayLike<number>, out: Float64Array): Float64Array {
  out.fill(0);
  for (let s = 0; s < p.studCount; s++) {
    const F = studLoads[s];
    // ours (docs/clamp-model.md §7, studs to bores): each stud's load goes to its bores by share
    for (let j = p.start[s]; j < p.start[s + 1]; j++) out[p.boreOf[j]] += p.shareOf[j] * F;
  }
  return out;
}

/**
 * A load over its damage limit, where a path capped at that limit (a seal line whose ring flows at the
 * gasket's QSmax, a stopper at its indentation limit) carries it to the last bit of rounding: within
 * 1e-9 of the limit counts as reaching it, so the verdict and the ceiling do not hang on rounding.
 */
function reached(utilization: number): number {
  return utilization > 1 - 1e-9 && utilization < 1 ? 1 : utilization;
}

export function boreSeal(p: Prepared, clampColdN: number, clampHotN: number): BoreSeal {
  const cold = loadBore(p.paths, clampColdN);
  const hot = moveBore(p.paths, cold, clampHotN);
  // VDI 2230 Part 1 (load at the gasket plane): firing takes (1 − Φn)·FA off the gasket
  const fired = moveBore(p.paths, hot, clampHotN - p.reliefPerBoreN);
  const r = p.requirement;
  // the seal's needs (EN 13555, or the ASME VIII-1 App. 2 stand-in): seating ≥ Wm2, contact under firing ≥ Hp
  const seatingMargin = cold.lineN / r.seatingLoadN;
  const operatingMargin = fired.lineN / r.operatingContactN;
  let crushUtilization = 0;
  if (r.maxLoadN !== null) crushUtilization = reached(Math.max(cold.lineN, hot.lineN) / r.maxLoadN);
  const stopper = p.paths.elements.findIndex((e) => e.kind === "stopper");
  const bead = p.paths.elements.find((e) => e.kind === "bead");
  if (stopper >= 0) {
    // ours: the stopper's own load against its indentation limit on the head face
    const e = p.paths.elements[stopper];
    const at = (s: BoreState) => reached(elementForce(e, s.closureMm, s.set[stopper]) / e.limitN);
    crushUtilization = Math.max(crushUtilization, at(cold), at(hot));
  }
  return {
    cold,
    hot,
    fired,
    remainingHotN: fired.lineN,
    liftMm: hot.closureMm - fired.closureMm,
    // ours: the bead recovers as the head lifts; once the lift passes its compression it lets go
    beadReserveMm: bead ? fired.closureMm - bead.engageMm : null,
    seatingMargin,
    operatingMargin,
    sealMargin: Math.min(seatingMargin, operatingMargin),
    bodyMargin: p.bodyRequirementN > 0 ? fired.bodyN / p.bodyRequirementN : Infinity,
    crushUtilization,
  };
}

// One record reused by the lean loops below (the core is synchronous).
const lean = leanBoreRecord();

/** The seal margin of one bore on scalars; leaves the bore's loads in the shared lean record. */
export function boreSealMargin(p: Prepared, clampColdN: number, clampHotN: number): number {
  leanBore(p.paths, clampColdN, clampHotN, p.reliefPerBoreN, lean);
  const r = p.requirement;
  // as boreSeal: seating ≥ Wm2 at assembly, contact under firing ≥ Hp
  return Math.min(lean.coldLineN / r.seatingLoadN, lean.firedLineN / r.operatingContactN);
}

/** The seal line's load left hot and fired, and whether a seal path is at its limit cold or hot (lean). */
export function boreFiredLine(p: Prepared, clampColdN: number, clampHotN: number): { firedLineN: number; lineAtLimit: boolean } {
  leanBore(p.paths, clampColdN, clampHotN, p.reliefPerBoreN, lean);
  return { firedLineN: lean.firedLineN, lineAtLimit: lean.lineAtLimit };
}

/** boreSeal's crushUtilization on scalars (same figures). */
export function boreCrush(p: Prepared, clampColdN: number, clampHotN: number): number {
  leanBore(p.paths, clampColdN, clampHotN, p.reliefPerBoreN, lean);
  const r = p.requirement;
  let crush = 0;
  if (r.maxLoadN !== null) crush = reached(Math.max(lean.coldLineN, lean.hotLineN) / r.maxLoadN);
  if (p.stopperIndex >= 0) {
    const limit = p.paths.elements[p.stopperIndex].limitN;
    crush = Math.max(crush, reached(lean.coldStopperN / limit), reached(lean.hotStopperN / limit));
  }
  return crush;
}

/** Weakest seal margin over the bores for given per-bore cold and hot clamps. */
export function weakestMargin(
  p: Prepared,
  coldClamps: Float64Array,
  hotClamps: Float64Array,
): { margin: number; bore: number; bodyMargin: number } {
  let margin = Infinity;
  let bodyMargin = Infinity;
  let bore = 0;
  for (let b = 0; b < p.cylinders; b++) {
    const seal = boreSealMargin(p, coldClamps[b], hotClamps[b]);
    const body = p.bodyRequirementN > 0 ? lean.firedBodyN / p.bodyRequirementN : Infinity;
    if (seal < margin) {
      margin = seal;
      bore = b;
    }
    if (body < bodyMargin) bodyMargin = body;
  }
  return { margin, bore, bodyMargin };
}
