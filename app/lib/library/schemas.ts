// The shop's library records, SI as stored, with messages written for the builder beside the field.
import { z } from "zod";
import { fastenerIssues } from "../clamp/fastener-checks";
import { LIBRARY_GASKET_TYPES, MATERIAL_KINDS, THREAD_SYSTEMS } from "./labels";

const num = (label: string) => z.number({ error: `Enter ${label.toLowerCase()} as a number` });
const positive = (label: string, max: number, unit: string) =>
  num(label).gt(0, `${label} must be greater than zero`).lte(max, `${label} looks too large (over ${max} ${unit})`);
const nonNegative = (label: string, max: number, unit: string) =>
  num(label).gte(0, `${label} cannot be negative`).lte(max, `${label} looks too large (over ${max} ${unit})`);
/**
 * A cross-field check runs only when the fields it reads passed their own checks: it never sees a value
 * that was already refused (an out-of-range number, a missing one), and the builder gets one message per field.
 */
function fieldsPassed(fields: readonly string[]) {
  return (payload: { issues: readonly { path?: readonly PropertyKey[] }[] }) =>
    // an issue without a path is the record itself (not an object at all): nothing to cross-check
    !payload.issues.some((i) => !i.path?.length || fields.includes(String(i.path[0])));
}
const name = z.string().trim().min(1, "Give it a name the shop will recognise").max(120, "Keep the name under 120 characters");
const text = (label: string, max: number) => z.string().trim().max(max, `Keep ${label} under ${max} characters`);

export const MaterialSchema = z.object({
  name,
  kind: z.enum(MATERIAL_KINDS, "Pick what kind of material it is"),
  modulusMpa: positive("Modulus", 400_000, "MPa"),
  yieldMpa: positive("Yield strength", 3000, "MPa").nullable(),
  expansionUmPerMC: positive("Expansion coefficient", 40, "µm/m·°C"),
  limitingSurfacePressureMpa: positive("Washer bearing limit", 3000, "MPa").nullable(),
  shearStrengthMpa: positive("Shear strength", 3000, "MPa").nullable().default(null),
});
export type MaterialInput = z.infer<typeof MaterialSchema>;

export const FastenerSchema = z
  .object({
    name,
    threadSystem: z.enum(THREAD_SYSTEMS, "Pick metric or unified inch thread"),
    diameterMm: positive("Thread diameter", 40, "mm"),
    pitchMm: positive("Thread pitch", 6, "mm"),
    reducedShankDiameterMm: positive("Reduced shank diameter", 40, "mm").nullable(),
    reducedShankLengthMm: nonNegative("Reduced shank length", 500, "mm"),
    freeThreadLengthMm: nonNegative("Free thread length", 500, "mm"),
    engagementMm: positive("Thread engagement", 200, "mm"),
    materialId: z.number({ error: "Pick the stud material" }).int("Pick the stud material").positive("Pick the stud material"),
    washerOdMm: positive("Washer outer diameter", 100, "mm"),
    washerHoleMm: positive("Washer hole", 60, "mm"),
    washerThicknessMm: nonNegative("Washer thickness", 20, "mm"),
    nutFaceOdMm: positive("Nut face diameter", 100, "mm").nullable().default(null),
    washerHardnessHv: positive("Washer hardness", 1000, "HV").nullable().default(null),
    makerTorqueNm: positive("Maker's torque", 5000, "N·m").nullable(),
    makerLubricant: text("the lubricant", 120),
    makerStages: text("the stages", 200),
    makerStretchMm: positive("Maker's stretch figure", 5, "mm").nullable(),
    threadFriction: num("Thread friction").gte(0.02, "Thread friction is at least 0.02").lte(0.6, "Thread friction is at most 0.6"),
    bearingFriction: num("Bearing friction").gte(0.02, "Bearing friction is at least 0.02").lte(0.6, "Bearing friction is at most 0.6"),
  })
  .superRefine(
    (f, ctx) => {
      for (const issue of fastenerIssues(f)) ctx.addIssue({ code: "custom", path: [issue.field], message: issue.message });
    },
    { when: fieldsPassed(["diameterMm", "pitchMm", "reducedShankDiameterMm", "reducedShankLengthMm", "washerOdMm", "washerHoleMm"]) },
  );
export type FastenerInput = z.infer<typeof FastenerSchema>;

export const GasketSchema = z
  .object({
    name,
    type: z.enum(LIBRARY_GASKET_TYPES, "Pick the gasket type"),
    compressedThicknessMm: positive("Compressed thickness", 10, "mm"),
    boreMm: positive("Gasket bore", 300, "mm"),
    sealDiameterMm: positive("Seal diameter", 400, "mm"),
    ringWidthMm: positive("Ring width", 30, "mm"),
    ringModulusMpa: positive("Ring modulus", 400_000, "MPa"),
    sealLineYieldMpa: positive("Seal-line yield", 3000, "MPa"),
    bodyModulusMpa: positive("Body modulus", 400_000, "MPa"),
    bodyAreaPerBoreMm2: positive("Body area per bore", 200_000, "mm²"),
    expansionUmPerMC: positive("Expansion coefficient", 40, "µm/m·°C"),
    m: num("Gasket factor m").gt(0, "Gasket factor m must be greater than zero").lte(20, "Gasket factor m is at most 20"),
    yMpa: positive("Seating stress y", 1000, "MPa"),
    relaxationPercent: num("Relaxation").gte(0, "Relaxation cannot be negative").lte(50, "Relaxation is at most 50 %"),
    finishMinRaUm: positive("Smoothest finish", 25, "µm Ra").nullable(),
    finishMaxRaUm: positive("Roughest finish", 25, "µm Ra").nullable(),
    sealLineHardnessMpa: positive("Seal-line hardness", 5000, "MPa").nullable().default(null),
    beadLoadNPerMm: positive("Bead load", 5000, "N/mm").nullable().default(null),
    beadTravelMm: positive("Bead travel", 2, "mm").nullable().default(null),
    seatingPressureMpa: positive("Seating pressure", 2000, "MPa").nullable().default(null),
    minServicePressureMpa: positive("Minimum service pressure", 2000, "MPa").nullable().default(null),
    maxPressureMpa: positive("Maximum pressure", 5000, "MPa").nullable().default(null),
    bodySealPressureMpa: positive("Body seal pressure", 500, "MPa").nullable().default(null),
  })
  .superRefine(
    (g, ctx) => {
      for (const issue of gasketConsistency(g)) ctx.addIssue({ code: "custom", path: [issue.field], message: issue.message });
    },
    { when: fieldsPassed(["boreMm", "sealDiameterMm", "ringWidthMm", "finishMinRaUm", "finishMaxRaUm"]) },
  );
export type GasketInput = z.infer<typeof GasketSchema>;

export interface ConsistencyIssue {
  field: string;
  message: string;
}

/** Checks across gasket fields: the seal band outside the gasket bore, a finish window that is a window. */
function gasketConsistency(g: {
  boreMm: number;
  sealDiameterMm: number;
  ringWidthMm: number;
  finishMinRaUm: number | null;
  finishMaxRaUm: number | null;
  seatingPressureMpa?: number | null;
  minServicePressureMpa?: number | null;
  maxPressureMpa?: number | null;
}): ConsistencyIssue[] {
  const out: ConsistencyIssue[] = [];
  if (g.sealDiameterMm - g.ringWidthMm <= g.boreMm)
    out.push({
      field: "sealDiameterMm",
      message: "The seal band (seal diameter less ring width) must sit outside the gasket bore",
    });
  if (((g.seatingPressureMpa ?? null) === null) !== ((g.minServicePressureMpa ?? null) === null))
    out.push({ field: "minServicePressureMpa", message: "Give both the seating pressure and the minimum service pressure, or neither" });
  if (g.minServicePressureMpa != null && g.maxPressureMpa != null && g.maxPressureMpa <= g.minServicePressureMpa)
    out.push({ field: "maxPressureMpa", message: "The maximum pressure must be above the minimum service pressure" });
  if (g.finishMinRaUm !== null && g.finishMaxRaUm !== null && g.finishMinRaUm > g.finishMaxRaUm)
    out.push({ field: "finishMaxRaUm", message: "The roughest finish must be at least the smoothest" });
  return out;
}
