// The seal of one bore: the clamp's paths (seal line and gasket body, ours), the deck plate the seal
// line works against, and what the seal needs (EN 13555 figures when the shop has them, else the
// ASME VIII-1 Appendix 2 flange values as a labelled stand-in).
import { seriesCompliance, type Section } from "./stiffness";

/**
 * One load path of a bore: elastic with stiffness k from the closure `engageMm` on, until it carries
 * `limitN`; past that it flows (perfectly plastic, ours) and keeps a permanent set when unloaded.
 */
export interface PathElement {
  kind: "ring" | "bead" | "stopper" | "body";
  /** True for the paths that make the combustion seal (ring, bead, stopper). */
  seal: boolean;
  kNPerMm: number;
  engageMm: number;
  limitN: number;
}

export interface BorePaths {
  elements: PathElement[];
}

/** Where a bore stands: its closure and the permanent set each path has taken. */
export interface BoreState {
  clampN: number;
  closureMm: number;
  set: number[];
  lineN: number;
  bodyN: number;
  /** dF_line/dF at this state, loading further. */
  marginalShare: number;
  /** A seal path has reached its limit (indentation, stopper crush). */
  lineAtLimit: boolean;
}

/** Contact area of the seal band. */
export function sealBandAreaMm2(sealDiameterMm: number, ringWidthMm: number): number {
  return Math.PI * sealDiameterMm * ringWidthMm;
}

/**
 * Deflection per newton, at the load circle, of a circular plate clamped at its edge (radius a) under
 * a load spread along a concentric circle (radius b): Timoshenko & Woinowsky-Krieger, Theory of Plates
 * and Shells (2nd ed.), the clamped plate loaded along a circle (section number from memory); the test
 * checks it against a numerical integration of the plate equation. D = E·t³/(12·(1 − ν²)).
 */
export function ringLoadPlateCompliance(
  modulusMpa: number,
  thicknessMm: number,
  outerRadiusMm: number,
  loadRadiusMm: number,
  poisson = 0.3,
): number {
  const a = outerRadiusMm;
  const b = Math.min(loadRadiusMm, a);
  if (b <= 0 || b >= a) return 0;
  const D = (modulusMpa * thicknessMm ** 3) / (12 * (1 - poisson * poisson));
  // w(b) = P/(8πD)·[(a⁴ − b⁴)/(2a²) + 2b²·ln(b/a)]
  return ((a ** 4 - b ** 4) / (2 * a * a) + 2 * b * b * Math.log(b / a)) / (8 * Math.PI * D);
}

export interface SealLineBuild {
  sealDiameterMm: number;
  ringWidthMm: number;
  gasketThicknessMm: number;
  ringModulusMpa: number;
  headModulusMpa: number;
  landModulusMpa: number;
  /** The head's fire deck as a plate clamped at the stud circle. */
  deck: { thicknessMm: number; outerRadiusMm: number };
  /** The block's deck as a plate too, where no wet sleeve carries the ring (same span as the head's). */
  blockDeck?: { thicknessMm: number; modulusMpa: number };
  sleeve?: { boreMm: number; wallMm: number; supportLengthMm: number; modulusMpa: number };
}

/** Compliance of what surrounds the seal line: head deck bending, local faces, a wet sleeve (ours, in series). */
export function surroundCompliance(b: SealLineBuild): number {
  const area = sealBandAreaMm2(b.sealDiameterMm, b.ringWidthMm);
  const sections: Section[] = [
    // ours: head face and land each as a local zone one band width deep
    { lengthMm: b.ringWidthMm, areaMm2: area, modulusMpa: b.headModulusMpa },
    { lengthMm: b.ringWidthMm, areaMm2: area, modulusMpa: b.landModulusMpa },
  ];
  if (b.sleeve && b.sleeve.supportLengthMm > 0) {
    const { boreMm, wallMm, supportLengthMm, modulusMpa } = b.sleeve;
    // ours: a wet sleeve wall as a tube between its top and its seat
    sections.push({ lengthMm: supportLengthMm, areaMm2: Math.PI * (boreMm + wallMm) * wallMm, modulusMpa });
  }
  // Timoshenko & Woinowsky-Krieger (see ringLoadPlateCompliance): the fire deck bends between the studs
  let plate = ringLoadPlateCompliance(b.headModulusMpa, b.deck.thicknessMm, b.deck.outerRadiusMm, b.sealDiameterMm / 2);
  // the same for the block's deck under the ring (ours: in series with the head's)
  if (b.blockDeck)
    plate += ringLoadPlateCompliance(b.blockDeck.modulusMpa, b.blockDeck.thicknessMm, b.deck.outerRadiusMm, b.sealDiameterMm / 2);
  return seriesCompliance(sections) + plate;
}

/** Stiffness of the ring (or wire, or stopper) as a column of the band through the gasket, in series with its surround. */
export function sealLineStiffness(b: SealLineBuild): number {
  const area = sealBandAreaMm2(b.sealDiameterMm, b.ringWidthMm);
  // ours: the ring as a column of its contact area through the gasket thickness
  const column = b.gasketThicknessMm / (b.ringModulusMpa * area);
  return 1 / (column + surroundCompliance(b));
}

/** Gasket body stiffness k_b for the body area assigned to one bore. */
export function gasketBodyStiffness(modulusMpa: number, areaMm2: number, thicknessMm: number): number {
  // ours: the body as a column k = E·A/t (effective modulus of the body as entered)
  return (modulusMpa * areaMm2) / thicknessMm;
}

export function effectiveGapMm(protrusionMm: number, wireProjectionMm: number, receiverDepthMm: number): number {
  // ours (docs/clamp-model.md §6): g = sleeve protrusion + wire projection not sunk in a receiver groove
  return protrusionMm + Math.max(0, wireProjectionMm - receiverDepthMm);
}

/** The load one path carries at a closure, given its set. */
export function elementForce(e: PathElement, closureMm: number, setMm: number): number {
  const d = closureMm - e.engageMm - setMm;
  if (d <= 0) return 0;
  const f = e.kNPerMm * d;
  return f < e.limitN ? f : e.limitN;
}

/** Total bore load at a closure, with the paths' sets fixed. */
function totalForce(paths: BorePaths, closureMm: number, set: ArrayLike<number>): number {
  let F = 0;
  for (let i = 0; i < paths.elements.length; i++) F += elementForce(paths.elements[i], closureMm, set[i]);
  return F;
}

// Scratch for the breakpoints of one solve (at most two per element); the core is synchronous.
const scratch = new Float64Array(16);

/** The closure at which the paths carry F (piecewise linear and rising: found between breakpoints). */
function closureFor(paths: BorePaths, F: number, set: ArrayLike<number>): number {
  const els = paths.elements;
  let n = 0;
  let kFree = 0;
  for (let i = 0; i < els.length; i++) {
    const start = els[i].engageMm + set[i];
    scratch[n++] = start;
    if (Number.isFinite(els[i].limitN)) scratch[n++] = start + els[i].limitN / els[i].kNPerMm;
    else kFree += els[i].kNPerMm;
  }
  // insertion sort: a handful of points
  for (let i = 1; i < n; i++) {
    const x = scratch[i];
    let j = i;
    while (j > 0 && scratch[j - 1] > x) {
      scratch[j] = scratch[j - 1];
      j--;
    }
    scratch[j] = x;
  }
  const first = scratch[0];
  if (F <= 0) return first;
  let prevX = first;
  let prevF = 0;
  for (let j = 1; j < n; j++) {
    const x = scratch[j];
    const f = totalForce(paths, x, set);
    if (f >= F) return f > prevF ? prevX + ((F - prevF) * (x - prevX)) / (f - prevF) : x;
    prevX = x;
    prevF = f;
  }
  // past the last breakpoint only elastic paths without a limit still stiffen
  return prevX + (F - prevF) / kFree;
}

function stateAt(paths: BorePaths, F: number, closureMm: number, set: number[]): BoreState {
  let lineN = 0;
  let bodyN = 0;
  let kLine = 0;
  let kAll = 0;
  let lineAtLimit = false;
  const eps = 1e-9;
  for (let i = 0; i < paths.elements.length; i++) {
    const e = paths.elements[i];
    const f = elementForce(e, closureMm, set[i]);
    const engaged = closureMm >= e.engageMm + set[i] - eps;
    const capped = f >= e.limitN * (1 - 1e-12);
    if (e.seal) {
      lineN += f;
      if (capped && Number.isFinite(e.limitN)) lineAtLimit = true;
    } else bodyN += f;
    if (engaged && !capped) {
      kAll += e.kNPerMm;
      if (e.seal) kLine += e.kNPerMm;
    }
  }
  return { clampN: F, closureMm, set, lineN, bodyN, marginalShare: kAll > 0 ? kLine / kAll : 0, lineAtLimit };
}

/** Load a fresh bore to clamp F (assembly). */
export function loadBore(paths: BorePaths, clampN: number): BoreState {
  return moveBore(paths, null, clampN);
}

/**
 * Take a bore from its state to a new clamp: a rise loads along the paths (sets grow where a path
 * flows), a fall unloads elastically with the sets kept (ours: elastic–perfectly-plastic paths).
 */
export function moveBore(paths: BorePaths, from: BoreState | null, clampN: number): BoreState {
  const F = Math.max(0, clampN);
  const set = from ? from.set.slice() : new Array<number>(paths.elements.length).fill(0);
  const closure = closureFor(paths, F, set);
  if (!from || F > from.clampN) {
    for (let i = 0; i < paths.elements.length; i++) {
      const e = paths.elements[i];
      if (Number.isFinite(e.limitN)) set[i] = Math.max(set[i], closure - e.engageMm - e.limitN / e.kNPerMm);
    }
  }
  return stateAt(paths, F, closure, set);
}

/** The figures of one bore's three states that the hot loops need, filled in place (see leanBore). */
export interface LeanBore {
  coldLineN: number;
  hotLineN: number;
  firedLineN: number;
  firedBodyN: number;
  /** The MLS stopper's own load cold and hot (0 without a stopper). */
  coldStopperN: number;
  hotStopperN: number;
  /** A seal path at its limit, cold or hot. */
  lineAtLimit: boolean;
}

export function leanBoreRecord(): LeanBore {
  return { coldLineN: 0, hotLineN: 0, firedLineN: 0, firedBodyN: 0, coldStopperN: 0, hotStopperN: 0, lineAtLimit: false };
}

// The sets of one lean solve (a handful of paths; the core is synchronous).
const leanSet = new Float64Array(8);

/** Grow the sets where a path flows at this closure (as moveBore does on a rise). */
function growSets(els: readonly PathElement[], closure: number): void {
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    if (Number.isFinite(e.limitN)) leanSet[i] = Math.max(leanSet[i], closure - e.engageMm - e.limitN / e.kNPerMm);
  }
}

/** Seal-line load, stopper load and limit flag at a closure with the current sets (as stateAt). */
function leanState(els: readonly PathElement[], closure: number, out: LeanBore, which: "cold" | "hot" | "fired"): void {
  let lineN = 0;
  let bodyN = 0;
  let stopperN = 0;
  let atLimit = false;
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    const f = elementForce(e, closure, leanSet[i]);
    if (e.seal) {
      lineN += f;
      if (f >= e.limitN * (1 - 1e-12) && Number.isFinite(e.limitN)) atLimit = true;
      if (e.kind === "stopper") stopperN = f;
    } else bodyN += f;
  }
  if (which === "cold") {
    out.coldLineN = lineN;
    out.coldStopperN = stopperN;
    out.lineAtLimit = atLimit;
  } else if (which === "hot") {
    out.hotLineN = lineN;
    out.hotStopperN = stopperN;
    out.lineAtLimit = out.lineAtLimit || atLimit;
  } else {
    out.firedLineN = lineN;
    out.firedBodyN = bodyN;
  }
}

/**
 * loadBore → moveBore (hot) → moveBore (fired) without building states: the same steps and the same
 * arithmetic in the same order (identical numbers), on scalars, for the sweep, the ceiling and the scatter run.
 */
export function leanBore(paths: BorePaths, clampColdN: number, clampHotN: number, reliefN: number, out: LeanBore): LeanBore {
  const els = paths.elements;
  leanSet.fill(0, 0, els.length);
  const F0 = Math.max(0, clampColdN);
  const c0 = closureFor(paths, F0, leanSet);
  growSets(els, c0);
  leanState(els, c0, out, "cold");
  const F1 = Math.max(0, clampHotN);
  const c1 = closureFor(paths, F1, leanSet);
  if (F1 > F0) growSets(els, c1);
  leanState(els, c1, out, "hot");
  const F2 = Math.max(0, clampHotN - reliefN);
  const c2 = closureFor(paths, F2, leanSet);
  if (F2 > F1) growSets(els, c2);
  leanState(els, c2, out, "fired");
  return out;
}

/** What the seal needs: a seating load at assembly and a contact load left under firing. */
export interface SealRequirement {
  basis: "en13555" | "asme-stand-in";
  /** Mean diameter G of the reaction band. */
  reactionDiameterMm: number;
  /** H = π/4·G²·p, the end force of the gas pressure. */
  pressureForceN: number;
  seatingLoadN: number;
  operatingContactN: number;
  /** Most the seal line may carry without damage (EN 13555 QSmax), when known. */
  maxLoadN: number | null;
}

export interface AsmeRequirement {
  basicWidthMm: number;
  effectiveWidthMm: number;
  reactionDiameterMm: number;
  pressureForceN: number;
  operatingContactN: number;
  operatingBoltLoadN: number;
  seatingLoadN: number;
}

/**
 * ASME BPVC VIII-1 Appendix 2 loads for a flat ring of width N whose mean diameter is given.
 * These are flange design values used here as a stand-in criterion, not head-gasket data.
 */
export function asmeRequirement(meanDiameterMm: number, widthMm: number, pressureMpa: number, m: number, yMpa: number): AsmeRequirement {
  const b0 = widthMm / 2;
  // ASME VIII-1 App. 2-5: b = b0 when b0 ≤ 6 mm, else b = 2.5·√b0 (mm)
  const b = b0 <= 6 ? b0 : 2.5 * Math.sqrt(b0);
  // ASME VIII-1 App. 2-3: G = mean diameter of the contact when b0 ≤ 6 mm, else OD − 2b
  const G = b0 <= 6 ? meanDiameterMm : meanDiameterMm + widthMm - 2 * b;
  // ASME VIII-1 App. 2-5: H = (π/4)·G²·P
  const H = (Math.PI / 4) * G * G * pressureMpa;
  // ASME VIII-1 App. 2-5: Hp = 2·b·π·G·m·P
  const Hp = 2 * b * Math.PI * G * m * pressureMpa;
  // ASME VIII-1 App. 2-5: Wm2 = π·b·G·y
  const Wm2 = Math.PI * b * G * yMpa;
  return {
    basicWidthMm: b0,
    effectiveWidthMm: b,
    reactionDiameterMm: G,
    pressureForceN: H,
    operatingContactN: Hp,
    operatingBoltLoadN: H + Hp,
    seatingLoadN: Wm2,
  };
}

/** The seal's needs from EN 13555 figures when all are given, else the ASME stand-in. */
export function sealRequirement(
  g: {
    sealDiameterMm: number;
    ringWidthMm: number;
    m: number;
    yMpa: number;
    seatingPressureMpa?: number;
    minServicePressureMpa?: number;
    maxPressureMpa?: number;
  },
  pressureMpa: number,
): SealRequirement {
  const asme = asmeRequirement(g.sealDiameterMm, g.ringWidthMm, pressureMpa, g.m, g.yMpa);
  const area = sealBandAreaMm2(g.sealDiameterMm, g.ringWidthMm);
  // EN 13555: gasket stress on the band area; QSmax bounds it whatever the basis
  const maxLoadN = g.maxPressureMpa !== undefined ? g.maxPressureMpa * area : null;
  if (g.seatingPressureMpa !== undefined && g.minServicePressureMpa !== undefined) {
    return {
      basis: "en13555",
      reactionDiameterMm: g.sealDiameterMm,
      // the gas end force over the band's mean diameter (as ASME's H with G = mean diameter)
      pressureForceN: (Math.PI / 4) * g.sealDiameterMm ** 2 * pressureMpa,
      // EN 13555: Qmin(L) to seat, QSmin(L) left in service, over the band area
      seatingLoadN: g.seatingPressureMpa * area,
      operatingContactN: g.minServicePressureMpa * area,
      maxLoadN,
    };
  }
  return {
    basis: "asme-stand-in",
    reactionDiameterMm: asme.reactionDiameterMm,
    pressureForceN: asme.pressureForceN,
    seatingLoadN: asme.seatingLoadN,
    operatingContactN: asme.operatingContactN,
    maxLoadN,
  };
}
