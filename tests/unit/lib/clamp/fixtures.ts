// The invented engine of docs/clamp-model.md ("worked example"), as plan input.
import { defaultStudPattern, PlanInputSchema, type PlanInput, type PlanInputRaw } from "../../../../app/lib/clamp";

export function workedExampleRaw(): PlanInputRaw {
  return {
    engine: { cylinders: 4, layout: "inline", boreMm: 96 },
    studs: defaultStudPattern("inline", 4),
    fastener: {
      diameterMm: 14,
      pitchMm: 1.5,
      freeThreadLengthMm: 20,
      engagementMm: 30,
      modulusMpa: 205_000,
      yieldMpa: 1379,
      expansionUmPerMC: 12.3,
      washerOdMm: 24,
      washerHoleMm: 15,
    },
    tightening: {
      target: { mode: "torque", torqueNm: 180 },
      threadFriction: 0.12,
      bearingFriction: 0.12,
      method: "torque-tested-friction",
    },
    head: { thicknessAtStudMm: 90, modulusMpa: 72_400, expansionUmPerMC: 21.4, limitingSurfacePressureMpa: 380 },
    gasket: {
      type: "fire-ring",
      compressedThicknessMm: 1.3,
      sealDiameterMm: 99,
      ringWidthMm: 1.5,
      ringModulusMpa: 200_000,
      sealLineYieldMpa: 350,
      bodyModulusMpa: 2000,
      bodyAreaPerBoreMm2: 4000,
      expansionUmPerMC: 12,
      m: 5.5,
      yMpa: 18_000 * 0.006894757,
    },
    block: { modulusMpa: 100_000, expansionUmPerMC: 10.8 },
    sealing: { sleeveProtrusionMm: 0.005 },
    surfaceRoughness: "rz-10-40",
    firing: { mode: "entered", peakPressureMpa: 16 },
    temperatures: { assemblyC: 20, headC: 90, blockC: 90, studC: 90 },
  };
}

export function workedExample(): PlanInput {
  return PlanInputSchema.parse(workedExampleRaw());
}

/** An invented V8 with wet sleeves and a copper gasket with a wire ring, for the bench and properties. */
export function v8Raw(): PlanInputRaw {
  return {
    engine: { cylinders: 8, layout: "V", boreMm: 104 },
    studs: defaultStudPattern("V", 8),
    fastener: {
      diameterMm: 12.7,
      pitchMm: 1.27,
      reducedShankDiameterMm: 10.5,
      reducedShankLengthMm: 60,
      freeThreadLengthMm: 15,
      engagementMm: 26,
      modulusMpa: 205_000,
      yieldMpa: 1379,
      expansionUmPerMC: 12.3,
      washerOdMm: 22,
      washerHoleMm: 13.5,
      washerThicknessMm: 3,
    },
    tightening: {
      target: { mode: "torque", torqueNm: 160 },
      threadFriction: 0.1,
      bearingFriction: 0.1,
      method: "torque-estimated-friction",
    },
    head: { thicknessAtStudMm: 95, modulusMpa: 72_400, expansionUmPerMC: 21.4, limitingSurfacePressureMpa: 380, yieldMpa: 165 },
    gasket: {
      type: "solid-copper",
      compressedThicknessMm: 1.0,
      sealDiameterMm: 108,
      ringWidthMm: 1.0,
      ringModulusMpa: 115_000,
      sealLineYieldMpa: 70,
      bodyModulusMpa: 115_000,
      bodyAreaPerBoreMm2: 5000,
      expansionUmPerMC: 17,
      m: 4.75,
      yMpa: 13_000 * 0.006894757,
      relaxationPercent: 3,
    },
    block: { modulusMpa: 72_400, expansionUmPerMC: 21.4, clampedDepthMm: 12 },
    sleeve: { kind: "wet-flange", modulusMpa: 169_000, wallMm: 5, supportLengthMm: 20, yieldMpa: 310 },
    sealing: { sleeveProtrusionMm: 0.08, wireProjectionMm: 0.1, receiverGrooveDepthMm: 0.05 },
    surfaceRoughness: "rz-10-40",
    firing: { mode: "estimated", manifoldAbsKpa: 350, compressionRatio: 9.5, pressureRiseFactor: 2.5 },
    temperatures: { assemblyC: 20, headC: 110, blockC: 100, studC: 100 },
  };
}

// Demo-like plans: the three demo engines of migrations/seeds/03-demo-engines.ts with their chosen
// plans, written out as plan input (library figures from app/models/library-seed.server.ts, as the
// plan assembly would map them; compression ratio from the chamber figures rounded). Copied, not
// imported, so a change to the seed does not silently change what these tests check.
const IN = 25.4; // NIST SP 811, exact
const LBF_FT = 1.3558179; // N·m per lbf·ft, NIST SP 811
const KSI = 6.894757; // MPa per ksi, NIST SP 811

const halfInchChromoly = {
  diameterMm: 0.5 * IN,
  pitchMm: IN / 20,
  reducedShankDiameterMm: 0.41 * IN,
  reducedShankLengthMm: 60,
  freeThreadLengthMm: 15,
  engagementMm: 28,
  modulusMpa: 205_000,
  yieldMpa: 1379,
  expansionUmPerMC: 12.3,
  washerOdMm: 0.95 * IN,
  washerHoleMm: 0.53 * IN,
  washerThicknessMm: 0.125 * IN,
};

/** Inline four, wet flanged ductile sleeves 0.10 mm proud, copper + stainless wire, ½-20 studs at 115 lbf·ft. */
export function demoFourRaw(): PlanInputRaw {
  return {
    engine: { cylinders: 4, layout: "inline", boreMm: 86 },
    studs: defaultStudPattern("inline", 4),
    fastener: { ...halfInchChromoly },
    tightening: {
      target: { mode: "torque", torqueNm: 115 * LBF_FT },
      threadFriction: 0.11,
      bearingFriction: 0.12,
      method: "stretch-measured",
    },
    head: { thicknessAtStudMm: 100, modulusMpa: 72_400, expansionUmPerMC: 21.4, limitingSurfacePressureMpa: 380, yieldMpa: 165 },
    gasket: {
      type: "solid-copper",
      compressedThicknessMm: 1.1,
      sealDiameterMm: 91,
      ringWidthMm: 1.5,
      ringModulusMpa: 193_000,
      sealLineYieldMpa: 70,
      bodyModulusMpa: 115_000,
      bodyAreaPerBoreMm2: 3500,
      expansionUmPerMC: 17,
      m: 4.75,
      yMpa: 13 * KSI,
      relaxationPercent: 5,
    },
    block: { modulusMpa: 169_000, expansionUmPerMC: 11.5, clampedDepthMm: 15, yieldMpa: 310 },
    sleeve: { kind: "wet-flange", modulusMpa: 169_000, wallMm: 6, supportLengthMm: 9, yieldMpa: 310 },
    sealing: { sleeveProtrusionMm: 0.1, wireProjectionMm: 0.11, receiverGrooveDepthMm: 0.05 },
    firing: { mode: "estimated", manifoldAbsKpa: 350, compressionRatio: 9.25, pressureRiseFactor: 3 },
    temperatures: { assemblyC: 20, headC: 105, blockC: 90, studC: 97.5 },
  };
}

/** Inline six, gray-iron block without sleeves, MLS 1.3 mm, 7/16-20 studs at 85 lbf·ft on engine oil. */
export function demoSixRaw(): PlanInputRaw {
  return {
    engine: { cylinders: 6, layout: "inline", boreMm: 86 },
    studs: defaultStudPattern("inline", 6),
    fastener: {
      diameterMm: 0.4375 * IN,
      pitchMm: IN / 20,
      freeThreadLengthMm: 18,
      engagementMm: 16,
      modulusMpa: 205_000,
      yieldMpa: 1379,
      expansionUmPerMC: 12.3,
      washerOdMm: 0.75 * IN,
      washerHoleMm: 0.47 * IN,
      washerThicknessMm: 0.12 * IN,
    },
    tightening: {
      target: { mode: "torque", torqueNm: 85 * LBF_FT },
      threadFriction: 0.15,
      bearingFriction: 0.16,
      method: "torque-estimated-friction",
    },
    head: { thicknessAtStudMm: 95, modulusMpa: 72_400, expansionUmPerMC: 21.4, limitingSurfacePressureMpa: 380, yieldMpa: 165 },
    gasket: {
      type: "mls",
      compressedThicknessMm: 1.3,
      sealDiameterMm: 91,
      ringWidthMm: 2.5,
      ringModulusMpa: 193_000,
      sealLineYieldMpa: 1000,
      bodyModulusMpa: 2000,
      bodyAreaPerBoreMm2: 3800,
      expansionUmPerMC: 17.3,
      m: 3,
      yMpa: 10 * KSI,
      relaxationPercent: 1,
    },
    block: { modulusMpa: 100_000, expansionUmPerMC: 10.8, clampedDepthMm: 10 },
    sealing: { sleeveProtrusionMm: 0 },
    firing: { mode: "entered", peakPressureMpa: 14.5 },
    temperatures: { assemblyC: 20, headC: 110, blockC: 95, studC: 102.5 },
  };
}

/** V8, aluminium block with dry ductile sleeves 0.05 mm proud, MLS with a ring in the sleeve, nine studs a side a bank. */
export function demoV8Raw(): PlanInputRaw {
  return {
    engine: { cylinders: 8, layout: "V", boreMm: 106 },
    studs: defaultStudPattern("V", 8, 9),
    fastener: { ...halfInchChromoly },
    tightening: {
      target: { mode: "torque", torqueNm: 115 * LBF_FT },
      threadFriction: 0.11,
      bearingFriction: 0.12,
      method: "stretch-measured",
    },
    head: { thicknessAtStudMm: 105, modulusMpa: 72_400, expansionUmPerMC: 21.4, limitingSurfacePressureMpa: 380, yieldMpa: 165 },
    gasket: {
      type: "mls-with-ring",
      compressedThicknessMm: 1.3,
      sealDiameterMm: 112,
      ringWidthMm: 3,
      ringModulusMpa: 193_000,
      sealLineYieldMpa: 207,
      bodyModulusMpa: 5000,
      bodyAreaPerBoreMm2: 5000,
      expansionUmPerMC: 17.3,
      m: 3,
      yMpa: 10 * KSI,
      relaxationPercent: 1,
    },
    block: { modulusMpa: 72_400, expansionUmPerMC: 21.4, clampedDepthMm: 25, yieldMpa: 165 },
    sleeve: { kind: "dry", modulusMpa: 169_000, wallMm: 4, yieldMpa: 310 },
    sealing: { sleeveProtrusionMm: 0.05 },
    firing: { mode: "estimated", manifoldAbsKpa: 420, compressionRatio: 9.37, pressureRiseFactor: 3 },
    temperatures: { assemblyC: 20, headC: 95, blockC: 85, studC: 90 },
  };
}

// The demo as re-worked for the corrected model (issue 7): the four's chosen copper + wire plan and the
// V8's chosen MLS + sleeve-ring plan, copied from the seed like the ones above.
const nineSixteenthsChromoly = {
  diameterMm: 0.5625 * IN,
  pitchMm: IN / 18,
  freeThreadLengthMm: 16,
  engagementMm: 24,
  modulusMpa: 205_000,
  yieldMpa: 1379,
  expansionUmPerMC: 12.3,
  washerOdMm: 1.0 * IN,
  washerHoleMm: 0.6 * IN,
  washerThicknessMm: 0.15 * IN,
  nutFaceOdMm: 0.8 * IN,
};

/** The four now: 9/16-18 studs seven a side at the maker's 125 lbf·ft, copper with a 0.8 mm wire band, 14 MPa measured. */
export function demoFourNowRaw(): PlanInputRaw {
  const old = demoFourRaw();
  return {
    ...old,
    studs: defaultStudPattern("inline", 4, 7),
    fastener: { ...nineSixteenthsChromoly },
    tightening: {
      target: { mode: "torque", torqueNm: 125 * LBF_FT },
      threadFriction: 0.11,
      bearingFriction: 0.12,
      method: "stretch-measured",
    },
    gasket: { ...(old.gasket as object), ringWidthMm: 0.8 } as PlanInputRaw["gasket"],
    firing: { mode: "entered", peakPressureMpa: 14 },
  };
}

/** The V8 now: ½-20 reduced-shank studs in full-depth inserts (40 mm) at 105 lbf·ft, a 1.2 mm ring band, 0.02 mm proud. */
export function demoV8NowRaw(): PlanInputRaw {
  const old = demoV8Raw();
  return {
    ...old,
    fastener: { ...halfInchChromoly, engagementMm: 40 },
    tightening: {
      target: { mode: "torque", torqueNm: 105 * LBF_FT },
      threadFriction: 0.11,
      bearingFriction: 0.12,
      method: "stretch-measured",
    },
    gasket: { ...(old.gasket as object), ringWidthMm: 1.2 } as PlanInputRaw["gasket"],
    sealing: { sleeveProtrusionMm: 0.02 },
    firing: { mode: "estimated", manifoldAbsKpa: 420, compressionRatio: 9.37, pressureRiseFactor: 2.2 },
  };
}

/**
 * A plan where the seal line's ring flows at the gasket's own damage limit (QSmax × the ring's area):
 * the line is capped at exactly the crush limit. Invented; the shrunk counterexample of the ceiling's
 * continuity property (tests/unit/lib/clamp/properties.test.ts, fast-check seed 591905254).
 */
export function cappedLineRaw(): PlanInputRaw {
  return {
    engine: { cylinders: 1, layout: "inline", boreMm: 50 },
    studs: ["A1", "A2", "B1", "B2"].map((label) => ({ label, serves: [{ cylinder: 1, share: 1 }] })),
    fastener: {
      diameterMm: 8.720248430163341,
      pitchMm: 0.34880993720653364,
      reducedShankLengthMm: 0,
      freeThreadLengthMm: 0,
      engagementMm: 17.440496860326682,
      modulusMpa: 205000,
      yieldMpa: 1100,
      expansionUmPerMC: 12.3,
      washerOdMm: 9.720248430163341,
      washerHoleMm: 8.720248430163341,
      washerThicknessMm: 0,
      washerTurns: false,
      rolledAfterHeatTreatment: false,
    },
    tightening: {
      target: { mode: "torque", torqueNm: 1 },
      threadFriction: 0.02,
      bearingFriction: 0.02,
      method: "torque-estimated-friction",
    },
    head: {
      thicknessAtStudMm: 10,
      modulusMpa: 40000,
      expansionUmPerMC: 21.4,
      limitingSurfacePressureMpa: 100,
      deckThicknessMm: 26.168287987152404,
    },
    gasket: {
      type: "solid-copper",
      compressedThicknessMm: 0.3,
      sealDiameterMm: 50.3,
      ringWidthMm: 0.3,
      ringModulusMpa: 40000,
      sealLineYieldMpa: 30,
      bodyModulusMpa: 200,
      bodyAreaPerBoreMm2: 200,
      expansionUmPerMC: 12,
      m: 0.5,
      yMpa: 5,
      relaxationPercent: 0,
      sealLineHardnessMpa: 100,
      seatingPressureMpa: 5,
      minServicePressureMpa: 2,
      maxPressureMpa: 100,
    },
    block: { modulusMpa: 60000, expansionUmPerMC: 10.8, clampedDepthMm: 0 },
    sleeve: { kind: "dry", modulusMpa: 169000, wallMm: 0.3 },
    sealing: { sleeveProtrusionMm: 0, wireProjectionMm: 0, receiverGrooveDepthMm: 0 },
    surfaceRoughness: "rz-10-40",
    targetMargin: 1,
    firing: { mode: "entered", peakPressureMpa: 0.5 },
    temperatures: { assemblyC: 20, headC: 0, blockC: 0, studC: 0 },
    model: { squeezeGainThreshold: 0.1, indentationFactor: 3, studLimitFraction: 0.9, headStrainLimit: 0.002 },
  } as PlanInputRaw;
}
