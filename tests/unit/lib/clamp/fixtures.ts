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
    tightening: { target: { mode: "torque", torqueNm: 160 }, threadFriction: 0.1, bearingFriction: 0.1, method: "torque-estimated-friction" },
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
