// The engine record as a builder enters it, SI with units in names (mm, kPa, MPa, °C, cc).
// Messages are written for the builder reading them beside the field.
import { z } from "zod";
import { LAYOUTS, StudSchema, type Stud } from "../clamp/schema";
import { studPatternIssues } from "../clamp/stud-shares";

export { SHARE_TOLERANCE, shareSum, sharesAddUp } from "../clamp/stud-shares";

import { ENGINE_STATUSES, type EngineStatus } from "./status";
export { ENGINE_STATUSES, type EngineStatus };
export const SLEEVE_KINDS = ["none", "dry", "wet-flange", "wet-mid"] as const;
export type SleeveKind = (typeof SLEEVE_KINDS)[number];
export { LAYOUTS };
export const PEAK_SOURCES = ["measured", "estimated"] as const;

/** Largest cylinder count and stud count a record may have. */
export const CYLINDERS_MAX = 16;
export const STUDS_MAX = 80;
/**
 * At most this many cross-field messages: enough to fix any real form, and never a list whose length
 * follows a number the sender chose (a cylinder count of 10⁹ once built one message per cylinder).
 */
export const CROSS_FIELD_ISSUES_MAX = 40;

// A number the builder typed: missing and not-a-number get their own words.
const num = (label: string, missing = `Give the ${label.toLowerCase()}`) =>
  z.number({ error: (iss) => (iss.input === undefined ? missing : `${label} must be a number`) });
const positive = (label: string, max: number, unit: string) =>
  num(label).gt(0, `${label} must be greater than zero`).lte(max, `${label} must be at most ${max} ${unit}`);
const between = (label: string, min: number, max: number, unit: string) =>
  num(label).gte(min, `${label} must be at least ${min} ${unit}`).lte(max, `${label} must be at most ${max} ${unit}`);
const materialId = (what: string) =>
  z
    .number({ error: `Choose the ${what} material` })
    .int(`Choose the ${what} material`)
    .positive(`Choose the ${what} material`);

export const EngineSchema = z
  .object({
    name: z.string().trim().min(1, "Name the engine").max(120, "Keep the name under 120 characters"),
    customer: z.string().trim().max(120, "Keep the customer under 120 characters").default(""),
    cylinders: num("Cylinder count")
      .int("Cylinder count is a whole number")
      .gte(1, "An engine has at least one cylinder")
      .lte(CYLINDERS_MAX, `At most ${CYLINDERS_MAX} cylinders`),
    layout: z.enum(LAYOUTS, "Pick inline or V"),
    boreMm: positive("Bore", 300, "mm"),
    strokeMm: positive("Stroke", 400, "mm"),
    rodLengthMm: positive("Rod length", 1000, "mm").optional(),
    blockMaterialId: materialId("block (deck)"),
    headMaterialId: materialId("head"),
    headThicknessAtStudMm: positive("Head thickness at the stud", 400, "mm"),
    blockDepthToThreadMm: between("Block depth to the engaged thread", 0, 200, "mm").default(0),
    sleeveKind: z.enum(SLEEVE_KINDS, "Pick a sleeve kind"),
    sleeveMaterialId: materialId("sleeve").optional(),
    sleeveWallMm: positive("Sleeve wall", 30, "mm").optional(),
    sleeveSupportLengthMm: positive("Sleeve support length", 300, "mm").optional(),
    sleeveProtrusionMm: between("Sleeve protrusion", -0.5, 1, "mm").default(0),
    studs: z.array(StudSchema).min(1, "Add at least one stud").max(STUDS_MAX, `At most ${STUDS_MAX} studs`),
    fuel: z.string().trim().max(60, "Keep the fuel under 60 characters").default(""),
    targetManifoldKpa: positive("Target manifold pressure", 1000, "kPa absolute (145 psi abs)"),
    peakPressureMpa: positive("Peak cylinder pressure", 100, "MPa (1000 bar, 14500 psi)").optional(),
    peakPressureSource: z.enum(PEAK_SOURCES, "Say whether the peak pressure is measured or estimated"),
    pressureRiseFactor: between("Pressure-rise factor", 1, 10, "").default(3),
    runningHeadC: between("Running head temperature", -40, 400, "°C").default(110),
    runningBlockC: between("Running block temperature", -40, 400, "°C").default(95),
    chamberCc: positive("Chamber volume", 500, "cc").optional(),
    pistonVolumeCc: between("Piston volume", -200, 200, "cc").default(0),
    deckClearanceMm: between("Deck clearance", -2, 5, "mm").default(0),
    status: z.enum(ENGINE_STATUSES, "Pick a status"),
    notes: z.string().max(4000, "Keep the notes under 4000 characters").default(""),
  })
  // Run the cross-field checks even when a field failed, so the builder sees every problem at once.
  .superRefine((e, ctx) => checkEngine(e, ctx), { when: () => true });

export type EngineInput = z.infer<typeof EngineSchema>;

const fmt = (x: number) => String(Math.round(x * 1000) / 1000);

const isNum = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);
/** A cylinder count that passed its own check (whole, 1 to CYLINDERS_MAX). */
const isCylinderCount = (v: unknown): v is number => Number.isInteger(v) && (v as number) >= 1 && (v as number) <= CYLINDERS_MAX;

// May see a partly invalid record (see `when` above): every check first asks whether its fields passed
// their own checks, so no loop or message list here grows with a number that already failed.
function checkEngine(e: EngineInput, ctx: z.RefinementCtx): void {
  let left = CROSS_FIELD_ISSUES_MAX;
  const issue = (path: (string | number)[], message: string) => {
    if (left-- > 0) ctx.addIssue({ code: "custom", path, message });
  };
  if (e.layout === "V" && isCylinderCount(e.cylinders) && e.cylinders % 2 !== 0)
    issue(["cylinders"], "A V engine needs an even number of cylinders");
  if (isNum(e.rodLengthMm) && isNum(e.strokeMm) && e.rodLengthMm <= e.strokeMm / 2)
    issue(["rodLengthMm"], `The rod must be longer than half the stroke (${fmt(e.strokeMm / 2)} mm)`);
  if (e.sleeveKind !== "none") {
    if (e.sleeveMaterialId === undefined) issue(["sleeveMaterialId"], "Choose the sleeve material");
    if (e.sleeveWallMm === undefined) issue(["sleeveWallMm"], "Give the sleeve wall thickness");
    if (e.sleeveKind === "wet-mid" && e.sleeveSupportLengthMm === undefined)
      issue(["sleeveSupportLengthMm"], "A wet sleeve with mid support needs the support length (sleeve top to the seat)");
  }
  if (e.peakPressureSource === "measured" && e.peakPressureMpa === undefined)
    issue(["peakPressureMpa"], "A measured peak pressure needs its value");
  const studsUsable =
    Array.isArray(e.studs) &&
    e.studs.length <= STUDS_MAX &&
    e.studs.every(
      (s) =>
        s &&
        Array.isArray(s.serves) &&
        s.serves.length <= CYLINDERS_MAX &&
        s.serves.every((v) => Number.isInteger(v?.cylinder) && v.cylinder >= 1 && isNum(v?.share)),
    );
  if (studsUsable && isCylinderCount(e.cylinders)) for (const i of studShareIssues(e.studs, e.cylinders)) issue(i.path, i.message);
}

/**
 * The stud pattern rule (`studPatternIssues` in app/lib/clamp/stud-shares.ts, the one the clamp model's
 * plan input applies), capped at CROSS_FIELD_ISSUES_MAX messages.
 */
export function studShareIssues(studs: Stud[], cylinders: number): { path: (string | number)[]; message: string }[] {
  // Only a count that passed its own check is looped over; the caller words a bad count.
  if (!isCylinderCount(cylinders)) return [];
  return studPatternIssues(studs, cylinders).slice(0, CROSS_FIELD_ISSUES_MAX);
}
