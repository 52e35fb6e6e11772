// Everything about a plan that does not depend on the torque, computed once and reused by the
// evaluation, the sweep, the uncertainty run and the suggestion.
import { estimatePeakPressure } from "../chamber/peak-pressure";
import type { PlanInput } from "./schema";
import { gripLengthMm } from "./schema";
import { asmeRequirement, effectiveGapMm, gasketBodyStiffness, sealBandAreaMm2, sealLineStiffness, type AsmeRequirement, type SealSprings } from "./seal";
import { jointConstant, memberStiffness, studStiffness, wilemanMemberStiffness, type Layer, type MemberStiffness, type StudStiffness } from "./stiffness";
import { embeddingLossN, embeddingMm, thermalPreloadChangeN } from "./thermal";
import { circleAreaMm2, threadGeometry, type ThreadGeometry } from "./thread";
import { bearingDiameterMm, TIGHTENING_FACTOR, tighteningStressPerN, torquePerPreloadMm, type Friction, type TorqueGeometry } from "./torque";

export interface Prepared {
  plan: PlanInput;
  thread: ThreadGeometry;
  torqueGeometry: TorqueGeometry;
  friction: Friction;
  /** Torque per preload, N·mm per N. */
  torquePerPreloadMm: number;
  tighteningFactor: number;
  stud: StudStiffness;
  member: MemberStiffness;
  layers: Layer[];
  wilemanNPerMm: number;
  C: number;
  stressPerN: { axial: number; torsion: number; equivalent: number };
  studLimitMpa: number;
  bearingAreaMm2: number;
  headComplianceMmPerN: number;
  springs: SealSprings;
  /** k_r/(k_r + k_b). */
  contactShare: number;
  /** Bore clamp at which the body starts to carry load (0 when it carries from the start). */
  bodyTouchClampN: number;
  /** Bore clamp at which the seal line reaches its indentation limit. */
  lineYieldClampN: number;
  asme: AsmeRequirement;
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
  /** Firing load each stud carries (external P per stud). */
  studExternalN: Float64Array;
  /** (1 − C)·H, clamp that firing takes off each bore. */
  reliefPerBoreN: number;
  thermalChangeN: number;
  embedMm: number;
  embeddingLossN: number;
  relaxationFraction: number;
}

export function prepare(plan: PlanInput): Prepared {
  const f = plan.fastener;
  const thread = threadGeometry(f.diameterMm, f.pitchMm);
  const torqueGeometry: TorqueGeometry = {
    pitchMm: f.pitchMm,
    pitchDiameterMm: thread.pitchDiameterMm,
    bearingDiameterMm: bearingDiameterMm(f.washerOdMm, f.washerHoleMm),
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
  // Shigley §8-5: cones from the washer face at the top and 1.5·d at the bottom, hole = d
  const member = memberStiffness(layers, f.diameterMm, f.washerOdMm, 1.5 * f.diameterMm);
  const headIndex = layers.findIndex((l) => l.name === "head");
  // Wileman fit with the stack's series-average modulus, as a cross-check only
  let tOverE = 0;
  for (const l of layers) tOverE += l.thicknessMm / l.modulusMpa;
  const wilemanNPerMm = wilemanMemberStiffness(grip / tOverE, f.diameterMm, grip, "general");
  const C = jointConstant(stud.stiffnessNPerMm, member.stiffnessNPerMm);

  // VDI 2230: A0 is the smallest section (stress area or reduced shank), d0 its diameter
  const reduced = f.reducedShankDiameterMm !== undefined && f.reducedShankDiameterMm < thread.stressDiameterMm;
  const section = reduced
    ? { areaMm2: circleAreaMm2(f.reducedShankDiameterMm as number), diameterMm: f.reducedShankDiameterMm as number }
    : { areaMm2: thread.stressAreaMm2, diameterMm: thread.stressDiameterMm };
  const stressPerN = tighteningStressPerN(thread, section, friction.thread);

  const g = plan.gasket;
  const sleeve = plan.sleeve;
  const landModulusMpa = sleeve.kind === "none" ? plan.block.modulusMpa : sleeve.modulusMpa;
  const lineNPerMm = sealLineStiffness({
    sealDiameterMm: g.sealDiameterMm,
    ringWidthMm: g.ringWidthMm,
    gasketThicknessMm: g.compressedThicknessMm,
    ringModulusMpa: g.ringModulusMpa,
    headModulusMpa: plan.head.modulusMpa,
    landModulusMpa,
    sleeve:
      sleeve.kind === "wet-flange" || sleeve.kind === "wet-mid"
        ? { boreMm: plan.engine.boreMm, wallMm: sleeve.wallMm, supportLengthMm: sleeve.supportLengthMm, modulusMpa: sleeve.modulusMpa }
        : undefined,
  });
  const bodyNPerMm = gasketBodyStiffness(g.bodyModulusMpa, g.bodyAreaPerBoreMm2, g.compressedThicknessMm);
  const gapMm = effectiveGapMm(plan.sealing.sleeveProtrusionMm, plan.sealing.wireProjectionMm, plan.sealing.receiverGrooveDepthMm);
  const landYield = sleeve.kind === "none" ? plan.block.yieldMpa : sleeve.yieldMpa;
  const softest = Math.min(g.sealLineYieldMpa, plan.head.yieldMpa ?? Infinity, landYield ?? Infinity);
  // ours: indentation limit = a few × the softer material's yield, over the band area
  const lineLimitN = plan.model.indentationFactor * softest * sealBandAreaMm2(g.sealDiameterMm, g.ringWidthMm);
  const springs: SealSprings = { lineNPerMm, bodyNPerMm, gapMm, lineLimitN };
  const contactShare = lineNPerMm / (lineNPerMm + bodyNPerMm);
  const bodyTouchClampN = gapMm > 0 ? lineNPerMm * gapMm : 0;
  let lineYieldClampN: number;
  if (gapMm >= 0) {
    const touch = lineNPerMm * gapMm;
    lineYieldClampN = lineLimitN <= touch ? lineLimitN : touch + (lineLimitN - touch) / contactShare;
  } else {
    lineYieldClampN = bodyNPerMm * -gapMm + lineLimitN / contactShare;
  }

  const firing = plan.firing;
  let peakPressureMpa: number;
  if (firing.mode === "entered") peakPressureMpa = firing.peakPressureMpa;
  else peakPressureMpa = estimatePeakPressure(firing).peakMpa;
  const asme = asmeRequirement(g.sealDiameterMm, g.ringWidthMm, peakPressureMpa, g.m, g.yMpa);

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
  const H = asme.pressureForceN;
  const studExternalN = new Float64Array(studCount);
  for (let s = 0; s < studCount; s++) {
    let p = 0;
    for (let j = start[s]; j < start[s + 1]; j++) p += (H * shareOf[j]) / boreStudWeight[boreOf[j]];
    studExternalN[s] = p;
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
  const embedMm = embeddingMm(plan.surfaceRoughness, {
    threads: 2,
    bearings: 1,
    innerInterfaces: 2 + (f.washerThicknessMm > 0 ? 1 : 0),
  });

  return {
    plan,
    thread,
    torqueGeometry,
    friction,
    torquePerPreloadMm: torquePerPreloadMm(torqueGeometry, friction),
    tighteningFactor: plan.tightening.tighteningFactor ?? TIGHTENING_FACTOR[plan.tightening.method],
    stud,
    member,
    layers,
    wilemanNPerMm,
    C,
    stressPerN,
    studLimitMpa: plan.model.studLimitFraction * f.yieldMpa,
    // geometry: annulus under the washer π/4·(dw² − dh²)
    bearingAreaMm2: circleAreaMm2(f.washerOdMm) - circleAreaMm2(f.washerHoleMm),
    headComplianceMmPerN: headLayer,
    springs,
    contactShare,
    bodyTouchClampN,
    lineYieldClampN,
    asme,
    peakPressureMpa,
    peakEstimated: firing.mode === "estimated",
    cylinders,
    studCount,
    start,
    boreOf,
    shareOf,
    boreStudWeight,
    studExternalN,
    // Shigley §8-7: the members lose (1 − C)·P
    reliefPerBoreN: (1 - C) * H,
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

/** Preload after heat, embedding and relaxation (never below zero). */
export function hotSettledPreload(p: Prepared, preloadN: number): number {
  // VDI 2230: F_running = F_M − F_Z − relaxation + ΔF_thermal
  return Math.max(0, preloadN * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN);
}
