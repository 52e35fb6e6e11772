// The plan input: what a builder enters for one seal plan on one engine, SI with units in names.
// Messages are written for the builder reading them beside the field.
import { z } from "zod";
import { fastenerIssues } from "./fastener-checks";
import { studPatternIssues } from "./stud-shares";
import { TIGHTENING_METHODS } from "./torque";

export { TIGHTENING_METHODS };

// z.number() in zod 4 already refuses NaN and ±Infinity; the message covers both.
const num = (label: string) => z.number({ error: `${label} must be a finite number` });
const positive = (label: string, max: number) =>
  num(label).gt(0, `${label} must be greater than zero`).lte(max, `${label} must be at most ${max}`);
const nonNegative = (label: string, max: number) =>
  num(label).gte(0, `${label} cannot be negative`).lte(max, `${label} must be at most ${max}`);
const between = (label: string, min: number, max: number) =>
  num(label).gte(min, `${label} must be at least ${min}`).lte(max, `${label} must be at most ${max}`);

// the lists live in a module without zod, so a form can name them without loading the schema
import { GASKET_TYPES, LAYOUTS, ROUGHNESS } from "./plan-lists";
export { GASKET_TYPES, LAYOUTS, ROUGHNESS };

export const StudSchema = z.object({
  label: z.string().max(40).optional(),
  serves: z
    .array(
      z.object({
        cylinder: z.number().int("Cylinder numbers are whole numbers").gte(1, "Cylinder numbers start at 1"),
        share: num("Stud share").gt(0, "A stud's share of a cylinder must be greater than zero").lte(1, "A stud's share cannot exceed 1"),
      }),
    )
    .min(1, "Every stud must serve at least one cylinder")
    .max(16, "A stud serves at most 16 cylinders"),
});
export type Stud = z.infer<typeof StudSchema>;

const sleeveSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("none") }),
  z.object({
    kind: z.literal("dry"),
    modulusMpa: positive("Sleeve modulus", 400_000),
    wallMm: positive("Sleeve wall", 30),
    yieldMpa: positive("Sleeve yield", 3000).optional(),
  }),
  z.object({
    kind: z.enum(["wet-flange", "wet-mid"]),
    modulusMpa: positive("Sleeve modulus", 400_000),
    wallMm: positive("Sleeve wall", 30),
    /** Distance from the sleeve top to the seat that carries the clamp. */
    supportLengthMm: nonNegative("Sleeve support length", 300),
    yieldMpa: positive("Sleeve yield", 3000).optional(),
  }),
]);

export const PlanInputSchema = z
  .object({
    engine: z.object({
      cylinders: z
        .number()
        .int("Cylinder count is a whole number")
        .gte(1, "An engine has at least one cylinder")
        .lte(16, "At most 16 cylinders"),
      layout: z.enum(LAYOUTS),
      boreMm: positive("Bore", 300),
      /** Distance between neighbouring studs along a side (limits the pressure cones). */
      studSpacingMm: positive("Stud spacing", 500).optional(),
    }),
    studs: z.array(StudSchema).min(1, "Add at least one stud").max(80, "At most 80 studs"),
    fastener: z.object({
      diameterMm: positive("Thread diameter", 40),
      pitchMm: positive("Thread pitch", 6),
      reducedShankDiameterMm: positive("Reduced shank diameter", 40).optional(),
      reducedShankLengthMm: nonNegative("Reduced shank length", 500).default(0),
      /** Loaded thread inside the grip, both ends together. */
      freeThreadLengthMm: nonNegative("Free thread length", 500),
      engagementMm: positive("Thread engagement", 200),
      modulusMpa: positive("Stud modulus", 400_000),
      yieldMpa: positive("Stud yield strength", 3000),
      expansionUmPerMC: positive("Stud expansion", 40),
      washerOdMm: positive("Washer outer diameter", 100),
      washerHoleMm: positive("Washer hole", 60),
      washerThicknessMm: nonNegative("Washer thickness", 20).default(0),
      /** Vickers hardness of the washer; absent: taken as hardened (see washer.ts). */
      washerHardnessHv: positive("Washer hardness", 1000).optional(),
      /** "iso" (ISO 68-1 / 898-1) or "unified" (ASME B1.1); detected from the size when not given. */
      threadForm: z.enum(["iso", "unified"]).optional(),
      /** Outer diameter of the nut's (or stud head's) bearing face, where the bearing friction acts. */
      nutFaceOdMm: positive("Nut face diameter", 100).optional(),
      /** True when the washer turns with the nut, so friction acts at the washer's face instead. */
      washerTurns: z.boolean().default(false),
      /** Thread rolled after heat treatment (higher endurance limit, VDI 2230). */
      rolledAfterHeatTreatment: z.boolean().default(false),
    }),
    tightening: z.object({
      target: z.discriminatedUnion("mode", [
        z.object({ mode: z.literal("torque"), torqueNm: positive("Torque", 5000) }),
        z.object({ mode: z.literal("preload"), preloadN: positive("Target preload", 2_000_000) }),
      ]),
      threadFriction: between("Thread friction", 0.02, 0.6),
      bearingFriction: between("Bearing friction", 0.02, 0.6),
      method: z.enum(TIGHTENING_METHODS),
      /** Overrides the method's αA when the builder knows better. */
      tighteningFactor: between("Tightening factor", 1, 4).optional(),
    }),
    head: z.object({
      thicknessAtStudMm: positive("Head thickness at the stud", 400),
      modulusMpa: positive("Head modulus", 400_000),
      expansionUmPerMC: positive("Head expansion", 40),
      limitingSurfacePressureMpa: positive("Head limiting surface pressure", 3000),
      /** Yield of the head face under the seal line, when it is the softer material. */
      yieldMpa: positive("Head yield", 3000).optional(),
      /** Fire-deck thickness of the head between the stud bosses (the plate the seal line bends). */
      deckThicknessMm: positive("Head deck thickness", 100).optional(),
    }),
    gasket: z.object({
      type: z.enum(GASKET_TYPES),
      compressedThicknessMm: positive("Gasket compressed thickness", 10),
      /** Mean diameter of the seal-line contact band. */
      sealDiameterMm: positive("Seal diameter", 400),
      ringWidthMm: positive("Ring width", 30),
      ringModulusMpa: positive("Ring modulus", 400_000),
      /** Yield of the softest material in the seal line (ring, or the copper a wire bites into). */
      sealLineYieldMpa: positive("Seal-line yield", 3000),
      /** Effective modulus of the gasket body (much lower than the steel for embossed layers). */
      bodyModulusMpa: positive("Gasket body modulus", 400_000),
      bodyAreaPerBoreMm2: positive("Gasket body area per bore", 200_000),
      expansionUmPerMC: positive("Gasket expansion", 40),
      m: positive("Gasket factor m", 20),
      yMpa: positive("Seating stress y", 1000),
      /** Preload lost to gasket relaxation after heat cycles (copper), percent. */
      relaxationPercent: between("Gasket relaxation", 0, 50).default(0),
      /** Indentation pressure (hardness) of the softer face the ring or wire bites into. */
      sealLineHardnessMpa: positive("Seal-line hardness", 5000).optional(),
      /** MLS: bead line load per mm of circumference when pressed down to the stopper. */
      beadLoadNPerMm: positive("Bead load", 5000).optional(),
      /** MLS: bead travel from first contact until the stopper carries. */
      beadTravelMm: positive("Bead travel", 2).optional(),
      /** EN 13555 Qmin(L): seating pressure for the tightness class wanted. */
      seatingPressureMpa: positive("Seating pressure", 2000).optional(),
      /** EN 13555 QSmin(L): least pressure in service that keeps that tightness. */
      minServicePressureMpa: positive("Minimum service pressure", 2000).optional(),
      /** EN 13555 QSmax: most pressure the seal line takes without damage. */
      maxPressureMpa: positive("Maximum pressure", 5000).optional(),
      /** Least pressure on the gasket body that still seals coolant and oil, hot and fired. */
      bodySealPressureMpa: positive("Body seal pressure", 500).optional(),
    }),
    block: z.object({
      modulusMpa: positive("Block modulus", 400_000),
      expansionUmPerMC: positive("Block expansion", 40),
      /** Depth from the deck to the first engaged thread: block material inside the grip. */
      clampedDepthMm: nonNegative("Block depth to the engaged thread", 200).default(0),
      /** Yield of the deck land under the ring (no sleeve), when known. */
      yieldMpa: positive("Block yield", 3000).optional(),
      /** Deck thickness of the block around the bore (a plate between the studs, like the head's). */
      deckThicknessMm: positive("Block deck thickness", 100).optional(),
      /** Shear strength of the block's internal thread material (gray iron has no yield point). */
      shearStrengthMpa: positive("Block shear strength", 3000).optional(),
    }),
    sleeve: sleeveSchema.default({ kind: "none" }),
    sealing: z.object({
      sleeveProtrusionMm: between("Sleeve protrusion", -0.5, 1),
      wireProjectionMm: nonNegative("Wire projection", 2).default(0),
      receiverGrooveDepthMm: nonNegative("Receiver groove depth", 2).default(0),
    }),
    surfaceRoughness: z.enum(ROUGHNESS).default("rz-10-40"),
    /** Seal margin the shop wants at the bottom of the scatter band (a plan under it reads "thin"). */
    targetMargin: between("Target margin", 1, 5).default(1.5),
    firing: z.discriminatedUnion("mode", [
      z.object({ mode: z.literal("entered"), peakPressureMpa: positive("Peak cylinder pressure", 100) }),
      z.object({
        mode: z.literal("estimated"),
        manifoldAbsKpa: positive("Manifold absolute pressure", 1000),
        compressionRatio: between("Compression ratio", 1.01, 30),
        exponent: between("Compression exponent", 1, 1.4).default(1.3),
        pressureRiseFactor: between("Pressure-rise factor", 1, 10),
      }),
    ]),
    temperatures: z.object({
      assemblyC: between("Assembly temperature", -40, 60),
      headC: between("Head temperature", -40, 400),
      blockC: between("Block temperature", -40, 400),
      studC: between("Stud temperature", -40, 400),
    }),
    model: z
      .object({
        /** "Mostly squeezes the head" once +10 % torque puts less than this share of the added clamp on the seal line under firing. */
        squeezeGainThreshold: between("Squeeze gain threshold", 0.01, 0.5).default(0.1),
        /** Indentation limit as a multiple of the softer face's yield, used only when no hardness is given. */
        indentationFactor: between("Indentation factor", 1, 6).default(3),
        /** Equivalent stress limit at assembly as a fraction of yield (VDI 2230's ν = 0.9). */
        studLimitFraction: between("Stud limit fraction", 0.5, 1).default(0.9),
        /** Mean compressive strain of the head at the stud boss past which the head itself is being squeezed. */
        headStrainLimit: between("Head strain limit", 0.0002, 0.01).default(0.002),
      })
      .default({ squeezeGainThreshold: 0.1, indentationFactor: 3, studLimitFraction: 0.9, headStrainLimit: 0.002 }),
  })
  .superRefine((p, ctx) => checkPlan(p, ctx));

export type PlanInput = z.infer<typeof PlanInputSchema>;
/** What a form or API client may send (defaults not yet applied). */
export type PlanInputRaw = z.input<typeof PlanInputSchema>;

const fmt = (x: number) => String(Math.round(x * 1000) / 1000);

/** Clamped stack length lK at the stud: washer, head, gasket and block above the thread. */
export function gripLengthMm(p: Pick<PlanInput, "fastener" | "head" | "gasket" | "block">): number {
  return p.fastener.washerThicknessMm + p.head.thicknessAtStudMm + p.gasket.compressedThicknessMm + p.block.clampedDepthMm;
}

/** At most this many cross-field messages: a runaway input cannot build a runaway list. */
export const MAX_PLAN_ISSUES = 50;

function checkPlan(p: PlanInput, ctx: z.RefinementCtx): void {
  // zod runs refinements even when fields failed their own checks: never loop over a count that did
  const c = p.engine?.cylinders;
  if (!Number.isInteger(c) || c < 1 || c > 16 || !Array.isArray(p.studs) || p.studs.length > 80) return;
  let count = 0;
  const issue = (path: (string | number)[], message: string) => {
    if (count++ < MAX_PLAN_ISSUES) ctx.addIssue({ code: "custom", path, message });
  };
  const f = p.fastener;
  for (const i of fastenerIssues(f)) issue(["fastener", i.field], i.message);
  const grip = gripLengthMm(p);
  if (f.reducedShankLengthMm + f.freeThreadLengthMm > grip)
    issue(
      ["fastener", "freeThreadLengthMm"],
      `Reduced shank and free thread add up to ${fmt(f.reducedShankLengthMm + f.freeThreadLengthMm)} mm, longer than the clamped stack (${fmt(grip)} mm)`,
    );
  const g = p.gasket;
  if (g.sealDiameterMm - g.ringWidthMm < p.engine.boreMm)
    issue(
      ["gasket", "sealDiameterMm"],
      `The seal band (diameter ${fmt(g.sealDiameterMm)} mm, width ${fmt(g.ringWidthMm)} mm) must sit outside the ${fmt(p.engine.boreMm)} mm bore`,
    );
  if (p.engine.layout === "V" && p.engine.cylinders % 2 !== 0)
    issue(["engine", "cylinders"], "A V engine needs an even number of cylinders");
  if (p.sleeve.kind !== "none" && p.sleeve.wallMm < g.ringWidthMm)
    issue(["sleeve", "wallMm"], "The sleeve wall must be at least as wide as the ring that sits on it");
  for (const i of studPatternIssues(p.studs, p.engine.cylinders)) issue(i.path, i.message);
}

/** Parse raw plan input; on failure, plain messages keyed by field path. */
export function parsePlan(raw: unknown): { ok: true; plan: PlanInput } | { ok: false; errors: { path: string; message: string }[] } {
  const r = PlanInputSchema.safeParse(raw);
  if (r.success) return { ok: true, plan: r.data };
  return { ok: false, errors: r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message })) };
}
