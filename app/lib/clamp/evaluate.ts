// One full estimate for a plan: evaluatePlan(). SI in, SI out.
import { headSqueeze, sealGainPer10, torqueCeiling, type Ceiling, type HeadSqueeze, type SealGain } from "./ceiling";
import { boreClamps, boreSeal } from "./cylinders";
import { verdictFor, type Verdict, type WorkingState } from "./limits";
import { hotSettledPreload, prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import type { SealRequirement } from "./seal";
import { jointUnderLoad } from "./stiffness";
import type { ThreadForm, ThreadGeometry } from "./thread";
import { tighteningStress, type PreloadBand, type TighteningStress } from "./torque";
import { planAssumptions, planWarnings } from "./warnings";
import { peakPressureNote, SI_WORDING, type Wording } from "./wording";

export interface CylinderEstimate {
  /** 1-based cylinder number. */
  cylinder: number;
  /** Σ of stud shares on this bore. */
  effectiveStuds: number;
  /** Cold clamp at the nominal preload. */
  clampN: number;
  sealLineN: number;
  bodyN: number;
  /** dF_line/dF at this clamp (loading further). */
  marginalSealLineShare: number;
  sealLineAtLimit: boolean;
  /** H = π/4·G²·p over the seal diameter. */
  separatingForceN: number;
  /** (1 − Φn)·H: clamp that firing takes off this bore's gasket. */
  clampReliefN: number;
  /** Heat and settling: hot, settled clamp minus cold clamp (negative when it is lost). */
  heatAndSettlingN: number;
  clampHotSettledN: number;
  sealLineHotSettledN: number;
  /** Seal-line load left hot, settled and fired (nominal preload). */
  remainingSealLineHotSettledN: number;
  bodyFiredN: number;
  /** How far firing lifts the head at the seal line. */
  liftMm: number;
  /** MLS: bead compression left under firing at the bottom of the band (null without a bead). */
  beadReserveMm: number | null;
  requiredSeatingN: number;
  requiredOperatingN: number;
  seatingMargin: number;
  operatingMargin: number;
  /** Seal margin at the nominal preload (shown beside, labelled as such). */
  sealMarginNominal: number;
  /** Seal margin at the bottom of the scatter band, hot and fired: the verdict's basis. */
  sealMargin: number;
  /** Body load left hot and fired at the bottom of the band over what seals coolant and oil. */
  bodyMargin: number;
}

export interface StudEstimate {
  label: string;
  preloadN: number;
  /** Firing load summed over the bores the stud serves. */
  externalN: number;
  /** The largest firing load it sees at once (one bore fires at a time). */
  peakFiringN: number;
  /** Stud load while its biggest bore fires, FV + Φn·FA. */
  firedLoadN: number;
  /** Clamp left on the gasket and block at this stud under firing, FV − (1 − Φn)·FA. */
  memberFiredN: number;
  /** External load per stud that would open the joint at the gasket. */
  separationLoadN: number;
  hotSettledPreloadN: number;
}

export interface PlanEstimate {
  threadForm: ThreadForm;
  thread: ThreadGeometry;
  tightening: {
    torqueNm: number;
    preload: PreloadBand;
    torquePerPreloadMm: number;
    equivalentNutFactor: number;
    frictionDiameterMm: number;
  };
  studStress: { nominal: TighteningStress; atMax: TighteningStress; limitMpa: number; working: WorkingState };
  stiffness: {
    gripMm: number;
    studNPerMm: number;
    memberNPerMm: number;
    memberWilemanNPerMm: number;
    jointConstant: number;
    /** Φn: the share of the firing load each stud takes (load at the gasket plane). */
    loadFactor: number;
    coneLimitMm: number;
    studSpacingAssumed: boolean;
    layers: { name: string; thicknessMm: number; complianceMmPerN: number }[];
  };
  seal: {
    lineNPerMm: number;
    bodyNPerMm: number;
    gapMm: number;
    lineLimitN: number;
    paths: string[];
    requirement: SealRequirement;
    deck: { thicknessMm: number; outerRadiusMm: number; assumed: boolean };
    bodyRequirementN: number;
  };
  firing: { peakPressureMpa: number; estimated: boolean; note: string };
  studs: StudEstimate[];
  cylinders: CylinderEstimate[];
  /** Weakest at the bottom of the band, hot and fired (the verdict's basis). */
  weakestCylinder: number;
  weakestMargin: number;
  /** The same bore's margin at the nominal preload. */
  weakestMarginNominal: number;
  verdict: Verdict;
  ceiling: Ceiling;
  gain: SealGain;
  squeeze: HeadSqueeze;
  head: {
    bearingAreaMm2: number;
    bearingPressureMpa: number;
    bearingPressureMaxMpa: number;
    limitMpa: number;
    bearingUtilizationMax: number;
    compressionPerStudMm: number;
  };
  hotSettled: { thermalChangeN: number; embeddingMm: number; embeddingLossN: number; relaxationLossN: number; preloadN: number };
  warnings: string[];
  /** Where the estimate assumed a figure the plan did not give. */
  assumptions: string[];
}

type FixedParts = Pick<PlanEstimate, "stiffness" | "seal">;

/**
 * The figures of an evaluation that do not depend on the torque, built once per prepared plan and
 * shared by its evaluations (read-only: a caller that needs to change one copies it).
 */
function fixedParts(p: Prepared): FixedParts {
  if (p.memo.fixed) return p.memo.fixed as FixedParts;
  const fixed: FixedParts = {
    stiffness: {
      gripMm: p.member.gripMm,
      studNPerMm: p.stud.stiffnessNPerMm,
      memberNPerMm: p.member.stiffnessNPerMm,
      memberWilemanNPerMm: p.wilemanNPerMm,
      jointConstant: p.C,
      loadFactor: p.phi,
      coneLimitMm: p.coneLimitMm,
      studSpacingAssumed: p.studSpacingAssumed,
      layers: p.layers.map((l, i) => ({ name: l.name, thicknessMm: l.thicknessMm, complianceMmPerN: p.member.layerCompliance[i] })),
    },
    seal: {
      lineNPerMm: p.lineNPerMm,
      bodyNPerMm: p.bodyNPerMm,
      gapMm: p.gapMm,
      lineLimitN: p.lineLimitN,
      paths: p.paths.elements.map((e) => e.kind),
      requirement: p.requirement,
      deck: p.deck,
      bodyRequirementN: p.bodyRequirementN,
    },
  };
  p.memo.fixed = fixed;
  return fixed;
}

/** Nominal torque and preload for the plan's tightening target. */
export function targetTorqueAndPreload(p: Prepared): { torqueNm: number; preloadN: number } {
  const t = p.plan.tightening.target;
  if (t.mode === "torque") return { torqueNm: t.torqueNm, preloadN: (t.torqueNm * 1000) / p.torquePerPreloadMm };
  return { torqueNm: (t.preloadN * p.torquePerPreloadMm) / 1000, preloadN: t.preloadN };
}

export interface EvaluateOptions {
  /**
   * False leaves `warnings` and `assumptions` empty, and (unless `details`) every check's detail, the
   * ceiling's explanation and the firing note "": for lists that show only the verdict, and the hot path.
   */
  sentences?: boolean;
  /** With sentences false: still word the checks' details, the ceiling's explanation and the firing note. */
  details?: boolean;
}

/** Full estimate for a validated plan (parse with PlanInputSchema first). */
export function evaluatePlan(input: PlanInput, wording: Wording = SI_WORDING, options: EvaluateOptions = {}): PlanEstimate {
  return evaluatePrepared(prepare(input), undefined, wording, options);
}

export function evaluatePrepared(
  p: Prepared,
  torqueOverrideNm: number | undefined,
  wording: Wording = SI_WORDING,
  options: EvaluateOptions = {},
): PlanEstimate {
  const base = targetTorqueAndPreload(p);
  const torqueNm = torqueOverrideNm ?? base.torqueNm;
  const F = torqueOverrideNm === undefined ? base.preloadN : (torqueOverrideNm * 1000) / p.torquePerPreloadMm;
  const words = options.sentences !== false || options.details === true;
  const { verdict, bands, working } = verdictFor(p, F, p.plan.targetMargin, wording, words);
  const band = bands.band;
  const yieldMpa = p.plan.fastener.yieldMpa;
  const Fhs = hotSettledPreload(p, F);

  // scratch arrays of the prepared plan: the bore clamps are read into the estimate below, before any
  // other evaluation of this plan could reuse them (the core is synchronous)
  const scratch = (p.memo.scratch ??= {
    studs: new Float64Array(p.studCount),
    cold: new Float64Array(p.cylinders),
    hot: new Float64Array(p.cylinders),
  });
  const cold = boreClamps(p, scratch.studs.fill(F), scratch.cold);
  const hot = boreClamps(p, scratch.studs.fill(Fhs), scratch.hot);
  const cylinders: CylinderEstimate[] = [];
  const seals: ReturnType<typeof boreSeal>[] = [];
  for (let b = 0; b < p.cylinders; b++) {
    // a bore with the same clamps as an earlier one (same Σ of shares, same sum) has the same seal
    const a = p.sameWeightAs[b];
    const s = a < b && cold[a] === cold[b] && hot[a] === hot[b] ? seals[a] : boreSeal(p, cold[b], hot[b]);
    seals.push(s);
    const min = bands.atMin[b];
    cylinders.push({
      cylinder: b + 1,
      effectiveStuds: p.boreStudWeight[b],
      clampN: cold[b],
      sealLineN: s.cold.lineN,
      bodyN: s.cold.bodyN,
      marginalSealLineShare: s.cold.marginalShare,
      sealLineAtLimit: s.cold.lineAtLimit,
      separatingForceN: p.requirement.pressureForceN,
      clampReliefN: p.reliefPerBoreN,
      heatAndSettlingN: hot[b] - cold[b],
      clampHotSettledN: hot[b],
      sealLineHotSettledN: s.hot.lineN,
      remainingSealLineHotSettledN: s.remainingHotN,
      bodyFiredN: s.fired.bodyN,
      liftMm: s.liftMm,
      beadReserveMm: min.beadReserveMm,
      requiredSeatingN: p.requirement.seatingLoadN,
      requiredOperatingN: p.requirement.operatingContactN,
      seatingMargin: min.seatingMargin,
      operatingMargin: min.operatingMargin,
      sealMarginNominal: s.sealMargin,
      sealMargin: min.sealMargin,
      bodyMargin: min.bodyMargin,
    });
  }

  const studs: StudEstimate[] = p.plan.studs.map((st, i) => {
    const j = jointUnderLoad(F, p.studPeakFiringN[i], p.phi);
    return {
      label: st.label ?? String(i + 1),
      preloadN: F,
      externalN: p.studExternalN[i],
      peakFiringN: p.studPeakFiringN[i],
      firedLoadN: j.studLoadN,
      memberFiredN: j.memberLoadN,
      separationLoadN: j.separationLoadN,
      hotSettledPreloadN: Fhs,
    };
  });

  const w = cylinders[bands.weakestAtMin];
  // the band's weakest bore is the one sealGainPer10 would look for (the same first-smallest rule)
  const gain = sealGainPer10(p, torqueNm, bands.weakestAtMin);
  const fixed = fixedParts(p);
  const estimate: PlanEstimate = {
    threadForm: p.threadForm,
    thread: p.thread,
    tightening: {
      torqueNm,
      preload: band,
      torquePerPreloadMm: p.torquePerPreloadMm,
      // Shigley eq. 8-27 solved for K
      equivalentNutFactor: p.torquePerPreloadMm / p.thread.diameterMm,
      frictionDiameterMm: p.torqueGeometry.bearingDiameterMm,
    },
    studStress: {
      nominal: tighteningStress(F, p.stressPerN, yieldMpa),
      atMax: tighteningStress(band.maxN, p.stressPerN, yieldMpa),
      limitMpa: p.studLimitMpa,
      working,
    },
    stiffness: fixed.stiffness,
    seal: fixed.seal,
    firing: {
      peakPressureMpa: p.peakPressureMpa,
      estimated: p.peakEstimated,
      note: words ? peakPressureNote(p.plan.firing, wording) : "",
    },
    studs,
    cylinders,
    weakestCylinder: w.cylinder,
    weakestMargin: w.sealMargin,
    weakestMarginNominal: w.sealMarginNominal,
    verdict,
    ceiling: torqueCeiling(p, wording, words),
    gain,
    squeeze: headSqueeze(p, torqueNm, gain),
    head: {
      bearingAreaMm2: p.bearingAreaMm2,
      // VDI 2230: surface pressure p = F/Ap
      bearingPressureMpa: F / p.bearingAreaMm2,
      bearingPressureMaxMpa: working.studLoadN / p.bearingAreaMm2,
      limitMpa: p.plan.head.limitingSurfacePressureMpa,
      bearingUtilizationMax: working.studLoadN / p.bearingCapacityN,
      // Shigley §8-5: the head layer's share of the member compression, δ = F·c_head
      compressionPerStudMm: F * p.headComplianceMmPerN,
    },
    hotSettled: {
      thermalChangeN: p.thermalChangeN,
      embeddingMm: p.embedMm,
      embeddingLossN: p.embeddingLossN,
      relaxationLossN: F * p.relaxationFraction,
      preloadN: Fhs,
    },
    warnings: [],
    assumptions: [],
  };
  if (options.sentences === false) return estimate;
  estimate.assumptions = planAssumptions(p, wording);
  estimate.warnings = planWarnings(p, estimate, wording);
  return estimate;
}
