// Thread geometry of the basic profile. Millimetres in, millimetres out.

export interface ThreadGeometry {
  /** Nominal (major) diameter d. */
  diameterMm: number;
  pitchMm: number;
  /** Pitch diameter d2. */
  pitchDiameterMm: number;
  /** Minor diameter d3 used for stress (external thread, basic profile). */
  minorDiameterMm: number;
  /** Stress diameter ds = (d2 + d3)/2. */
  stressDiameterMm: number;
  /** Tensile stress area As. */
  stressAreaMm2: number;
  /** Area at the minor diameter Ad3. */
  minorAreaMm2: number;
  /** Area at the nominal diameter. */
  nominalAreaMm2: number;
}

const QUARTER_PI = Math.PI / 4;

/** Area of a circle of diameter d (geometry). */
export function circleAreaMm2(diameterMm: number): number {
  return QUARTER_PI * diameterMm * diameterMm;
}

export type ThreadForm = "iso" | "unified";

/** A unified inch size: the diameter a whole number of 1/64 in and the pitch 1/n in for a whole n. */
export function looksUnified(diameterMm: number, pitchMm: number): boolean {
  const sixtyFourths = (diameterMm / 25.4) * 64;
  const tpi = 25.4 / pitchMm;
  return Math.abs(sixtyFourths - Math.round(sixtyFourths)) < 0.02 && Math.abs(tpi - Math.round(tpi)) < 0.002;
}

export function threadGeometry(diameterMm: number, pitchMm: number, form: ThreadForm = "iso"): ThreadGeometry {
  // ISO 68-1 / ASME B1.1 basic profile: d2 = d − 0.649519·P
  const pitchDiameterMm = diameterMm - 0.649519 * pitchMm;
  // ISO 68-1 basic profile, minor diameter for stress purposes: d3 = d − 1.226869·P
  const minorDiameterMm = diameterMm - 1.226869 * pitchMm;
  const stressDiameterMm =
    form === "unified"
      ? // ASME B1.1: At = 0.7854·(d − 0.9743/n)², i.e. a stress diameter d − 0.9743·P
        diameterMm - 0.9743 * pitchMm
      : // ISO 898-1: ds = (d2 + d3)/2
        (pitchDiameterMm + minorDiameterMm) / 2;
  return {
    diameterMm,
    pitchMm,
    pitchDiameterMm,
    minorDiameterMm,
    stressDiameterMm,
    // ISO 898-1 / ASME B1.1: As = π/4·ds²
    stressAreaMm2: circleAreaMm2(stressDiameterMm),
    minorAreaMm2: circleAreaMm2(minorDiameterMm),
    nominalAreaMm2: circleAreaMm2(diameterMm),
  };
}

/**
 * Tensile stress area of a unified inch thread, in square inches.
 * Inch in, inch out: this is the form the ASME table is computed from.
 */
export function unifiedStressAreaIn2(diameterIn: number, threadsPerInch: number): number {
  // ASME B1.1: At = 0.7854·(d − 0.9743/n)²
  const s = diameterIn - 0.9743 / threadsPerInch;
  return 0.7854 * s * s;
}
