// One full estimate for a plan: evaluatePlan(). SI in, SI out.
import { boreClamps, boreSeal } from "./cylinders";
import { hotSettledPreload, prepare, type Prepared } from "./model";
import type { PlanInput } from "./schema";
import type { AsmeRequirement } from "./seal";
import { jointUnderLoad } from "./stiffness";
import type { ThreadGeometry } from "./thread";
import { preloadBand, tighteningStress, type PreloadBand, type TighteningStress } from "./torque";
import { squeezeTorques } from "./squeeze";
import { planWarnings } from "./warnings";
import { peakPressureNote, SI_WORDING, type Wording } from "./wording";

export interface CylinderEstimate {
  /** 1-based cylinder number. */
  cylinder: number;
  /** Σ of stud shares on this bore. */
  effectiveStuds: number;
  clampN: number;
  sealLineN: number;
  bodyN: number;
  /** dF_r/dF at this clamp: 1 before the body touches, k_r/(k_r+k_b) after, 0 once the line flows. */
  marginalSealLineShare: number;
  sealLineYielded: boolean;
  /** H = π/4·G²·p over the seal diameter. */
  separatingForceN: number;
  /** (1 − C)·H: clamp that firing takes off this bore. */
  clampReliefN: number;
  remainingSealLineColdN: number;
  clampHotSettledN: number;
  sealLineHotSettledN: number;
  remainingSealLineHotSettledN: number;
  requiredSeatingN: number;
  requiredOperatingN: number;
  seatingMargin: number;
  operatingMargin: number;
  sealMargin: number;
  sealMarginAtMinPreload: number;
}

export interface StudEstimate {
  label: string;
  preloadN: number;
  externalN: number;
  /** Stud load under firing, Fi + C·P. */
  firedLoadN: number;
  /** Member clamp at this stud under firing, Fi − (1 − C)·P. */
  memberFiredN: number;
  /** External load per stud that would open the joint. */
  separationLoadN: number;
  hotSettledPreloadN: number;
}

export interface PlanEstimate {
  thread: ThreadGeometry;
  tightening: {
    torqueNm: number;
    preload: PreloadBand;
    torquePerPreloadMm: number;
    equivalentNutFactor: number;
  };
  studStress: { nominal: TighteningStress; atMax: TighteningStress; limitMpa: number };
  stiffness: {
    gripMm: number;
    studNPerMm: number;
    memberNPerMm: number;
    memberWilemanNPerMm: number;
    jointConstant: number;
    layers: { name: string; thicknessMm: number; complianceMmPerN: number }[];
  };
  seal: {
    lineNPerMm: number;
    bodyNPerMm: number;
    gapMm: number;
    contactShare: number;
    lineLimitN: number;
    bodyTouchClampN: number;
    lineYieldClampN: number;
    asme: AsmeRequirement;
  };
  firing: { peakPressureMpa: number; estimated: boolean; note: string };
  studs: StudEstimate[];
  cylinders: CylinderEstimate[];
  weakestCylinder: number;
  weakestMargin: number;
  head: {
    bearingAreaMm2: number;
    bearingPressureMpa: number;
    bearingPressureMaxMpa: number;
    limitMpa: number;
    bearingUtilizationMax: number;
    compressionPerStudMm: number;
    compressionMaxMm: number;
  };
  squeeze: { marginalShareWeakest: number; yieldedCylinders: number[]; mostlySqueezing: boolean };
  hotSettled: {
    thermalChangeN: number;
    embeddingMm: number;
    embeddingLossN: number;
    relaxationLossN: number;
    preloadN: number;
  };
  warnings: string[];
}

/** Nominal torque and preload for the plan's tightening target. */
export function targetTorqueAndPreload(p: Prepared): { torqueNm: number; preloadN: number } {
  const t = p.plan.tightening.target;
  if (t.mode === "torque") return { torqueNm: t.torqueNm, preloadN: (t.torqueNm * 1000) / p.torquePerPreloadMm };
  return { torqueNm: (t.preloadN * p.torquePerPreloadMm) / 1000, preloadN: t.preloadN };
}

/** Full estimate for a validated plan (parse with PlanInputSchema first). */
export function evaluatePlan(input: PlanInput, wording: Wording = SI_WORDING): PlanEstimate {
  return evaluatePrepared(prepare(input), undefined, wording);
}

export function evaluatePrepared(p: Prepared, torqueOverrideNm: number | undefined, wording: Wording = SI_WORDING): PlanEstimate {
  const base = targetTorqueAndPreload(p);
  const torqueNm = torqueOverrideNm ?? base.torqueNm;
  const F = torqueOverrideNm === undefined ? base.preloadN : (torqueOverrideNm * 1000) / p.torquePerPreloadMm;
  const band = preloadBand(F, p.tighteningFactor);
  const yieldMpa = p.plan.fastener.yieldMpa;
  const Fhs = hotSettledPreload(p, F);
  const minRatio = band.minN / F;

  const studLoads = new Float64Array(p.studCount).fill(F);
  const hotLoads = new Float64Array(p.studCount).fill(Fhs);
  const cold = boreClamps(p, studLoads, new Float64Array(p.cylinders));
  const hot = boreClamps(p, hotLoads, new Float64Array(p.cylinders));
  const FhsMin = hotSettledPreload(p, band.minN);

  const cylinders: CylinderEstimate[] = [];
  let weakest = 0;
  for (let b = 0; b < p.cylinders; b++) {
    const s = boreSeal(p, cold[b], hot[b]);
    const sMin = boreSeal(p, cold[b] * minRatio, p.boreStudWeight[b] * FhsMin);
    cylinders.push({
      cylinder: b + 1,
      effectiveStuds: p.boreStudWeight[b],
      clampN: cold[b],
      sealLineN: s.cold.lineN,
      bodyN: s.cold.bodyN,
      marginalSealLineShare: s.cold.marginalShare,
      sealLineYielded: s.cold.lineYielded,
      separatingForceN: p.asme.pressureForceN,
      clampReliefN: p.reliefPerBoreN,
      remainingSealLineColdN: s.remainingColdN,
      clampHotSettledN: hot[b],
      sealLineHotSettledN: s.hot.lineN,
      remainingSealLineHotSettledN: s.remainingHotN,
      requiredSeatingN: p.asme.seatingLoadN,
      requiredOperatingN: p.asme.operatingContactN,
      seatingMargin: s.seatingMargin,
      operatingMargin: s.operatingMargin,
      sealMargin: s.sealMargin,
      sealMarginAtMinPreload: sMin.sealMargin,
    });
    if (s.sealMargin < cylinders[weakest].sealMargin) weakest = b;
  }

  const studs: StudEstimate[] = p.plan.studs.map((st, i) => {
    const j = jointUnderLoad(F, p.studExternalN[i], p.C);
    return {
      label: st.label ?? String(i + 1),
      preloadN: F,
      externalN: p.studExternalN[i],
      firedLoadN: j.studLoadN,
      memberFiredN: j.memberLoadN,
      separationLoadN: j.separationLoadN,
      hotSettledPreloadN: Fhs,
    };
  });

  const w = cylinders[weakest];
  const estimate: PlanEstimate = {
    thread: p.thread,
    tightening: {
      torqueNm,
      preload: band,
      torquePerPreloadMm: p.torquePerPreloadMm,
      // Shigley eq. 8-27 solved for K
      equivalentNutFactor: p.torquePerPreloadMm / p.thread.diameterMm,
    },
    studStress: {
      nominal: tighteningStress(F, p.stressPerN, yieldMpa),
      atMax: tighteningStress(band.maxN, p.stressPerN, yieldMpa),
      limitMpa: p.studLimitMpa,
    },
    stiffness: {
      gripMm: p.member.gripMm,
      studNPerMm: p.stud.stiffnessNPerMm,
      memberNPerMm: p.member.stiffnessNPerMm,
      memberWilemanNPerMm: p.wilemanNPerMm,
      jointConstant: p.C,
      layers: p.layers.map((l, i) => ({ name: l.name, thicknessMm: l.thicknessMm, complianceMmPerN: p.member.layerCompliance[i] })),
    },
    seal: {
      lineNPerMm: p.springs.lineNPerMm,
      bodyNPerMm: p.springs.bodyNPerMm,
      gapMm: p.springs.gapMm,
      contactShare: p.contactShare,
      lineLimitN: p.springs.lineLimitN,
      bodyTouchClampN: p.bodyTouchClampN,
      lineYieldClampN: p.lineYieldClampN,
      asme: p.asme,
    },
    firing: { peakPressureMpa: p.peakPressureMpa, estimated: p.peakEstimated, note: peakPressureNote(p.plan.firing, wording) },
    studs,
    cylinders,
    weakestCylinder: w.cylinder,
    weakestMargin: w.sealMargin,
    head: {
      bearingAreaMm2: p.bearingAreaMm2,
      // VDI 2230: surface pressure p = F/Ap
      bearingPressureMpa: F / p.bearingAreaMm2,
      bearingPressureMaxMpa: band.maxN / p.bearingAreaMm2,
      limitMpa: p.plan.head.limitingSurfacePressureMpa,
      bearingUtilizationMax: band.maxN / p.bearingAreaMm2 / p.plan.head.limitingSurfacePressureMpa,
      // Shigley §8-5: the head layer's share of the member compression, δ = F·c_head
      compressionPerStudMm: F * p.headComplianceMmPerN,
      compressionMaxMm: band.maxN * p.headComplianceMmPerN,
    },
    squeeze: {
      marginalShareWeakest: w.marginalSealLineShare,
      yieldedCylinders: cylinders.filter((c) => c.sealLineYielded).map((c) => c.cylinder),
      // ours: past the squeeze point (the first of its three limits), whatever the assembled share says
      mostlySqueezing: torqueNm >= Math.min(...Object.values(squeezeTorques(p))),
    },
    hotSettled: {
      thermalChangeN: p.thermalChangeN,
      embeddingMm: p.embedMm,
      embeddingLossN: p.embeddingLossN,
      relaxationLossN: F * p.relaxationFraction,
      preloadN: Fhs,
    },
    warnings: [],
  };
  estimate.warnings = planWarnings(p, estimate, wording);
  return estimate;
}
