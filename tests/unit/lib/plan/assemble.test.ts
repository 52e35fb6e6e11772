// The shop's records → the clamp model's input: the assumptions it makes are pinned here.
import { describe, expect, it } from "vitest";
import { parsePlan } from "../../../../app/lib/clamp";
import {
  assemblePlanInput,
  engineCompressionRatio,
  gasketFitProblem,
  GASKET_BORE_OVERSIZE_LIMIT_MM,
  type PlanParts,
} from "../../../../app/lib/plan/assemble";

// invented demo figures: a four-cylinder, 86 mm bore, steel ½-20 studs (demo data)
const steel = { name: "Demo stud steel", modulusMpa: 205_000, yieldMpa: 1379, expansionUmPerMC: 11.7, limitingSurfacePressureMpa: null };
const alu = { name: "Demo head alloy", modulusMpa: 71_000, yieldMpa: 240, expansionUmPerMC: 23, limitingSurfacePressureMpa: 300 };
const iron = { name: "Demo block iron", modulusMpa: 110_000, yieldMpa: null, expansionUmPerMC: 11, limitingSurfacePressureMpa: 700 };
const studs = Array.from({ length: 10 }, (_, i) => ({ serves: [{ cylinder: Math.min(4, 1 + Math.floor(i / 2.5)), share: 1 }] }));

function parts(over: { runningHeadC?: number; runningBlockC?: number; gasketBoreMm?: number } = {}): PlanParts {
  return {
    engine: {
      cylinders: 4,
      layout: "inline",
      boreMm: 86,
      strokeMm: 86,
      headThicknessAtStudMm: 110,
      blockDepthToThreadMm: 20,
      sleeveKind: "none",
      sleeveWallMm: null,
      sleeveSupportLengthMm: null,
      sleeveProtrusionMm: 0,
      studs,
      targetManifoldKpa: 250,
      peakPressureMpa: null,
      pressureRiseFactor: 4,
      runningHeadC: over.runningHeadC ?? 110,
      runningBlockC: over.runningBlockC ?? 90,
      chamberCc: null,
      pistonVolumeCc: 0,
      deckClearanceMm: 0,
    },
    plan: {
      torqueNm: 150,
      threadFriction: 0.12,
      bearingFriction: 0.12,
      method: "torque-estimated-friction",
      wireLocation: "none",
      wireProjectionMm: 0,
      receiverGrooveDepthMm: 0,
      sleeveProtrusionMm: null,
    },
    fastener: {
      diameterMm: 12.7,
      pitchMm: 1.27,
      reducedShankDiameterMm: null,
      reducedShankLengthMm: 0,
      freeThreadLengthMm: 20,
      engagementMm: 22,
      washerOdMm: 24,
      washerHoleMm: 13.5,
      washerThicknessMm: 3,
      material: steel,
    },
    gasket: {
      type: "mls",
      compressedThicknessMm: 1.0,
      boreMm: over.gasketBoreMm ?? 87,
      sealDiameterMm: 90,
      ringWidthMm: 2,
      ringModulusMpa: 200_000,
      sealLineYieldMpa: 600,
      bodyModulusMpa: 20_000,
      bodyAreaPerBoreMm2: 3000,
      expansionUmPerMC: 12,
      m: 3,
      yMpa: 80,
      relaxationPercent: 2,
    },
    head: alu,
    block: iron,
    sleeve: null,
  } as PlanParts;
}

describe("assemblePlanInput", () => {
  it("assumes the stud runs at the mean of the head and block temperatures", () => {
    expect(assemblePlanInput(parts()).temperatures).toMatchObject({ assemblyC: 20, headC: 110, blockC: 90, studC: 100 });
    expect(assemblePlanInput(parts({ runningHeadC: 140, runningBlockC: 100 })).temperatures?.studC).toBe(120);
  });
  it("estimates firing from the manifold pressure when no peak pressure is entered, with the assumed ratio when the chamber is unknown", () => {
    const f = assemblePlanInput(parts()).firing as { mode: string; manifoldAbsKpa: number; compressionRatio: number };
    expect(f).toMatchObject({ mode: "estimated", manifoldAbsKpa: 250, compressionRatio: 9.5 });
    expect(engineCompressionRatio(parts().engine, parts().gasket)).toEqual({ ratio: 9.5, assumed: true });
  });
  it("gives an input the clamp model accepts", () => {
    const r = parsePlan(assemblePlanInput(parts()));
    expect(r.ok ? [] : r.errors).toEqual([]);
  });
});

describe("gasketFitProblem", () => {
  const mm = (x: number) => `${x} mm`;
  it("refuses a gasket bore under the cylinder bore, and one far over it", () => {
    expect(gasketFitProblem(86, 85.9, mm)).toMatch(/smaller than the 86 mm cylinder bore/);
    expect(gasketFitProblem(86, 86 + GASKET_BORE_OVERSIZE_LIMIT_MM + 0.1, mm)).toMatch(/far larger/);
  });
  it("accepts the bore itself and up to the oversize limit", () => {
    expect(gasketFitProblem(86, 86, mm)).toBeNull();
    expect(gasketFitProblem(86, 86 + GASKET_BORE_OVERSIZE_LIMIT_MM, mm)).toBeNull();
  });
});
