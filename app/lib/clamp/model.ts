// Everything about a plan that does not depend on the torque, computed once and reused by the
// evaluation, the sweep, the uncertainty run, the ceiling and the suggestion.
import { estimatePeakPressure } from "../chamber/peak-pressure";
import type { CeilingCause } from "./ceiling";
import { TYPICAL_GASKETS } from "./gasket-families";
import type { PlanInput } from "./schema";
import { gripLengthMm } from "./schema";
import {
  effectiveGapMm,
  gasketBodyStiffness,
  sealBandAreaMm2,
  sealLineStiffness,
  sealRequirement,
  surroundCompliance,
  type BorePaths,
  type PathElement,
  type SealLineBuild,
  type SealRequirement,
} from "./seal";
import {
  jointConstant,
  loadFactorAtInnerPlane,
  memberStiffness,
  studStiffness,
  wilemanMemberStiffness,
  type Layer,
  type MemberStiffness,
  type StudStiffness,
} from "./stiffness";
import { embeddingLossN, embeddingMm, thermalPreloadChangeN } from "./thermal";
import { circleAreaMm2, looksUnified, threadGeometry, type ThreadForm, type ThreadGeometry } from "./thread";
import { washerBearing, type WasherBearing } from "./washer";
import {
  bearingDiameterMm,
  frictionFaceOdMm,
  TIGHTENING_FACTOR,
  tighteningStressPerN,
  torquePerPreloadMm,
  type Friction,
  type TorqueGeometry,
} from "./torque";

export interface Prepared {
  plan: PlanInput;
  threadForm: ThreadForm;
  thread: ThreadGeometry;
  torqueGeometry: TorqueGeometry;
  friction: Friction;
  /** Torque per preload, N·mm per N. */
  torquePerPreloadMm: number;
  tighteningFactor: number;
  stud: StudStiffness;
  member: MemberStiffness;
  layers: Layer[];
  /** Limiting outside diameter of the pressure cones (the stud spacing). */
  coneLimitMm: number;
  studSpacingMm: number;
  studSpacingAssumed: boolean;
  wilemanNPerMm: number;
  /** Shigley's C (load under the nut), shown for comparison. */
  C: number;
  /** VDI 2230 Φn for the gas load at the gasket plane: what each stud gains of its firing load. */
  phi: number;
  /** The smallest section A0 and its diameter. */
  section: { areaMm2: number; diameterMm: number };
  stressPerN: { axial: number; torsion: number; equivalent: number };
  studLimitMpa: number;
  /** Annulus of the head under the washer that carries the stud load (washer.ts). */
  bearingAreaMm2: number;
  /** Stud load at the washer-bearing limit: the head's limiting pressure, or the washer dented by the nut. */
  bearingCapacityN: number;
  washer: WasherBearing;
  headComplianceMmPerN: number;
  deck: { thicknessMm: number; outerRadiusMm: number; assumed: boolean };
  paths: BorePaths;
  gapMm: number;
  /** Seal-path stiffness of the ring/wire/stopper with its surround (the first seal element). */
  lineNPerMm: number;
  bodyNPerMm: number;
  lineLimitN: number;
  requirement: SealRequirement;
  /** Load the body must keep, hot and fired, to seal coolant and oil. */
  bodyRequirementN: number;
  bodySealPressureMpa: number;
  bodySealAssumed: boolean;
  peakPressureMpa: number;
  peakEstimated: boolean;
  cylinders: number;
  studCount: number;
  /** CSR layout of the shares: stud s serves bores boreOf[start[s]..start[s+1]). */
  start: Int32Array;
  boreOf: Int32Array;
  shareOf: Float64Array;
  /** Σ of shares per bore: the effective number of studs clamping it. */
  boreStudWeight: Float64Array;
  /** The first bore with the same Σ of shares: equal preload on every stud gives it the same figures. */
  sameWeightAs: Int32Array;
  /** Index of the MLS stopper among the paths, −1 without one. */
  stopperIndex: number;
  /** What is found once per prepared plan and kept (the ceiling's torques); filled on first use. */
  memo: {
    ceiling?: { torques: Record<CeilingCause, number>; cause: CeilingCause };
    fixed?: unknown;
    scratch?: { studs: Float64Array; cold: Float64Array; hot: Float64Array };
  };
  /** Firing load each stud carries, summed over the bores it serves (Σ = cylinders × H). */
  studExternalN: Float64Array;
  /** The largest firing load a stud sees at once: one bore fires at a time, so the biggest of its bores' shares. */
  studPeakFiringN: Float64Array;
  /** The largest of those over all studs (FA for the stud checks). */
  peakFiringN: number;
  /** (1 − Φn)·H, clamp that firing takes off each bore's gasket. */
  reliefPerBoreN: number;
  thermalChangeN: number;
  embedMm: number;
  embeddingLossN: number;
  relaxationFraction: number;
}

/** Plate radius and thickness of the head's fire deck around a bore. */
function deckPlate(plan: PlanInput): { thicknessMm: number; outerRadiusMm: number; assumed: boolean } {
  const d = plan.fastener.diameterMm;
  // assumption (ours): the stud circle lies 1.3·d outside the bore, never inside the seal band + d/2
  const outerRadiusMm = Math.max(plan.engine.boreMm / 2 + 1.3 * d, plan.gasket.sealDiameterMm / 2 + plan.gasket.ringWidthMm / 2 + d / 2);
  const given = plan.head.deckThicknessMm;
  // assumption (ours): without a figure, a fire deck about an eighth of the bore thick
  return { thicknessMm: given ?? plan.engine.boreMm / 8, outerRadiusMm, assumed: given === undefined };
}

/** Distance between neighbouring studs along a side, given or from the pattern. */
function studSpacing(plan: PlanInput): { mm: number; assumed: boolean } {
  if (plan.engine.studSpacingMm !== undefined) return { mm: plan.engine.studSpacingMm, assumed: false };
  const banks = plan.engine.layout === "V" ? 2 : 1;
  const perBank = plan.engine.cylinders / banks;
  const perSide = plan.studs.length / (2 * banks);
  // assumption (common practice): bores sit about 1.15 bores apart; the side's studs span the bank
  const bankLength = perBank * 1.15 * plan.engine.boreMm;
  return { mm: perSide > 1 ? bankLength / (perSide - 1) : bankLength, assumed: true };
}

export function prepare(plan: PlanInput): Prepared {
  const f = plan.fastener;
  const threadForm: ThreadForm = f.threadForm ?? (looksUnified(f.diameterMm, f.pitchMm) ? "unified" : "iso");
  const thread = threadGeometry(f.diameterMm, f.pitchMm, threadForm);
  const torqueGeometry: TorqueGeometry = {
    pitchMm: f.pitchMm,
    pitchDiameterMm: thread.pitchDiameterMm,
    bearingDiameterMm: bearingDiameterMm(frictionFaceOdMm(f), f.washerHoleMm),
  };
  const friction = { thread: plan.tightening.threadFriction, bearing: plan.tightening.bearingFriction };
  const grip = gripLengthMm(plan);
  const stud = studStiffness({
    thread,
    modulusMpa: f.modulusMpa,
    gripMm: grip,
    reducedShankDiameterMm: f.reducedShankDiameterMm,
    reducedShankLengthMm: f.reducedShankLengthMm,
    freeThreadLengthMm: f.freeThreadLengthMm,
    blockModulusMpa: plan.block.modulusMpa,
  });
  const layers: Layer[] = [];
  if (f.washerThicknessMm > 0) layers.push({ name: "washer", thicknessMm: f.washerThicknessMm, modulusMpa: f.modulusMpa });
  layers.push({ name: "head", thicknessMm: plan.head.thicknessAtStudMm, modulusMpa: plan.head.modulusMpa });
  layers.push({ name: "gasket", thicknessMm: plan.gasket.compressedThicknessMm, modulusMpa: plan.gasket.bodyModulusMpa });
  if (plan.block.clampedDepthMm > 0)
    layers.push({ name: "block", thicknessMm: plan.block.clampedDepthMm, modulusMpa: plan.block.modulusMpa });
  const spacing = studSpacing(plan);
  // VDI 2230 Part 1: the substitute body's outside diameter DA is limited by the neighbouring studs
  const coneLimitMm = spacing.mm;
  // Shigley §8-5: cones from the washer face at the top and 1.5·d at the bottom, hole = d
  const member = memberStiffness(layers, f.diameterMm, f.washerOdMm, 1.5 * f.diameterMm, coneLimitMm);
  const headIndex = layers.findIndex((l) => l.name === "head");
  // Wileman fit with the stack's series-average modulus, as a cross-check only
  let tOverE = 0;
  for (const l of layers) tOverE += l.thicknessMm / l.modulusMpa;
  const wilemanNPerMm = wilemanMemberStiffness(grip / tOverE, f.diameterMm, grip, "general");
  const C = jointConstant(stud.stiffnessNPerMm, member.stiffnessNPerMm);
  let below = 0;
  layers.forEach((l, i) => {
    if (l.name === "gasket" || l.name === "block") below += member.layerCompliance[i];
  });
  const phi = loadFactorAtInnerPlane(stud.complianceMmPerN, member.complianceMmPerN, below);

  // VDI 2230: A0 is the smallest section (stress area or reduced shank), d0 its diameter
  const reduced = f.reducedShankDiameterMm !== undefined && f.reducedShankDiameterMm < thread.stressDiameterMm;
  const section = reduced
    ? { areaMm2: circleAreaMm2(f.reducedShankDiameterMm as number), diameterMm: f.reducedShankDiameterMm as number }
    : { areaMm2: thread.stressAreaMm2, diameterMm: thread.stressDiameterMm };
  const stressPerN = tighteningStressPerN(thread, section, friction.thread);

  const g = plan.gasket;
  const typical = TYPICAL_GASKETS[g.type];
  const sleeve = plan.sleeve;
  const deck = deckPlate(plan);
  const build: SealLineBuild = {
    sealDiameterMm: g.sealDiameterMm,
    ringWidthMm: g.ringWidthMm,
    gasketThicknessMm: g.compressedThicknessMm,
    ringModulusMpa: g.ringModulusMpa,
    headModulusMpa: plan.head.modulusMpa,
    landModulusMpa: sleeve.kind === "none" ? plan.block.modulusMpa : sleeve.modulusMpa,
    deck,
    blockDeck:
      sleeve.kind === "wet-flange" || sleeve.kind === "wet-mid"
        ? undefined
        : { thicknessMm: plan.block.deckThicknessMm ?? deck.thicknessMm, modulusMpa: plan.block.modulusMpa },
    sleeve:
      sleeve.kind === "wet-flange" || sleeve.kind === "wet-mid"
        ? { boreMm: plan.engine.boreMm, wallMm: sleeve.wallMm, supportLengthMm: sleeve.supportLengthMm, modulusMpa: sleeve.modulusMpa }
        : undefined,
  };
  const lineNPerMm = sealLineStiffness(build);
  const bodyNPerMm = gasketBodyStiffness(g.bodyModulusMpa, g.bodyAreaPerBoreMm2, g.compressedThicknessMm);
  const gapMm = effectiveGapMm(plan.sealing.sleeveProtrusionMm, plan.sealing.wireProjectionMm, plan.sealing.receiverGrooveDepthMm);
  const landYield = sleeve.kind === "none" ? plan.block.yieldMpa : sleeve.yieldMpa;
  const softestYield = Math.min(g.sealLineYieldMpa, plan.head.yieldMpa ?? Infinity, landYield ?? Infinity);
  // ours: contact pressure on the band is capped by the softer face's hardness (published for
  // annealed copper); without a hardness, a few times the softest yield
  const hardness =
    g.sealLineHardnessMpa ?? (g.type === "solid-copper" ? typical.sealLineHardnessMpa : plan.model.indentationFactor * softestYield);
  const lineLimitN = hardness * sealBandAreaMm2(g.sealDiameterMm, g.ringWidthMm);
  const elements: PathElement[] = [];
  if (g.type === "mls") {
    // ours: the bead as a spring over its travel, then the stopper carries (MLS = bead + stopper)
    const travel = g.beadTravelMm ?? (typical.beadTravelMm as number);
    const beadLoad = (g.beadLoadNPerMm ?? (typical.beadLoadNPerMm as number)) * Math.PI * g.sealDiameterMm;
    const beadK = beadLoad / travel;
    // the bead in series with the same surround as the stopper (the deck bends under both)
    const beadSeries = 1 / (1 / beadK + surroundCompliance(build));
    elements.push({ kind: "bead", seal: true, kNPerMm: beadSeries, engageMm: Math.max(0, -gapMm), limitN: Infinity });
    elements.push({ kind: "stopper", seal: true, kNPerMm: lineNPerMm, engageMm: Math.max(0, -gapMm) + travel, limitN: lineLimitN });
    elements.push({ kind: "body", seal: false, kNPerMm: bodyNPerMm, engageMm: travel + Math.max(0, gapMm), limitN: Infinity });
  } else {
    elements.push({ kind: "ring", seal: true, kNPerMm: lineNPerMm, engageMm: Math.max(0, -gapMm), limitN: lineLimitN });
    elements.push({ kind: "body", seal: false, kNPerMm: bodyNPerMm, engageMm: Math.max(0, gapMm), limitN: Infinity });
  }

  const firing = plan.firing;
  const peakPressureMpa = firing.mode === "entered" ? firing.peakPressureMpa : estimatePeakPressure(firing).peakMpa;
  const requirement = sealRequirement(g, peakPressureMpa);
  const bodySealPressureMpa = g.bodySealPressureMpa ?? typical.bodySealPressureMpa;

  // Shares in CSR form; firing load of each bore goes back to its studs in proportion to their shares
  const cylinders = plan.engine.cylinders;
  const studCount = plan.studs.length;
  let nnz = 0;
  for (const s of plan.studs) nnz += s.serves.length;
  const start = new Int32Array(studCount + 1);
  const boreOf = new Int32Array(nnz);
  const shareOf = new Float64Array(nnz);
  const boreStudWeight = new Float64Array(cylinders);
  let k = 0;
  for (let s = 0; s < studCount; s++) {
    start[s] = k;
    for (const sv of plan.studs[s].serves) {
      boreOf[k] = sv.cylinder - 1;
      shareOf[k] = sv.share;
      boreStudWeight[sv.cylinder - 1] += sv.share;
      k++;
    }
  }
  start[studCount] = k;
  const sameWeightAs = new Int32Array(cylinders);
  for (let b = 0; b < cylinders; b++) {
    let first = b;
    for (let a = 0; a < b; a++)
      if (boreStudWeight[a] === boreStudWeight[b]) {
        first = a;
        break;
      }
    sameWeightAs[b] = first;
  }
  const H = requirement.pressureForceN;
  const studExternalN = new Float64Array(studCount);
  const studPeakFiringN = new Float64Array(studCount);
  let peakFiringN = 0;
  for (let s = 0; s < studCount; s++) {
    let sum = 0;
    let peak = 0;
    for (let j = start[s]; j < start[s + 1]; j++) {
      // ours: each bore's gas force goes back to its studs in proportion to their shares
      const fromBore = (H * shareOf[j]) / boreStudWeight[boreOf[j]];
      sum += fromBore;
      // common practice: the cylinders fire one after another, never two neighbours at once
      peak = Math.max(peak, fromBore);
    }
    studExternalN[s] = sum;
    studPeakFiringN[s] = peak;
    peakFiringN = Math.max(peakFiringN, peak);
  }

  const t = plan.temperatures;
  const headLayer = headIndex >= 0 ? member.layerCompliance[headIndex] : 0;
  const thermalChangeN = thermalPreloadChangeN({
    members: [
      { thicknessMm: f.washerThicknessMm, expansionUmPerMC: f.expansionUmPerMC, temperatureC: t.headC },
      { thicknessMm: plan.head.thicknessAtStudMm, expansionUmPerMC: plan.head.expansionUmPerMC, temperatureC: t.headC },
      { thicknessMm: g.compressedThicknessMm, expansionUmPerMC: g.expansionUmPerMC, temperatureC: (t.headC + t.blockC) / 2 },
      { thicknessMm: plan.block.clampedDepthMm, expansionUmPerMC: plan.block.expansionUmPerMC, temperatureC: t.blockC },
    ],
    studLengthMm: grip,
    studExpansionUmPerMC: f.expansionUmPerMC,
    studTemperatureC: t.studC,
    assemblyTemperatureC: t.assemblyC,
    studComplianceMmPerN: stud.complianceMmPerN,
    memberComplianceMmPerN: member.complianceMmPerN,
  });
  // VDI 2230 interfaces: two threads (nut, block), the nut face, and the inner joints
  // head/gasket, gasket/deck, and washer/head when there is a washer
  const embedMm = embeddingMm(plan.surfaceRoughness, { threads: 2, bearings: 1, innerInterfaces: 2 + (f.washerThicknessMm > 0 ? 1 : 0) });

  const washer = washerBearing(
    {
      washerOdMm: f.washerOdMm,
      washerHoleMm: f.washerHoleMm,
      washerThicknessMm: f.washerThicknessMm,
      nutFaceOdMm: Math.min(f.washerOdMm, f.nutFaceOdMm ?? 1.45 * f.diameterMm),
      ...(f.washerHardnessHv !== undefined ? { washerHardnessHv: f.washerHardnessHv } : {}),
    },
    plan.head.limitingSurfacePressureMpa,
  );
  return {
    plan,
    threadForm,
    thread,
    torqueGeometry,
    friction,
    torquePerPreloadMm: torquePerPreloadMm(torqueGeometry, friction),
    tighteningFactor: plan.tightening.tighteningFactor ?? TIGHTENING_FACTOR[plan.tightening.method],
    stud,
    member,
    layers,
    coneLimitMm,
    studSpacingMm: spacing.mm,
    studSpacingAssumed: spacing.assumed,
    wilemanNPerMm,
    C,
    phi,
    section,
    stressPerN,
    studLimitMpa: plan.model.studLimitFraction * f.yieldMpa,
    // geometry: annulus under the washer π/4·(dw² − dh²), narrowed for a soft washer (washer.ts)
    bearingAreaMm2: washer.headAreaMm2,
    bearingCapacityN: washer.capacityN,
    washer,
    headComplianceMmPerN: headLayer,
    deck,
    paths: { elements },
    gapMm,
    lineNPerMm,
    bodyNPerMm,
    lineLimitN,
    requirement,
    bodyRequirementN: bodySealPressureMpa * g.bodyAreaPerBoreMm2,
    bodySealPressureMpa,
    bodySealAssumed: g.bodySealPressureMpa === undefined,
    peakPressureMpa,
    peakEstimated: firing.mode === "estimated",
    cylinders,
    studCount,
    start,
    boreOf,
    shareOf,
    boreStudWeight,
    sameWeightAs,
    stopperIndex: elements.findIndex((e) => e.kind === "stopper"),
    memo: {},
    studExternalN,
    studPeakFiringN,
    peakFiringN,
    // VDI 2230 Part 1 (load introduced at the gasket plane): the gasket and block lose (1 − Φn)·FA
    reliefPerBoreN: (1 - phi) * H,
    thermalChangeN,
    embedMm,
    embeddingLossN: embeddingLossN(embedMm, stud.complianceMmPerN, member.complianceMmPerN),
    relaxationFraction: g.relaxationPercent / 100,
  };
}

/** Nominal preload (N) for a torque (N·m) with the plan's friction. */
export function preloadForTorque(p: Prepared, torqueNm: number): number {
  // ISO 16047 long form, solved for F
  return (torqueNm * 1000) / p.torquePerPreloadMm;
}

/** Torque (N·m) for a nominal preload (N). */
export function torqueForPreloadNm(p: Prepared, preloadN: number): number {
  // ISO 16047 long form
  return (preloadN * p.torquePerPreloadMm) / 1000;
}

/** Preload after heat, embedding and relaxation (never below zero). */
export function hotSettledPreload(p: Prepared, preloadN: number): number {
  // VDI 2230: F_running = F_M − F_Z − relaxation + ΔF_thermal
  return Math.max(0, preloadN * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN);
}
