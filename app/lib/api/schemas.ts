// The JSON API's shapes (version 1), as zod schemas: the routes validate requests with them, the tests
// check responses against them and app/lib/api/openapi.ts turns them into the OpenAPI document, so the
// three cannot drift apart. SI units, with the unit in every field name that carries one.
import { z } from "zod";
import { UNIT_SYSTEMS } from "../units/table";
import { LAYOUTS, PlanInputSchema } from "../clamp/schema";
import { ENGINE_STATUSES } from "../engine/status";

import { PAGE_LIMIT_DEFAULT, PAGE_LIMIT_MAX } from "./paging";

export { PAGE_LIMIT_DEFAULT, PAGE_LIMIT_MAX };

export const FieldErrorSchema = z.object({ path: z.string(), message: z.string() });
export const ErrorBodySchema = z
  .object({ error: z.string().meta({ description: "What went wrong, in words." }), errors: z.array(FieldErrorSchema).optional() })
  .meta({ id: "Error", description: "Every refusal (4xx) has this body; `errors` lists field problems on a 400." });

const isoDateTime = z.string().meta({ description: "ISO 8601 date-time (UTC)", example: "2026-12-01T09:30:00.000Z" });
const id = z.number().int().positive();
const finite = z.number();

// ─── Paging ──────────────────────────────────────────────────────────────────────────────────
const pageParam = z.coerce.number().int("page is a whole number").min(1, "page starts at 1").max(100_000).default(1);
const limitParam = z.coerce
  .number()
  .int("limit is a whole number")
  .min(1, "limit is at least 1")
  .max(PAGE_LIMIT_MAX, `limit is at most ${PAGE_LIMIT_MAX}`)
  .default(PAGE_LIMIT_DEFAULT);
export const PageQuerySchema = z.strictObject({ page: pageParam, limit: limitParam });
const pageFields = { page: z.number().int(), limit: z.number().int(), total: z.number().int(), nextPage: z.number().int().nullable() };

// ─── Estimate and sweep (stateless) ──────────────────────────────────────────────────────────
export const UnitsSchema = z.enum(UNIT_SYSTEMS).meta({ description: "How sentences word their figures; numbers stay SI." });
export const PlanInputDoc = PlanInputSchema.meta({
  id: "PlanInput",
  description: "One plan in the clamp model's own shape (docs/clamp-model.md#inputs). Unknown keys inside it are ignored.",
});

export const EstimateRequestSchema = z.strictObject({ input: PlanInputDoc, units: UnitsSchema.optional() }).meta({ id: "EstimateRequest" });

export const SweepRowSchema = z.object({
  torqueNm: finite,
  weakestMargin: finite,
  weakestMarginNominal: finite,
  gainShare: finite,
  studUtilizationMax: finite,
  studWorkingUtilization: finite,
  bearingUtilizationMax: finite,
  mostlySqueezing: z.boolean(),
});
const nullableFigure = finite.nullable().meta({ description: "null where the limit never binds" });
export const CeilingSchema = z.looseObject({
  torqueNm: nullableFigure,
  cause: z.string(),
  torques: z.record(z.string(), nullableFigure),
  explanation: z.string(),
});
export const VerdictSchema = z.looseObject({
  status: z.enum(["holds", "thin", "short"]),
  headline: z.string(),
  limiting: z.string(),
  checks: z.array(z.looseObject({})),
});
export const PlanEstimateSchema = z
  .looseObject({
    tightening: z.looseObject({ torqueNm: finite, torquePerPreloadMm: finite, equivalentNutFactor: finite }),
    cylinders: z.array(z.looseObject({})),
    studs: z.array(z.looseObject({})),
    weakestCylinder: z.number().int(),
    weakestMargin: finite,
    weakestMarginNominal: finite,
    verdict: VerdictSchema,
    ceiling: CeilingSchema,
  })
  .meta({
    id: "PlanEstimate",
    description: "The clamp model's estimate (per-cylinder clamp, seal margins, stud stress, stiffness, warnings …); docs/clamp-model.md.",
  });
export const EstimateViewSchema = z
  .object({
    torqueNm: finite,
    estimate: PlanEstimateSchema,
    sweep: z.array(SweepRowSchema),
    ceiling: CeilingSchema,
    headSqueezeOnsetNm: finite.nullable(),
    targetMargin: finite,
    probabilityMarginBelowOne: finite,
    probabilityStudOverLimit: finite,
    weakestMarginBand: z.object({ p5: finite, p50: finite, p95: finite }),
    preloadSpread: z.object({ p2_5: finite, p97_5: finite }),
  })
  .meta({ id: "Estimate" });

/** Most torque a sweep reaches and most points it returns. */
export const SWEEP_MAX_NM = 5000;
export const SWEEP_MAX_POINTS = 201;
export const SweepRequestSchema = z
  .strictObject({
    input: PlanInputDoc,
    fromNm: z.number().min(0, "fromNm cannot be negative").max(SWEEP_MAX_NM, `fromNm is at most ${SWEEP_MAX_NM}`),
    toNm: z.number().gt(0, "toNm must be greater than zero").max(SWEEP_MAX_NM, `toNm is at most ${SWEEP_MAX_NM}`),
    points: z
      .number()
      .int("points is a whole number")
      .min(2, "points is at least 2")
      .max(SWEEP_MAX_POINTS, `points is at most ${SWEEP_MAX_POINTS}`)
      .default(41),
    units: UnitsSchema.optional(),
  })
  .refine((b) => b.toNm > b.fromNm, { message: "toNm must be above fromNm", path: ["toNm"] })
  .meta({ id: "SweepRequest" });
export const SweepPointSchema = SweepRowSchema.extend({
  preloadMinN: finite,
  preloadN: finite,
  preloadMaxN: finite,
  weakestCylinder: z.number().int(),
  headStrain: finite,
});
export const SweepResponseSchema = z
  .object({ points: z.array(SweepPointSchema), ceiling: CeilingSchema, headSqueezeOnsetNm: finite.nullable() })
  .meta({ id: "Sweep" });

// ─── Engines and plans (reads) ───────────────────────────────────────────────────────────────
export { ENGINE_STATUSES };
export const EngineListQuerySchema = PageQuerySchema.extend({
  q: z.string().max(100, "q is at most 100 characters").optional(),
  status: z.enum(ENGINE_STATUSES).optional(),
});
export const EngineSummarySchema = z.object({
  id,
  name: z.string(),
  customer: z.string(),
  cylinders: z.number().int(),
  layout: z.enum(LAYOUTS),
  boreMm: finite,
  fuel: z.string(),
  targetManifoldKpa: finite.nullable(),
  status: z.enum(ENGINE_STATUSES),
  chosenPlanName: z.string().nullable(),
  updatedAt: isoDateTime,
});
export const EngineListSchema = z.object({ items: z.array(EngineSummarySchema), ...pageFields }).meta({ id: "EngineList" });
export const StudRowSchema = z.object({
  label: z.string().optional(),
  serves: z.array(z.object({ cylinder: z.number().int(), share: finite })),
});
export const EngineSchema = z
  .object({
    id,
    name: z.string(),
    customer: z.string(),
    cylinders: z.number().int(),
    layout: z.enum(["inline", "V"]),
    boreMm: finite,
    strokeMm: finite,
    rodLengthMm: finite.nullable(),
    blockMaterialId: id,
    headMaterialId: id,
    headThicknessAtStudMm: finite,
    blockDepthToThreadMm: finite,
    sleeveKind: z.enum(["none", "dry", "wet-flange", "wet-mid"]),
    sleeveMaterialId: id.nullable(),
    sleeveWallMm: finite.nullable(),
    sleeveSupportLengthMm: finite.nullable(),
    sleeveProtrusionMm: finite,
    studs: z.array(StudRowSchema),
    fuel: z.string(),
    targetManifoldKpa: finite.nullable(),
    peakPressureMpa: finite.nullable(),
    peakPressureSource: z.enum(["measured", "estimated"]),
    pressureRiseFactor: finite,
    runningHeadC: finite,
    runningBlockC: finite,
    chamberCc: finite.nullable(),
    pistonVolumeCc: finite,
    deckClearanceMm: finite,
    status: z.enum(ENGINE_STATUSES),
    notes: z.string(),
    chosenPlanId: id.nullable(),
    createdAt: isoDateTime,
    updatedAt: isoDateTime,
  })
  .meta({ id: "Engine" });

export const PlanSchema = z
  .object({
    id,
    engineId: id,
    name: z.string(),
    chosen: z.boolean().meta({ description: "The engine's chosen plan" }),
    gasketId: id,
    fastenerId: id,
    lubricant: z.string(),
    threadFriction: finite,
    bearingFriction: finite,
    method: z.string(),
    torqueNm: finite,
    stagesNm: z.array(finite),
    wireLocation: z.string(),
    wireProjectionMm: finite.nullable(),
    receiverGrooveDepthMm: finite.nullable(),
    sleeveProtrusionMm: finite.nullable(),
    targetStretchMm: finite.nullable(),
    targetMargin: finite,
    notes: z.string(),
    updatedAt: isoDateTime,
  })
  .meta({ id: "Plan" });
export const PlanListSchema = z.object({ items: z.array(PlanSchema), ...pageFields }).meta({ id: "PlanList" });
export const PlanReadQuerySchema = z.strictObject({ units: UnitsSchema.optional() });
export const PlanWithEstimateSchema = z
  .object({
    plan: PlanSchema,
    input: z
      .looseObject({})
      .nullable()
      .meta({ description: "The plan as the clamp model's input (send it to /api/v1/sweep); null when it cannot be built." }),
    estimate: EstimateViewSchema.nullable(),
    problems: z.array(z.string()).meta({ description: "Why there is no estimate (empty when there is one)." }),
  })
  .meta({ id: "PlanWithEstimate" });

export { RUN_KINDS, RUN_OUTCOMES, RunCreateSchema, RunListQuerySchema, RunSchema, RunListSchema } from "./run-schemas";
