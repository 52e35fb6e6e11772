// fast-check generators for plans inside the schema's accepted ranges.
import fc from "fast-check";
import { defaultStudPattern, PlanInputSchema, type PlanInput, type PlanInputRaw } from "../../../../app/lib/clamp";

const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

/** Raw plans built to pass the cross-field checks; the caller still parses them with the schema. */
export const rawPlan: fc.Arbitrary<PlanInputRaw> = fc
  .record({
    layout: fc.constantFrom("inline" as const, "V" as const),
    banksCyl: fc.integer({ min: 1, max: 8 }),
    extraStuds: fc.integer({ min: 0, max: 4 }),
    boreMm: dbl(50, 150),
    d: dbl(6, 24),
    pitchFrac: dbl(0.04, 0.25),
    holeExtra: dbl(0, 3),
    washerExtra: dbl(1, 20),
    washerT: dbl(0, 6),
    headT: dbl(10, 150),
    gasketT: dbl(0.3, 3),
    blockDepth: dbl(0, 30),
    freeFrac: dbl(0, 0.4),
    reduced: fc.option(fc.record({ frac: dbl(0.55, 0.98), lenFrac: dbl(0, 0.5) }), { nil: undefined }),
    torqueNm: dbl(1, 800),
    preloadMode: fc.boolean(),
    preloadN: dbl(1000, 300_000),
    muG: dbl(0.02, 0.6),
    muK: dbl(0.02, 0.6),
    method: fc.constantFrom("torque-estimated-friction", "torque-tested-friction", "angle-or-yield", "stretch-measured" as const),
    headE: dbl(40_000, 210_000),
    pG: dbl(100, 1000),
    ringW: dbl(0.3, 6),
    sealExtra: dbl(0, 12),
    ringE: dbl(40_000, 220_000),
    lineYield: dbl(30, 1500),
    bodyE: dbl(200, 200_000),
    bodyA: dbl(200, 20_000),
    m: dbl(0.5, 8),
    y: dbl(5, 200),
    relax: dbl(0, 20),
    blockE: dbl(60_000, 210_000),
    sleeve: fc.constantFrom("none", "dry", "wet-flange" as const),
    sleeveWallExtra: dbl(0, 6),
    support: dbl(0, 60),
    protrusion: dbl(-0.2, 0.4),
    wire: dbl(0, 0.3),
    receiver: dbl(0, 0.3),
    peakMpa: dbl(0.5, 40),
    estimated: fc.boolean(),
    headC: dbl(-20, 200),
    blockC: dbl(-20, 200),
    studC: dbl(-20, 200),
    // fields the model gained with issue 7 (each optional in the schema, so sometimes left out)
    gasketType: fc.constantFrom("solid-copper", "mls", "mls-with-ring", "fire-ring" as const),
    bead: fc.option(fc.record({ loadNPerMm: dbl(5, 400), travelMm: dbl(0.02, 0.4) }), { nil: undefined }),
    hardness: fc.option(dbl(100, 3000), { nil: undefined }),
    en13555: fc.option(fc.record({ seating: dbl(5, 300), service: dbl(2, 200), max: fc.option(dbl(100, 2000), { nil: undefined }) }), {
      nil: undefined,
    }),
    bodySeal: fc.option(dbl(0.5, 50), { nil: undefined }),
    headDeck: fc.option(dbl(4, 30), { nil: undefined }),
    blockDeck: fc.option(dbl(4, 30), { nil: undefined }),
    headYield: fc.option(dbl(100, 600), { nil: undefined }),
    blockYield: fc.option(dbl(100, 600), { nil: undefined }),
    blockShear: fc.option(dbl(60, 400), { nil: undefined }),
    studSpacing: fc.option(dbl(40, 250), { nil: undefined }),
    nutFaceExtra: fc.option(dbl(0.5, 12), { nil: undefined }),
    washerTurns: fc.boolean(),
    rolledAfter: fc.boolean(),
    wetMid: fc.boolean(),
    targetMargin: dbl(1, 3),
  })
  .map((r): PlanInputRaw => {
    const banks = r.layout === "V" ? 2 : 1;
    const cylinders = r.banksCyl * banks;
    const perBank = r.banksCyl;
    const d = r.d;
    const grip = r.washerT + r.headT + r.gasketT + r.blockDepth;
    const reducedLen = r.reduced ? r.reduced.lenFrac * grip : 0;
    const sleeve =
      r.sleeve === "none"
        ? { kind: "none" as const }
        : r.sleeve === "dry"
          ? { kind: "dry" as const, modulusMpa: 169_000, wallMm: r.ringW + r.sleeveWallExtra }
          : {
              kind: r.wetMid ? ("wet-mid" as const) : ("wet-flange" as const),
              modulusMpa: 169_000,
              wallMm: r.ringW + r.sleeveWallExtra,
              supportLengthMm: r.support,
            };
    return {
      engine: { cylinders, layout: r.layout, boreMm: r.boreMm, studSpacingMm: r.studSpacing },
      studs: defaultStudPattern(r.layout, cylinders, perBank + 1 + r.extraStuds),
      fastener: {
        diameterMm: d,
        pitchMm: r.pitchFrac * d,
        reducedShankDiameterMm: r.reduced ? r.reduced.frac * d : undefined,
        reducedShankLengthMm: reducedLen,
        freeThreadLengthMm: r.freeFrac * grip,
        engagementMm: 2 * d,
        modulusMpa: 205_000,
        yieldMpa: 1100,
        expansionUmPerMC: 12.3,
        washerOdMm: d + r.holeExtra + r.washerExtra,
        washerHoleMm: d + r.holeExtra,
        washerThicknessMm: r.washerT,
        nutFaceOdMm: r.nutFaceExtra === undefined ? undefined : d + r.holeExtra + r.nutFaceExtra,
        washerTurns: r.washerTurns,
        rolledAfterHeatTreatment: r.rolledAfter,
      },
      tightening: {
        target: r.preloadMode ? { mode: "preload", preloadN: r.preloadN } : { mode: "torque", torqueNm: r.torqueNm },
        threadFriction: r.muG,
        bearingFriction: r.muK,
        method: r.method,
      },
      head: {
        thicknessAtStudMm: r.headT,
        modulusMpa: r.headE,
        expansionUmPerMC: 21.4,
        limitingSurfacePressureMpa: r.pG,
        yieldMpa: r.headYield,
        deckThicknessMm: r.headDeck,
      },
      gasket: {
        type: r.gasketType,
        compressedThicknessMm: r.gasketT,
        sealDiameterMm: r.boreMm + r.ringW + r.sealExtra,
        ringWidthMm: r.ringW,
        ringModulusMpa: r.ringE,
        sealLineYieldMpa: r.lineYield,
        bodyModulusMpa: r.bodyE,
        bodyAreaPerBoreMm2: r.bodyA,
        expansionUmPerMC: 12,
        m: r.m,
        yMpa: r.y,
        relaxationPercent: r.relax,
        sealLineHardnessMpa: r.hardness,
        beadLoadNPerMm: r.bead?.loadNPerMm,
        beadTravelMm: r.bead?.travelMm,
        seatingPressureMpa: r.en13555?.seating,
        minServicePressureMpa: r.en13555?.service,
        maxPressureMpa: r.en13555?.max,
        bodySealPressureMpa: r.bodySeal,
      },
      block: {
        modulusMpa: r.blockE,
        expansionUmPerMC: 10.8,
        clampedDepthMm: r.blockDepth,
        yieldMpa: r.blockYield,
        deckThicknessMm: r.blockDeck,
        shearStrengthMpa: r.blockShear,
      },
      sleeve,
      sealing: { sleeveProtrusionMm: r.protrusion, wireProjectionMm: r.wire, receiverGrooveDepthMm: r.receiver },
      firing: r.estimated
        ? { mode: "estimated", manifoldAbsKpa: r.peakMpa * 20, compressionRatio: 9, pressureRiseFactor: 2 }
        : { mode: "entered", peakPressureMpa: r.peakMpa },
      temperatures: { assemblyC: 20, headC: r.headC, blockC: r.blockC, studC: r.studC },
      targetMargin: r.targetMargin,
    };
  });

/** Accepted plans only. */
export const plan: fc.Arbitrary<PlanInput> = rawPlan
  .map((raw) => PlanInputSchema.safeParse(raw))
  .filter((r) => r.success)
  .map((r) => (r as { success: true; data: PlanInput }).data);

/** Every number in a nested value is finite. */
export function allFinite(v: unknown, path = "$"): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : path;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const r = allFinite(v[i], `${path}[${i}]`);
      if (r) return r;
    }
    return null;
  }
  if (v && typeof v === "object") {
    for (const [k, x] of Object.entries(v)) {
      const r = allFinite(x, `${path}.${k}`);
      if (r) return r;
    }
  }
  return null;
}
