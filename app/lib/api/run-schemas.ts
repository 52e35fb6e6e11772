// The run log's API shapes: one dyno session or pass on one engine, as a dyno laptop would log it.
import { z } from "zod";
import { PAGE_LIMIT_DEFAULT, PAGE_LIMIT_MAX } from "./paging";

// The run log's own kinds and outcomes (one list, app/lib/records/run.ts).
export { RUN_KINDS, OUTCOMES as RUN_OUTCOMES } from "../records/run";
import { RUN_KINDS, OUTCOMES as RUN_OUTCOMES } from "../records/run";

const isoDate = z.iso.date("ranOn is a date like 2026-12-01");

export const RunCreateSchema = z
  .strictObject({
    engineId: z.number().int("engineId is a whole number").positive("engineId is a record id"),
    ranOn: isoDate,
    kind: z.enum(RUN_KINDS, `kind is one of ${RUN_KINDS.join(", ")}`),
    manifoldPressureKpa: z
      .number()
      .gt(0, "manifoldPressureKpa is absolute and above zero")
      .max(1000, "manifoldPressureKpa is at most 1000")
      .nullable()
      .default(null),
    fuel: z.string().trim().max(60, "fuel is at most 60 characters").default(""),
    peakCylinderPressureMpa: z
      .number()
      .gt(0, "peakCylinderPressureMpa must be above zero")
      .max(60, "peakCylinderPressureMpa is at most 60")
      .nullable()
      .default(null),
    peakPressureSource: z.enum(["measured", "estimated"], "peakPressureSource is measured or estimated").default("estimated"),
    outcome: z.enum(RUN_OUTCOMES, `outcome is one of ${RUN_OUTCOMES.join(", ")}`),
    cylindersAffected: z
      .array(z.number().int("cylinder numbers are whole numbers").min(1, "cylinders start at 1").max(16, "at most cylinder 16"))
      .max(16, "at most 16 cylinders")
      .refine((c) => new Set(c).size === c.length, "each cylinder once")
      .default([]),
    notes: z.string().max(4000, "notes are at most 4000 characters").default(""),
    teardownFindings: z.string().max(4000, "teardownFindings are at most 4000 characters").default(""),
  })
  .meta({ id: "RunCreate", description: "manifoldPressureKpa is absolute (kPa); peak pressure in MPa." });

export const RunSchema = z
  .object({
    id: z.number().int().positive(),
    engineId: z.number().int().positive(),
    ranOn: z.string(),
    kind: z.enum(RUN_KINDS),
    manifoldPressureKpa: z.number().nullable(),
    fuel: z.string(),
    peakCylinderPressureMpa: z.number().nullable(),
    peakPressureSource: z.enum(["measured", "estimated"]),
    outcome: z.enum(RUN_OUTCOMES),
    cylindersAffected: z.array(z.number().int()),
    notes: z.string(),
    teardownFindings: z.string(),
    planId: z.number().int().positive().nullable().meta({ description: "The plan on the engine when it ran, when known" }),
    createdBy: z.number().int().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: "Run" });

export const RunListQuerySchema = z.strictObject({
  engineId: z.coerce.number().int().positive("engineId is a record id").optional(),
  kind: z.enum(RUN_KINDS).optional(),
  outcome: z.enum(RUN_OUTCOMES).optional(),
  from: isoDate.optional().meta({ description: "earliest ranOn, inclusive" }),
  to: isoDate.optional().meta({ description: "latest ranOn, inclusive" }),
  cursor: z
    .string()
    .regex(/^[1-9][0-9]{0,15}$/, "cursor is the nextCursor of the last page")
    .optional(),
  limit: z.coerce
    .number()
    .int()
    .min(1, "limit is at least 1")
    .max(PAGE_LIMIT_MAX, `limit is at most ${PAGE_LIMIT_MAX}`)
    .default(PAGE_LIMIT_DEFAULT),
});

export const RunListSchema = z
  .object({
    items: z.array(RunSchema),
    limit: z.number().int(),
    nextCursor: z.string().nullable().meta({ description: "Pass as ?cursor= for the next page; null on the last." }),
  })
  .meta({ id: "RunList" });
