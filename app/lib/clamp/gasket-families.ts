// Typical figures per gasket family, for a shop that has only the gasket maker's catalogue line.
// Each is "typical — replace with the gasket maker's figure"; where a figure has a published source
// it is named, the rest are our assumptions and say so.
import { ASME_GASKET_FACTORS, HANDBOOK_MATERIALS, MPA_PER_KSI } from "./handbook";
import type { GASKET_TYPES } from "./schema";

export type GasketFamily = (typeof GASKET_TYPES)[number];

/** Annealed copper's hardness: 40–65 HV for temper H040 (copper industry data); the lower bound, 1 HV = 9.807 MPa. */
export const ANNEALED_COPPER_HARDNESS_MPA = 40 * 9.807;

export interface TypicalGasket {
  label: string;
  ringModulusMpa: number;
  /** Indentation pressure of the softer face under the ring or wire. */
  sealLineHardnessMpa: number;
  sealLineYieldMpa: number;
  bodyModulusMpa: number;
  m: number;
  yMpa: number;
  relaxationPercent: number;
  bodySealPressureMpa: number;
  beadLoadNPerMm?: number;
  beadTravelMm?: number;
  notes: string;
}

const PSI = MPA_PER_KSI / 1000; // NIST SP 811: 1 psi = 6894.757 Pa
const COPPER = HANDBOOK_MATERIALS["c11000-annealed"];
const COPPER_FLAT = ASME_GASKET_FACTORS["solid flat copper"];
const SOFT_STEEL_FLAT = ASME_GASKET_FACTORS["solid flat soft steel"];

export const TYPICAL_GASKETS: Record<GasketFamily, TypicalGasket> = {
  "solid-copper": {
    label: "Solid copper with a stainless wire ring",
    ringModulusMpa: HANDBOOK_MATERIALS["stainless-300-wire"].modulusMpa,
    sealLineHardnessMpa: ANNEALED_COPPER_HARDNESS_MPA,
    sealLineYieldMpa: COPPER.yieldMpa,
    bodyModulusMpa: COPPER.modulusMpa,
    // ASME VIII-1 Table 2-5.1, solid flat copper (a flange stand-in)
    m: COPPER_FLAT.m,
    yMpa: COPPER_FLAT.yPsi * PSI,
    relaxationPercent: 3,
    // with sealant or o-rings at the coolant holes, as is usual under solid copper (common practice)
    bodySealPressureMpa: 5,
    notes:
      "Ring: 300-series wire; the wire bites into annealed copper (40 HV, published). Body pressure to seal coolant (with sealant or o-rings at the coolant holes, common practice) and relaxation are our assumptions.",
  },
  mls: {
    label: "Multilayer steel with a stopper",
    ringModulusMpa: 200_000,
    sealLineHardnessMpa: 3 * 165,
    sealLineYieldMpa: 165,
    bodyModulusMpa: 2_000,
    // ASME VIII-1 Table 2-5.1, solid flat soft steel (a flange stand-in)
    m: SOFT_STEEL_FLAT.m,
    yMpa: SOFT_STEEL_FLAT.yPsi * PSI,
    relaxationPercent: 0,
    bodySealPressureMpa: 5,
    beadLoadNPerMm: 80,
    beadTravelMm: 0.15,
    notes:
      "Bead line load 80 N/mm over 0.15 mm of travel to the stopper, body modulus and body seal pressure are our assumptions; the stopper presses on a cast aluminium head (3 × its 165 MPa yield).",
  },
  "mls-with-ring": {
    label: "Multilayer steel with a ring in the sleeve",
    ringModulusMpa: 193_000,
    sealLineHardnessMpa: 3 * 165,
    sealLineYieldMpa: 165,
    bodyModulusMpa: 2_000,
    m: SOFT_STEEL_FLAT.m,
    yMpa: SOFT_STEEL_FLAT.yPsi * PSI,
    relaxationPercent: 0,
    bodySealPressureMpa: 5,
    notes: "Ring seated in the sleeve top against a cast aluminium head (3 × 165 MPa, ours); body as for MLS (assumption).",
  },
  "fire-ring": {
    label: "Steel fire ring in a composite body",
    ringModulusMpa: 200_000,
    sealLineHardnessMpa: 3 * 350,
    sealLineYieldMpa: 350,
    bodyModulusMpa: 1_000,
    m: SOFT_STEEL_FLAT.m,
    yMpa: SOFT_STEEL_FLAT.yPsi * PSI,
    relaxationPercent: 2,
    bodySealPressureMpa: 10,
    notes: "All figures are our assumptions for a steel ring in a soft composite body.",
  },
};
