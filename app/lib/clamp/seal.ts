// The seal of one bore: seal line and gasket body as two springs with a gap (ours), and the
// ASME VIII-1 Appendix 2 seal requirement used as a conservative published criterion.
import { seriesCompliance, type Section } from "./stiffness";

export interface SealLineBuild {
  /** Mean diameter of the seal-line contact band (G for a narrow band). */
  sealDiameterMm: number;
  /** Radial width of the contact band (ring width or wire contact width). */
  ringWidthMm: number;
  gasketThicknessMm: number;
  ringModulusMpa: number;
  headModulusMpa: number;
  /** Modulus under the ring: sleeve top, or the deck land when there is no sleeve. */
  landModulusMpa: number;
  /** A wet sleeve between its top and the seat that carries it (0 when the block backs it). */
  sleeve?: { boreMm: number; wallMm: number; supportLengthMm: number; modulusMpa: number };
}

/** Contact area of the seal band. */
export function sealBandAreaMm2(sealDiameterMm: number, ringWidthMm: number): number {
  return Math.PI * sealDiameterMm * ringWidthMm;
}

/** Seal-line stiffness k_r: head face, ring, land (and a wet sleeve) in series. */
export function sealLineStiffness(b: SealLineBuild): number {
  const area = sealBandAreaMm2(b.sealDiameterMm, b.ringWidthMm);
  const sections: Section[] = [
    // ours: the ring as a column of its contact area through the gasket thickness
    { lengthMm: b.gasketThicknessMm, areaMm2: area, modulusMpa: b.ringModulusMpa },
    // ours: head face and land each as a local zone one band width deep
    { lengthMm: b.ringWidthMm, areaMm2: area, modulusMpa: b.headModulusMpa },
    { lengthMm: b.ringWidthMm, areaMm2: area, modulusMpa: b.landModulusMpa },
  ];
  if (b.sleeve && b.sleeve.supportLengthMm > 0) {
    const { boreMm, wallMm, supportLengthMm, modulusMpa } = b.sleeve;
    // ours: a wet sleeve wall as a tube between its top and its seat
    sections.push({ lengthMm: supportLengthMm, areaMm2: Math.PI * (boreMm + wallMm) * wallMm, modulusMpa });
  }
  return 1 / seriesCompliance(sections);
}

/** Gasket body stiffness k_b for the body area assigned to one bore. */
export function gasketBodyStiffness(modulusMpa: number, areaMm2: number, thicknessMm: number): number {
  // ours: the body as a column k = E·A/t (effective modulus of the body as entered)
  return (modulusMpa * areaMm2) / thicknessMm;
}

export interface SealSprings {
  /** k_r, N/mm. */
  lineNPerMm: number;
  /** k_b, N/mm. */
  bodyNPerMm: number;
  /** Gap g the seal line stands proud by (negative: recessed). */
  gapMm: number;
  /** Largest load the seal line carries before it flows (indentation limit). */
  lineLimitN: number;
}

export function effectiveGapMm(protrusionMm: number, wireProjectionMm: number, receiverDepthMm: number): number {
  // ours (DESIGN.md): g = sleeve protrusion + wire projection not sunk in a receiver groove
  return protrusionMm + Math.max(0, wireProjectionMm - receiverDepthMm);
}

export interface SealSplit {
  lineN: number;
  bodyN: number;
  /** dF_r/dF at this clamp. */
  marginalShare: number;
  /** True once the seal line is at its indentation limit. */
  lineYielded: boolean;
}

/** Elastic seal-line load for a bore clamp F, before the indentation cap. */
function elasticLine(clampN: number, s: SealSprings): { lineN: number; share: number } {
  const share = s.lineNPerMm / (s.lineNPerMm + s.bodyNPerMm);
  if (s.gapMm >= 0) {
    const touch = s.lineNPerMm * s.gapMm;
    // ours (DESIGN.md): F ≤ k_r·g → F_r = F
    if (clampN <= touch) return { lineN: clampN, share: 1 };
    // ours (DESIGN.md): F_r = k_r·g + (F − k_r·g)·k_r/(k_r + k_b)
    return { lineN: touch + (clampN - touch) * share, share };
  }
  // ours: a recessed seal line — the body carries F alone until it has closed the gap
  const touch = s.bodyNPerMm * -s.gapMm;
  if (clampN <= touch) return { lineN: 0, share: 0 };
  return { lineN: (clampN - touch) * share, share };
}

/** Split a bore's clamp between the seal line and the body (paths that yield: ours). */
export function splitClamp(clampN: number, s: SealSprings): SealSplit {
  const F = Math.max(0, clampN);
  const e = elasticLine(F, s);
  // ours: the seal line stops stiffening at its indentation limit; the rest goes to the body
  if (e.lineN >= s.lineLimitN) {
    return { lineN: s.lineLimitN, bodyN: F - s.lineLimitN, marginalShare: 0, lineYielded: true };
  }
  return { lineN: e.lineN, bodyN: F - e.lineN, marginalShare: e.share, lineYielded: false };
}

/**
 * Seal-line load left when firing takes `reliefN` = (1 − C)·P off the bore's clamp.
 * ours (DESIGN.md): off both paths in proportion to their stiffness while the body still
 * carries load (the elastic reverse of loading), then off the seal line alone.
 */
export function unloadSealLine(split: SealSplit, reliefN: number, s: SealSprings): number {
  const share = s.lineNPerMm / (s.lineNPerMm + s.bodyNPerMm);
  const relief = Math.max(0, reliefN);
  if (split.bodyN <= 0) return split.lineN - relief;
  const bodyGone = split.bodyN / (1 - share);
  if (relief <= bodyGone) return split.lineN - share * relief;
  return split.lineN - share * bodyGone - (relief - bodyGone);
}

export interface AsmeRequirement {
  /** Basic seating width b0 = N/2 (flat ring, ASME Table 2-5.2 sketch 1a). */
  basicWidthMm: number;
  /** Effective seating width b. */
  effectiveWidthMm: number;
  /** Reaction diameter G. */
  reactionDiameterMm: number;
  /** H = π/4·G²·P, the end force of the pressure. */
  pressureForceN: number;
  /** Hp = 2·b·π·G·m·P, the contact load the gasket needs in operation. */
  operatingContactN: number;
  /** Wm1 = H + Hp. */
  operatingBoltLoadN: number;
  /** Wm2 = π·b·G·y, the seating load. */
  seatingLoadN: number;
}

/**
 * ASME BPVC VIII-1 Appendix 2 loads for a flat ring of width N whose mean diameter is given.
 * These are flange design values used here as a conservative published criterion, not head-gasket data.
 */
export function asmeRequirement(
  meanDiameterMm: number,
  widthMm: number,
  pressureMpa: number,
  m: number,
  yMpa: number,
): AsmeRequirement {
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
