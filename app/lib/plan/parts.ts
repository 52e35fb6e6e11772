// Builds the clamp model's input from the shop's records (engine, plan, fastener, gasket, materials).
// Pure: plain records in, PlanInputRaw out; the schema in app/lib/clamp validates it. No model and no
// schema here (type imports only), so the plan editor's first JavaScript carries neither: the step that
// needs the model (a stretch target to a preload) is assemblePlanInput in ./assemble.
import { compressionRatio, type CompressionInput } from "../chamber";
import type { PlanInputRaw, Stud } from "../clamp";
import type { LAYOUTS } from "../clamp/plan-lists";
import type { TighteningMethod } from "../clamp/torque";
import type { SleeveKind } from "../engine/schema";
import type { WIRE_LOCATIONS } from "./form-fields";
import type { GasketFamily } from "../clamp/gasket-families";
import { ATMOSPHERE_KPA } from "../units";

export interface MaterialRecord {
  name: string;
  modulusMpa: number;
  yieldMpa: number | null;
  expansionUmPerMC: number;
  limitingSurfacePressureMpa: number | null;
  shearStrengthMpa?: number | null;
}

export interface FastenerRecord {
  diameterMm: number;
  pitchMm: number;
  reducedShankDiameterMm: number | null;
  reducedShankLengthMm: number;
  freeThreadLengthMm: number;
  engagementMm: number;
  washerOdMm: number;
  washerHoleMm: number;
  washerThicknessMm: number;
  nutFaceOdMm?: number | null;
  washerHardnessHv?: number | null;
  material: MaterialRecord;
}

export interface GasketRecord {
  type: GasketFamily;
  compressedThicknessMm: number;
  boreMm: number;
  sealDiameterMm: number;
  ringWidthMm: number;
  ringModulusMpa: number;
  sealLineYieldMpa: number;
  bodyModulusMpa: number;
  bodyAreaPerBoreMm2: number;
  expansionUmPerMC: number;
  m: number;
  yMpa: number;
  relaxationPercent: number;
  sealLineHardnessMpa?: number | null;
  beadLoadNPerMm?: number | null;
  beadTravelMm?: number | null;
  seatingPressureMpa?: number | null;
  minServicePressureMpa?: number | null;
  maxPressureMpa?: number | null;
  bodySealPressureMpa?: number | null;
}

/** The optional figures a record may carry: present ones pass on, absent ones are left out. */
function present<T extends Record<string, number | null | undefined>>(o: T): { [K in keyof T]?: number } {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(o)) if (typeof v === "number" && Number.isFinite(v)) out[k] = v;
  return out as { [K in keyof T]?: number };
}

/** The engine's figures the clamp model reads: the one engine shape, which the stored row extends. */
export interface EngineRecord {
  cylinders: number;
  layout: (typeof LAYOUTS)[number];
  boreMm: number;
  strokeMm: number;
  headThicknessAtStudMm: number;
  blockDepthToThreadMm: number;
  sleeveKind: SleeveKind;
  sleeveWallMm: number | null;
  sleeveSupportLengthMm: number | null;
  sleeveProtrusionMm: number;
  studs: Stud[];
  targetManifoldKpa: number | null;
  peakPressureMpa: number | null;
  pressureRiseFactor: number;
  runningHeadC: number;
  runningBlockC: number;
  chamberCc: number | null;
  pistonVolumeCc: number;
  deckClearanceMm: number;
}

type WireLocation = (typeof WIRE_LOCATIONS)[number];

export interface PlanRecord {
  torqueNm: number;
  threadFriction: number;
  bearingFriction: number;
  method: TighteningMethod;
  wireLocation: WireLocation;
  wireProjectionMm: number;
  receiverGrooveDepthMm: number;
  sleeveProtrusionMm: number | null;
  /** Seal margin the shop wants at the bottom of the scatter band. */
  targetMargin?: number;
  /** Planned by the stretch a stretch gauge reads (method "stretch-measured"); null or absent: planned by torque. */
  targetStretchMm?: number | null;
}

/** Whether the plan's tightening target is a stud stretch rather than a torque. */
export function plannedByStretch(
  plan: Pick<PlanRecord, "method" | "targetStretchMm">,
): plan is { method: "stretch-measured"; targetStretchMm: number } {
  return plan.method === "stretch-measured" && typeof plan.targetStretchMm === "number" && plan.targetStretchMm > 0;
}

export interface PlanParts {
  engine: EngineRecord;
  plan: PlanRecord;
  fastener: FastenerRecord;
  gasket: GasketRecord;
  head: MaterialRecord;
  block: MaterialRecord;
  sleeve: MaterialRecord | null;
}

const ASSEMBLY_C = 20;
// Used only when the engine record has no chamber volume yet; the estimate says so.
export const ASSUMED_COMPRESSION_RATIO = 9.5;

/** The chamber figures of this engine with this gasket, or null while the chamber volume is unknown. */
export function chamberInput(
  engine: Pick<EngineRecord, "boreMm" | "strokeMm" | "chamberCc" | "deckClearanceMm" | "pistonVolumeCc">,
  gasket: Pick<GasketRecord, "boreMm" | "compressedThicknessMm">,
): CompressionInput | null {
  if (!engine.chamberCc) return null;
  return {
    boreMm: engine.boreMm,
    strokeMm: engine.strokeMm,
    chamberCc: engine.chamberCc,
    gasketBoreMm: gasket.boreMm,
    gasketThicknessMm: gasket.compressedThicknessMm,
    deckClearanceMm: engine.deckClearanceMm,
    pistonVolumeCc: engine.pistonVolumeCc,
  };
}

/** Compression ratio of the engine with this gasket, or the assumed figure when the chamber is unknown. */
export function engineCompressionRatio(engine: EngineRecord, gasket: Pick<GasketRecord, "boreMm" | "compressedThicknessMm">) {
  const input = chamberInput(engine, gasket);
  if (!input) return { ratio: ASSUMED_COMPRESSION_RATIO, assumed: true };
  return { ratio: compressionRatio(input).compressionRatio, assumed: false };
}

/** The sleeves' material when the model sees sleeves (the engine has them and their material is known), else null. */
export function sleeveOf(parts: Pick<PlanParts, "engine" | "sleeve">): MaterialRecord | null {
  return parts.engine.sleeveKind !== "none" ? parts.sleeve : null;
}

/**
 * The model's input with the plan's torque as its target (a stretch target not yet turned into a
 * preload: assemblePlanInput in assemble.ts does that, with the model; the browser does it once the
 * model has loaded).
 */
export function assembleTorqueInput(parts: PlanParts): PlanInputRaw {
  const { engine, plan, fastener, gasket, head, block } = parts;
  const f = fastener;
  const sleeve = sleeveOf(parts);
  const sleeved = sleeve !== null;
  return {
    engine: { cylinders: engine.cylinders, layout: engine.layout, boreMm: engine.boreMm },
    studs: engine.studs,
    fastener: {
      diameterMm: f.diameterMm,
      pitchMm: f.pitchMm,
      ...(f.reducedShankDiameterMm ? { reducedShankDiameterMm: f.reducedShankDiameterMm } : {}),
      reducedShankLengthMm: f.reducedShankDiameterMm ? f.reducedShankLengthMm : 0,
      freeThreadLengthMm: f.freeThreadLengthMm,
      engagementMm: f.engagementMm,
      modulusMpa: f.material.modulusMpa,
      yieldMpa: f.material.yieldMpa ?? 0,
      expansionUmPerMC: f.material.expansionUmPerMC,
      washerOdMm: f.washerOdMm,
      washerHoleMm: f.washerHoleMm,
      washerThicknessMm: f.washerThicknessMm,
      ...present({ nutFaceOdMm: f.nutFaceOdMm, washerHardnessHv: f.washerHardnessHv }),
    },
    tightening: {
      target: { mode: "torque", torqueNm: plan.torqueNm },
      threadFriction: plan.threadFriction,
      bearingFriction: plan.bearingFriction,
      method: plan.method,
    },
    head: {
      thicknessAtStudMm: engine.headThicknessAtStudMm,
      modulusMpa: head.modulusMpa,
      expansionUmPerMC: head.expansionUmPerMC,
      // A head material without a listed limiting surface pressure is held to its yield.
      limitingSurfacePressureMpa: head.limitingSurfacePressureMpa ?? head.yieldMpa ?? 0,
      ...(head.yieldMpa ? { yieldMpa: head.yieldMpa } : {}),
    },
    gasket: {
      type: gasket.type,
      compressedThicknessMm: gasket.compressedThicknessMm,
      sealDiameterMm: gasket.sealDiameterMm,
      ringWidthMm: gasket.ringWidthMm,
      ringModulusMpa: gasket.ringModulusMpa,
      sealLineYieldMpa: gasket.sealLineYieldMpa,
      bodyModulusMpa: gasket.bodyModulusMpa,
      bodyAreaPerBoreMm2: gasket.bodyAreaPerBoreMm2,
      expansionUmPerMC: gasket.expansionUmPerMC,
      m: gasket.m,
      yMpa: gasket.yMpa,
      relaxationPercent: gasket.relaxationPercent,
      ...present({
        sealLineHardnessMpa: gasket.sealLineHardnessMpa,
        beadLoadNPerMm: gasket.beadLoadNPerMm,
        beadTravelMm: gasket.beadTravelMm,
        seatingPressureMpa: gasket.seatingPressureMpa,
        minServicePressureMpa: gasket.minServicePressureMpa,
        maxPressureMpa: gasket.maxPressureMpa,
        bodySealPressureMpa: gasket.bodySealPressureMpa,
      }),
    },
    block: {
      modulusMpa: block.modulusMpa,
      expansionUmPerMC: block.expansionUmPerMC,
      clampedDepthMm: engine.blockDepthToThreadMm,
      ...(block.yieldMpa ? { yieldMpa: block.yieldMpa } : {}),
      ...present({ shearStrengthMpa: block.shearStrengthMpa }),
    },
    sleeve: sleeved
      ? engine.sleeveKind === "dry"
        ? { kind: "dry", modulusMpa: sleeve.modulusMpa, wallMm: engine.sleeveWallMm ?? 0 }
        : {
            kind: engine.sleeveKind as "wet-flange" | "wet-mid",
            modulusMpa: sleeve.modulusMpa,
            wallMm: engine.sleeveWallMm ?? 0,
            supportLengthMm: engine.sleeveSupportLengthMm ?? 0,
          }
      : { kind: "none" },
    sealing: {
      sleeveProtrusionMm: sleeved ? (plan.sleeveProtrusionMm ?? engine.sleeveProtrusionMm) : 0,
      wireProjectionMm: plan.wireLocation === "none" ? 0 : plan.wireProjectionMm,
      receiverGrooveDepthMm: plan.wireLocation === "none" ? 0 : plan.receiverGrooveDepthMm,
    },
    ...(plan.targetMargin !== undefined ? { targetMargin: plan.targetMargin } : {}),
    firing:
      engine.peakPressureMpa && engine.peakPressureMpa > 0
        ? { mode: "entered", peakPressureMpa: engine.peakPressureMpa }
        : {
            mode: "estimated",
            manifoldAbsKpa: engine.targetManifoldKpa ?? ATMOSPHERE_KPA,
            compressionRatio: engineCompressionRatio(engine, gasket).ratio,
            pressureRiseFactor: engine.pressureRiseFactor,
          },
    temperatures: {
      assemblyC: ASSEMBLY_C,
      headC: engine.runningHeadC,
      blockC: engine.runningBlockC,
      // common practice: a head stud runs between the head and block temperatures
      studC: (engine.runningHeadC + engine.runningBlockC) / 2,
    },
  };
}

// common practice: a head gasket's bore sits a little over the cylinder bore; far over it, the fire
// ring or wire no longer lands on the deck or sleeve top.
export const GASKET_BORE_OVERSIZE_LIMIT_MM = 6;

/** Why this gasket does not fit this bore, or null when it does. `length` words a length in mm. */
export function gasketFitProblem(engineBoreMm: number, gasketBoreMm: number, length: (mm: number) => string): string | null {
  if (gasketBoreMm < engineBoreMm)
    return `The gasket's ${length(gasketBoreMm)} bore is smaller than the ${length(engineBoreMm)} cylinder bore: it would hang into the bore.`;
  if (gasketBoreMm > engineBoreMm + GASKET_BORE_OVERSIZE_LIMIT_MM)
    return `The gasket's ${length(gasketBoreMm)} bore is far larger than the ${length(engineBoreMm)} cylinder bore: its seal ring would not sit on the deck or sleeve top. Pick a gasket made for this bore.`;
  return null;
}

/** The gaskets that fit this bore (closest bore first), and the others. */
export function gasketsByFit<G extends { boreMm: number }>(gaskets: G[], engineBoreMm: number): { fitting: G[]; others: G[] } {
  const fits = (g: G) => gasketFitProblem(engineBoreMm, g.boreMm, String) === null;
  return { fitting: gaskets.filter(fits).sort((a, b) => a.boreMm - b.boreMm), others: gaskets.filter((g) => !fits(g)) };
}
