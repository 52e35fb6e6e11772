// Stud and member stiffness, and the joint constant. Stiffness in N/mm, compliance in mm/N.
import { circleAreaMm2, type ThreadGeometry } from "./thread";

export interface Section {
  lengthMm: number;
  areaMm2: number;
  modulusMpa: number;
}

/** Compliance of prismatic sections in series. */
export function seriesCompliance(sections: readonly Section[]): number {
  // Shigley §8-4 / VDI 2230: 1/k = Σ li/(E·Ai)
  let c = 0;
  for (const s of sections) c += s.lengthMm / (s.modulusMpa * s.areaMm2);
  return c;
}

/** Bolt stiffness from one unthreaded and one threaded length in the grip (cross-check form). */
export function shigleyBoltStiffness(a: {
  shankAreaMm2: number;
  stressAreaMm2: number;
  modulusMpa: number;
  threadLengthMm: number;
  shankLengthMm: number;
}): number {
  // Shigley eq. 8-17: kb = Ad·At·E/(Ad·lt + At·ld)
  return (a.shankAreaMm2 * a.stressAreaMm2 * a.modulusMpa) / (a.shankAreaMm2 * a.threadLengthMm + a.stressAreaMm2 * a.shankLengthMm);
}

export interface StudBuild {
  thread: ThreadGeometry;
  modulusMpa: number;
  /** Clamp length lK (nut face to the top of the engaged thread in the block). */
  gripMm: number;
  reducedShankDiameterMm?: number;
  reducedShankLengthMm: number;
  freeThreadLengthMm: number;
  blockModulusMpa: number;
}

export interface StudStiffness {
  sections: Section[];
  complianceMmPerN: number;
  stiffnessNPerMm: number;
  fullShankLengthMm: number;
}

/** Stud stiffness: its sections in the grip plus the allowances at both threaded ends. */
export function studStiffness(s: StudBuild): StudStiffness {
  const d = s.thread.diameterMm;
  const aN = s.thread.nominalAreaMm2;
  const a3 = s.thread.minorAreaMm2;
  const E = s.modulusMpa;
  const fullShankLengthMm = Math.max(0, s.gripMm - s.reducedShankLengthMm - s.freeThreadLengthMm);
  const sections: Section[] = [];
  if (s.reducedShankLengthMm > 0 && s.reducedShankDiameterMm) {
    sections.push({
      lengthMm: s.reducedShankLengthMm,
      areaMm2: circleAreaMm2(s.reducedShankDiameterMm),
      modulusMpa: E,
    });
  }
  if (fullShankLengthMm > 0) sections.push({ lengthMm: fullShankLengthMm, areaMm2: aN, modulusMpa: E });
  // VDI 2230: free loaded thread on the minor-diameter area
  if (s.freeThreadLengthMm > 0) sections.push({ lengthMm: s.freeThreadLengthMm, areaMm2: a3, modulusMpa: E });
  // VDI 2230 (from memory): engaged thread 0.5·d on Ad3, nut 0.4·d on AN — nut end
  sections.push({ lengthMm: 0.5 * d, areaMm2: a3, modulusMpa: E });
  sections.push({ lengthMm: 0.4 * d, areaMm2: aN, modulusMpa: E });
  // VDI 2230 (from memory): stud in a tapped block, 0.5·d on Ad3 and 0.33·d on AN with the block's E
  sections.push({ lengthMm: 0.5 * d, areaMm2: a3, modulusMpa: E });
  sections.push({ lengthMm: 0.33 * d, areaMm2: aN, modulusMpa: s.blockModulusMpa });
  const complianceMmPerN = seriesCompliance(sections);
  return { sections, complianceMmPerN, stiffnessNPerMm: 1 / complianceMmPerN, fullShankLengthMm };
}

/** Stiffness of one frustum of a 30° pressure cone. */
export function frustumStiffness(modulusMpa: number, thicknessMm: number, smallDiameterMm: number, holeMm: number): number {
  const t = thicknessMm;
  const D = smallDiameterMm;
  const d = holeMm;
  // Shigley eq. 8-20 (30° cone): k = 0.5774·π·E·d / ln[(1.155t + D − d)(D + d)/((1.155t + D + d)(D − d))]
  const ratio = ((1.155 * t + D - d) * (D + d)) / ((1.155 * t + D + d) * (D - d));
  return (0.5774 * Math.PI * modulusMpa * d) / Math.log(ratio);
}

export interface Layer {
  name: string;
  thicknessMm: number;
  modulusMpa: number;
}

export interface MemberStiffness {
  complianceMmPerN: number;
  stiffnessNPerMm: number;
  /** Compliance of each layer, same order as the input layers. */
  layerCompliance: number[];
  gripMm: number;
}

/**
 * Compliance of one layer's part in a cone, from depth a to b below the cone's start, where the
 * cone's diameter is D0 at the start. Past the limiting outside diameter DA the cone becomes a
 * cylinder of that diameter (VDI 2230 Part 1 substitute body: cone, then sleeve, when DA is small).
 */
function coneLayerCompliance(E: number, a: number, b: number, D0: number, hole: number, DA: number): number {
  // Shigley §8-5: cone angle 30°, so diameter grows by 2·tan 30° = 1.155 per unit depth
  const grow = 1.155;
  const zLimit = (DA - D0) / grow;
  let c = 0;
  const coneEnd = Math.min(b, Math.max(a, zLimit));
  if (coneEnd > a) c += 1 / frustumStiffness(E, coneEnd - a, D0 + grow * a, hole);
  const sleeveStart = Math.max(a, Math.min(b, zLimit));
  if (b > sleeveStart) {
    // VDI 2230 Part 1: the part beyond DA as a sleeve, δ = l/(E·π/4·(DA² − dh²))
    c += (b - sleeveStart) / (E * (circleAreaMm2(DA) - circleAreaMm2(hole)));
  }
  return c;
}

/**
 * Member stiffness of a stack with cones from both ends meeting at mid-grip.
 * Top cone starts at the washer face (topDiameterMm), bottom cone at 1.5·d; neither grows past the
 * limiting outside diameter (the stud spacing: a neighbour's cone takes the material beyond it).
 */
export function memberStiffness(
  layers: readonly Layer[],
  holeMm: number,
  topDiameterMm: number,
  bottomDiameterMm: number,
  limitDiameterMm: number = Infinity,
): MemberStiffness {
  let grip = 0;
  for (const l of layers) grip += l.thicknessMm;
  const mid = grip / 2;
  const DA = Math.max(limitDiameterMm, Math.max(topDiameterMm, bottomDiameterMm) * 1.0001);
  const layerCompliance: number[] = [];
  let z = 0;
  let total = 0;
  for (const l of layers) {
    const z1 = z;
    const z2 = z + l.thicknessMm;
    let c = 0;
    // part of the layer in the upper cone, measured from the top
    if (z1 < mid && Math.min(z2, mid) > z1) c += coneLayerCompliance(l.modulusMpa, z1, Math.min(z2, mid), topDiameterMm, holeMm, DA);
    // part of the layer in the lower cone, measured from the bottom
    if (z2 > mid && grip - Math.max(z1, mid) > grip - z2)
      c += coneLayerCompliance(l.modulusMpa, grip - z2, grip - Math.max(z1, mid), bottomDiameterMm, holeMm, DA);
    layerCompliance.push(c);
    total += c;
    z = z2;
  }
  return { complianceMmPerN: total, stiffnessNPerMm: 1 / total, layerCompliance, gripMm: grip };
}

export type WilemanMaterial = "steel" | "aluminium" | "gray-cast-iron" | "general";

/** Wileman, Choudury and Green (1991), Shigley table 8-8: A and B. */
export const WILEMAN: Record<WilemanMaterial, { A: number; B: number }> = {
  steel: { A: 0.78715, B: 0.62873 },
  aluminium: { A: 0.7967, B: 0.63816 },
  "gray-cast-iron": { A: 0.77871, B: 0.61616 },
  general: { A: 0.78952, B: 0.62914 },
};

/** Wileman's exponential fit for a member of one material (cross-check). */
export function wilemanMemberStiffness(modulusMpa: number, diameterMm: number, gripMm: number, material: WilemanMaterial): number {
  const { A, B } = WILEMAN[material];
  // Wileman et al. 1991 (Shigley eq. 8-23): km = E·d·A·exp(B·d/l)
  return modulusMpa * diameterMm * A * Math.exp((B * diameterMm) / gripMm);
}

/** Joint constant C. */
export function jointConstant(studNPerMm: number, memberNPerMm: number): number {
  // Shigley §8-7: C = kb/(kb + km)
  return studNPerMm / (studNPerMm + memberNPerMm);
}

export interface JointUnderLoad {
  studLoadN: number;
  memberLoadN: number;
  /** External load per stud that opens the joint. */
  separationLoadN: number;
}

/**
 * Stud and clamped-part loads under an external load P per stud. `phi` is the load factor: Shigley's
 * C when P enters under the nut and at the thread (n = 1), VDI 2230's Φn = n·C when it enters inside.
 */
export function jointUnderLoad(preloadN: number, externalN: number, phi: number): JointUnderLoad {
  return {
    // Shigley §8-7 / VDI 2230 Part 1: FS = FV + Φ·FA
    studLoadN: preloadN + phi * externalN,
    // Shigley §8-7 / VDI 2230 Part 1: FK = FV − (1 − Φ)·FA
    memberLoadN: preloadN - (1 - phi) * externalN,
    // Shigley §8-7 / VDI 2230 Part 1: opening at FA = FV/(1 − Φ)
    separationLoadN: preloadN / (1 - phi),
  };
}

/**
 * Load factor Φn for a load that enters at an inner plane of the joint (VDI 2230 Part 1, load
 * introduction factor n; docs/references.md §4). The gas load acts on the fire deck at the gasket plane: the
 * head sits on the stud's side, and only the parts below the plane (gasket, block, sleeve) are relieved.
 * From the two compatibility conditions: Φn = δ_below/(δS + δP), so those parts lose (1 − Φn)·FA.
 */
export function loadFactorAtInnerPlane(
  studComplianceMmPerN: number,
  memberComplianceMmPerN: number,
  belowComplianceMmPerN: number,
): number {
  // VDI 2230 Part 1: Φn = n·δP/(δS + δP) with n·δP = δ of the parts between the load planes
  return belowComplianceMmPerN / (studComplianceMmPerN + memberComplianceMmPerN);
}
