// The washer between the nut and the head: how much stud load it lets the head carry before the
// washer sinks in, from its outside diameter, thickness and hardness.
//   - The head side: a hardened washer is stiff enough to spread the load over its whole face
//     (the usual head-stud washer, through-hardened to about 38–45 HRC ≈ 370–450 HV: common
//     practice). A softer washer carries it only where the nut's pressure cone reaches through its
//     thickness: the 30° cone of the member-stiffness model (Shigley §8-5), nut face + 2·t·tan 30°.
//   - The washer side: the nut face presses the washer itself; its limit is taken as the washer's
//     Vickers hardness in pressure units (HV × 9.807 MPa, the mean pressure of a lasting dent,
//     ISO 6507-1), the same convention as the copper seal line's hardness.
// A washer with no recorded hardness is taken as hardened, as the records held before hardness was kept.

/** At or above this a washer spreads the load over its full face (our threshold; hardened washers are ≈ 370–450 HV). */
export const HARDENED_WASHER_HV = 300;
/** 1 HV = 1 kgf/mm² = 9.80665 MPa (ISO 6507-1). */
export const MPA_PER_HV = 9.80665;
const TAN_30 = Math.tan(Math.PI / 6);

export interface WasherFigures {
  washerOdMm: number;
  washerHoleMm: number;
  washerThicknessMm: number;
  /** Outer diameter of the nut face on the washer. */
  nutFaceOdMm: number;
  /** Vickers hardness; undefined: taken as hardened. */
  washerHardnessHv?: number;
}

export interface WasherBearing {
  /** Annulus the head carries, mm². */
  headAreaMm2: number;
  /** Diameter of that annulus' outside edge, mm. */
  headBearingOdMm: number;
  /** Stud load at the head's limiting surface pressure, N. */
  headCapacityN: number;
  /** Stud load at which the nut face dents the washer, N (Infinity when the hardness is not known). */
  washerCapacityN: number;
  /** The smaller of the two, N: the washer-bearing limit. */
  capacityN: number;
  limitedBy: "head" | "washer";
}

const annulus = (od: number, id: number) => (Math.PI / 4) * Math.max(0, od * od - id * id);

/** The washer-bearing limit for the head's limiting surface pressure (MPa). */
export function washerBearing(w: WasherFigures, headLimitMpa: number): WasherBearing {
  const hard = w.washerHardnessHv === undefined || w.washerHardnessHv >= HARDENED_WASHER_HV;
  // 30° pressure cone from the nut face through the washer (Shigley §8-5), never past the washer's edge
  const headBearingOdMm =
    hard || w.washerThicknessMm <= 0 ? w.washerOdMm : Math.min(w.washerOdMm, w.nutFaceOdMm + 2 * w.washerThicknessMm * TAN_30);
  const headAreaMm2 = annulus(headBearingOdMm, w.washerHoleMm);
  const headCapacityN = headLimitMpa * headAreaMm2;
  const washerCapacityN =
    w.washerHardnessHv === undefined || w.washerThicknessMm <= 0
      ? Infinity
      : w.washerHardnessHv * MPA_PER_HV * annulus(w.nutFaceOdMm, w.washerHoleMm);
  const limitedBy = washerCapacityN < headCapacityN ? "washer" : "head";
  return { headAreaMm2, headBearingOdMm, headCapacityN, washerCapacityN, capacityN: Math.min(headCapacityN, washerCapacityN), limitedBy };
}
