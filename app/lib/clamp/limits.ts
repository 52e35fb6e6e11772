// Every limit the model checks, at the preload that is worst for it, and the one verdict that carries
// the worst of them. Seal checks use the bottom of the scatter band; stud, washer, thread and crush
// checks the top of it, hot and under firing.
import { boreSeal, boreSealMargin, type BoreSeal } from "./cylinders";
import { hotSettledPreload, type Prepared } from "./model";
import { preloadBand, type PreloadBand } from "./torque";
import { SI_WORDING, type Wording } from "./wording";
import { rankChecks } from "./check-order";

export { rankChecks };

export type CheckId = "seal" | "body-seal" | "stud-assembly" | "stud-working" | "fatigue" | "bearing" | "thread-strip" | "crush";
export type Status = "holds" | "thin" | "short";

export interface LimitCheck {
  id: CheckId;
  /** What is checked, in words. */
  label: string;
  /** Capacity over demand: 1 is the limit, above it passes. */
  ratio: number;
  /** Ratio below which the check reads as thin (a comfort band above 1). */
  thinBelow: number;
  status: Status;
  /** The figure in words, for the list of checks ("" when the evaluation was asked for no words). */
  detail: string;
  cylinder?: number;
  /** False when the plan lacks the figure the check needs; such a check never decides the verdict. */
  checked: boolean;
}

export interface Verdict {
  status: Status;
  /** One sentence naming the limiting check. */
  headline: string;
  limiting: CheckId;
  checks: LimitCheck[];
}

export interface WorkingState {
  /** Stud load hot and fired at the top of the band: Fmax + heat + Φn·FA. */
  studLoadN: number;
  axialMpa: number;
  /** Torsion left in service, kτ·τ (VDI 2230: kτ = 0.5, from memory). */
  torsionMpa: number;
  equivalentMpa: number;
  utilization: number;
  /** Stress amplitude in the thread from the firing cycle, Φn·FA/(2·As). */
  amplitudeMpa: number;
  enduranceMpa: number;
  /** Thread-stripping capacity of the block and the engagement that would carry the load. */
  stripCapacityN: number | null;
  minEngagementMm: number | null;
  blockShearMpa: number | null;
}

export interface BandSeal {
  band: PreloadBand;
  /** Per bore at the bottom of the band. */
  atMin: BoreSeal[];
  /** Per bore at the top of the band (empty where no crush limit applies). */
  atMax: BoreSeal[];
  weakestAtMin: number;
  worstBodyAtMin: number;
}

/** VDI 2230 (from memory): torsion relief in service, kτ = 0.5 of the tightening torsion. */
export const TORSION_RELIEF = 0.5;

/** True when the plan has a seal-line damage limit to check (EN 13555 QSmax, or an MLS stopper). */
export function crushApplies(p: Prepared): boolean {
  return p.requirement.maxLoadN !== null || p.paths.elements.some((e) => e.kind === "stopper");
}

/** Seal of every bore at both ends of the band (equal preload on every stud; the top only where crush is checked). */
export function bandSeal(p: Prepared, nominalN: number): BandSeal {
  const band = preloadBand(nominalN, p.tighteningFactor);
  const atMin: BoreSeal[] = [];
  const atMax: BoreSeal[] = [];
  const withMax = crushApplies(p);
  const hotMin = hotSettledPreload(p, band.minN);
  const hotMax = hotSettledPreload(p, band.maxN);
  let weakestAtMin = 0;
  let worstBodyAtMin = 0;
  for (let b = 0; b < p.cylinders; b++) {
    const w = p.boreStudWeight[b];
    // a bore with the same Σ of shares as an earlier one has the same figures (equal preload on every stud)
    const same = p.sameWeightAs[b];
    atMin.push(same < b ? atMin[same] : boreSeal(p, w * band.minN, w * hotMin));
    if (withMax) atMax.push(same < b ? atMax[same] : boreSeal(p, w * band.maxN, w * hotMax));
    if (atMin[b].sealMargin < atMin[weakestAtMin].sealMargin) weakestAtMin = b;
    if (atMin[b].bodyMargin < atMin[worstBodyAtMin].bodyMargin) worstBodyAtMin = b;
  }
  return { band, atMin, atMax, weakestAtMin, worstBodyAtMin };
}

/** The weakest bore at the bottom of the band and its seal margin (lean: no per-bore records). */
export function weakestAtMin(p: Prepared, nominalN: number): { bore: number; margin: number; minN: number } {
  const minN = preloadBand(nominalN, p.tighteningFactor).minN;
  const hot = hotSettledPreload(p, minN);
  let bore = 0;
  let margin = Infinity;
  for (let b = 0; b < p.cylinders; b++) {
    // a bore with the same Σ of shares as an earlier one has the same margin: it cannot be weaker
    if (p.sameWeightAs[b] < b) continue;
    const w = p.boreStudWeight[b];
    const m = boreSealMargin(p, w * minN, w * hot);
    if (m < margin) {
      margin = m;
      bore = b;
    }
  }
  return { bore, margin, minN };
}

/** Stud stress hot and under firing at the top of the band, fatigue amplitude and thread stripping. */
export function workingState(p: Prepared, maxPreloadN: number): WorkingState {
  const f = p.plan.fastener;
  const fa = p.peakFiringN;
  // VDI 2230 Part 1: FSmax = FMmax + Φn·FA, plus the thermal gain when the head grows more than the stud
  const studLoadN = maxPreloadN + Math.max(0, p.thermalChangeN) + p.phi * fa;
  const axialMpa = studLoadN / p.section.areaMm2;
  // VDI 2230 Part 1 working state: σred,B = √(σz² + 3·(kτ·τ)²)
  const torsionMpa = TORSION_RELIEF * p.stressPerN.torsion * maxPreloadN;
  const equivalentMpa = Math.sqrt(axialMpa * axialMpa + 3 * torsionMpa * torsionMpa);
  // VDI 2230 Part 1: σa = Φn·FA/(2·As) for a load cycling between 0 and FA
  const amplitudeMpa = (p.phi * fa) / (2 * p.thread.stressAreaMm2);
  const d = f.diameterMm;
  // VDI 2230 Part 1 (from memory): rolled before heat treatment σASV = 0.85·(150/d + 45)
  const asv = 0.85 * (150 / d + 45);
  // VDI 2230 Part 1 (from memory): rolled after, σASG = (2 − FS/F0.2)·σASV
  const f02 = f.yieldMpa * p.section.areaMm2;
  const enduranceMpa = f.rolledAfterHeatTreatment ? Math.max(asv, (2 - Math.min(1, studLoadN / f02)) * asv) : asv;
  const blk = p.plan.block;
  // von Mises shear yield τ = Rp/√3 where only a yield is known (gray iron needs its own shear strength)
  const blockShearMpa = blk.shearStrengthMpa ?? (blk.yieldMpa !== undefined ? blk.yieldMpa / Math.sqrt(3) : null);
  // FED-STD-H28/2 / ASME B1.1 shear area of an internal thread on basic sizes (from memory):
  // ASn = π·d·Le·(1/2 + 0.57735·(d − d2)/P) = 0.875·π·d·Le
  const shearPerLength = Math.PI * d * (0.5 + (0.57735 * (d - p.thread.pitchDiameterMm)) / p.thread.pitchMm);
  const stripCapacityN = blockShearMpa === null ? null : blockShearMpa * shearPerLength * f.engagementMm;
  const minEngagementMm = blockShearMpa === null ? null : studLoadN / (blockShearMpa * shearPerLength);
  return {
    studLoadN,
    axialMpa,
    torsionMpa,
    equivalentMpa,
    utilization: equivalentMpa / f.yieldMpa,
    amplitudeMpa,
    enduranceMpa,
    stripCapacityN,
    minEngagementMm,
    blockShearMpa,
  };
}

const pct = (x: number) => `${Math.round(x * 100)} %`;

function status(ratio: number, thinBelow: number): Status {
  if (ratio < 1) return "short";
  if (ratio < thinBelow) return "thin";
  return "holds";
}

/** Every check at the plan's preload, worst first in the verdict. */
export function verdictFor(
  p: Prepared,
  nominalN: number,
  targetMargin: number,
  w: Wording = SI_WORDING,
  /** False leaves every check's detail "" (the lists read only the verdict: no formatting on their path). */
  words = true,
): { verdict: Verdict; bands: BandSeal; working: WorkingState } {
  const bands = bandSeal(p, nominalN);
  const work = workingState(p, bands.band.maxN);
  const f = p.plan.fastener;
  const checks: LimitCheck[] = [];
  const weak = bands.atMin[bands.weakestAtMin];
  const seatingShort = weak.seatingMargin < weak.operatingMargin;
  checks.push({
    id: "seal",
    label: "Combustion seal, bottom of the band, hot and fired",
    ratio: weak.sealMargin,
    thinBelow: Math.max(1, targetMargin),
    status: status(weak.sealMargin, Math.max(1, targetMargin)),
    detail: words
      ? `margin ${weak.sealMargin.toFixed(2)} on cylinder ${bands.weakestAtMin + 1} (${seatingShort ? "seating decides" : "firing decides"})`
      : "",
    cylinder: bands.weakestAtMin + 1,
    checked: true,
  });
  const body = bands.atMin[bands.worstBodyAtMin];
  checks.push({
    id: "body-seal",
    label: "Gasket body seal (coolant and oil), bottom of the band, hot and fired",
    ratio: body.bodyMargin,
    thinBelow: 1,
    status: status(body.bodyMargin, 1),
    detail: words
      ? `body keeps ${w.force(body.fired.bodyN)} of the ${w.force(p.bodyRequirementN)} it needs (${w.stress(p.bodySealPressureMpa)}${p.bodySealAssumed ? ", typical figure" : ""}) on cylinder ${bands.worstBodyAtMin + 1}`
      : "",
    cylinder: bands.worstBodyAtMin + 1,
    checked: true,
  });
  const assembly = (p.stressPerN.equivalent * bands.band.maxN) / f.yieldMpa;
  const nu = p.plan.model.studLimitFraction;
  checks.push({
    id: "stud-assembly",
    label: "Stud while tightened, top of the band",
    ratio: 1 / assembly,
    thinBelow: 1 / nu,
    status: status(1 / assembly, 1 / nu),
    detail: words ? `${pct(assembly)} of yield in equivalent stress (limit ${pct(nu)})` : "",
    checked: true,
  });
  checks.push({
    id: "stud-working",
    label: "Stud hot and under firing, top of the band",
    ratio: 1 / work.utilization,
    thinBelow: 1,
    status: status(1 / work.utilization, 1),
    detail: words ? `${pct(work.utilization)} of yield with heat, the fired share and torsion relief` : "",
    checked: true,
  });
  const fatigueRatio = work.amplitudeMpa > 0 ? work.enduranceMpa / work.amplitudeMpa : Infinity;
  checks.push({
    id: "fatigue",
    label: "Stud thread fatigue under the firing cycle",
    ratio: fatigueRatio,
    thinBelow: 1.2,
    status: status(fatigueRatio, 1.2),
    detail: words ? `stress swing ±${w.stress(work.amplitudeMpa)} against an endurance limit of ${w.stress(work.enduranceMpa)}` : "",
    checked: true,
  });
  const bearingMpa = work.studLoadN / p.bearingAreaMm2;
  const bearingRatio = p.bearingCapacityN / work.studLoadN;
  checks.push({
    id: "bearing",
    label: "Washer bearing on the head, top of the band, hot and fired",
    ratio: bearingRatio,
    thinBelow: 1,
    status: status(bearingRatio, 1),
    detail: words
      ? p.washer.limitedBy === "washer"
        ? `the nut face dents the washer before the head gives: a harder washer raises this limit (${w.stress(bearingMpa)} under the washer on the head)`
        : `${w.stress(bearingMpa)} under the washer against the head's ${w.stress(p.plan.head.limitingSurfacePressureMpa)}`
      : "",
    checked: true,
  });
  if (work.stripCapacityN !== null && work.minEngagementMm !== null) {
    const minEngagementMm = work.minEngagementMm;
    const r = work.stripCapacityN / work.studLoadN;
    checks.push({
      id: "thread-strip",
      label: "Thread in the block, top of the band, hot and fired",
      ratio: r,
      thinBelow: 1,
      status: status(r, 1),
      detail: words ? `${w.length(f.engagementMm)} engaged; ${w.length(minEngagementMm)} would carry the load` : "",
      checked: true,
    });
  } else {
    checks.push({
      id: "thread-strip",
      label: "Thread in the block",
      ratio: Infinity,
      thinBelow: 1,
      status: "holds",
      detail: "not checked: the block material has no shear strength or yield",
      checked: false,
    });
  }
  let crush = 0;
  let crushBore = 0;
  for (let b = 0; b < bands.atMax.length; b++) {
    if (bands.atMax[b].crushUtilization > crush) {
      crush = bands.atMax[b].crushUtilization;
      crushBore = b;
    }
  }
  const crushChecked = crushApplies(p);
  checks.push({
    id: "crush",
    label: "Seal line crush, top of the band",
    ratio: crushChecked ? (crush > 0 ? 1 / crush : Infinity) : Infinity,
    thinBelow: 1,
    status: crushChecked && crush >= 1 ? "short" : "holds",
    detail: words
      ? crushChecked
        ? `${pct(crush)} of what the seal line takes without damage on cylinder ${crushBore + 1}`
        : "not checked: no damage limit for this seal line"
      : "",
    cylinder: crushBore + 1,
    checked: crushChecked,
  });

  const ranked = rankChecks(checks);
  // every check passing: the headline speaks of the seal
  const worst = ranked[0].checked && ranked[0].status !== "holds" ? ranked[0] : checks[0];
  return {
    verdict: { status: worst.status, headline: headline(worst, targetMargin, seatingShort), limiting: worst.id, checks },
    bands,
    working: work,
  };
}

function headline(c: LimitCheck, target: number, seatingShort: boolean): string {
  const cyl = c.cylinder;
  switch (c.id) {
    case "seal":
      if (c.status === "short")
        return seatingShort ? `Seal short at seating in cylinder ${cyl}` : `Seal short under firing in cylinder ${cyl}`;
      if (c.status === "thin") return `Seal thin in cylinder ${cyl}: margin ${c.ratio.toFixed(2)}, under the ${target.toFixed(2)} target`;
      return `Every check passed; the weakest seal margin is ${c.ratio.toFixed(2)} in cylinder ${cyl}`;
    case "body-seal":
      return `Gasket body short of seal in cylinder ${cyl} (coolant and oil)`;
    case "stud-assembly":
      return c.status === "short"
        ? "Stud past yield at the top of the scatter band"
        : "Stud over the 90 % tightening limit at the top of the scatter band";
    case "stud-working":
      return "Stud past yield hot and under firing";
    case "fatigue":
      return c.status === "short"
        ? "Stud thread fatigue: the firing stress swing passes its endurance limit"
        : "Stud thread fatigue reserve under 1.2";
    case "bearing":
      return "Washer sinks into the head: bearing pressure over the head's limit";
    case "thread-strip":
      return "Block thread may strip at the top of the scatter band";
    case "crush":
      return `Seal line crushed at the top of the scatter band in cylinder ${cyl}`;
  }
}
