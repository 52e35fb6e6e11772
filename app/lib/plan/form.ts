// The seal-plan form: what the builder types (in their display units) ⇄ the SI plan the database keeps.
// One schema (planFormSchema) for the new-plan and editor actions (through Conform) and the live estimate in the browser (parsePlanForm).
import { z } from "zod";
import { TIGHTENING_METHODS } from "../clamp/plan-lists";
import { formatQuantity, parseQuantity, toDisplay, unitFor, type DisplayUnit, type Quantity, type UnitSystem } from "../units";
import { decimalPoint, splitList } from "../units/decimal-comma";
import { figuresFingerprint, makerPlanFigures, type MakerFigures } from "./fastener-figures";

export const WIRE_LOCATIONS = ["none", "head", "block"] as const;

export interface PlanWrite {
  name: string;
  gasketId: number;
  fastenerId: number;
  lubricant: string;
  threadFriction: number;
  bearingFriction: number;
  method: (typeof TIGHTENING_METHODS)[number];
  torqueNm: number;
  stagesNm: number[];
  wireLocation: (typeof WIRE_LOCATIONS)[number];
  wireProjectionMm: number;
  receiverGrooveDepthMm: number;
  sleeveProtrusionMm: number | null;
  /** With a stretch gauge: the stretch to tighten to (the estimate then follows it); null: planned by torque. */
  targetStretchMm: number | null;
  targetMargin: number;
  notes: string;
}

// How the studs are tightened, in a builder's words (the stored values stay the model's names).
export const METHOD_LABEL: Record<PlanWrite["method"], string> = {
  "torque-estimated-friction": "Torque wrench",
  "torque-tested-friction": "Torque wrench, lube tested on these studs",
  "angle-or-yield": "Torque, then angle",
  "stretch-measured": "Stretch gauge",
};

/** What each method means for the clamp, for the help under the select. */
export const METHOD_HELP: Record<PlanWrite["method"], string> = {
  "torque-estimated-friction":
    "Torque wrench with the friction taken from the library or the lube's usual range: the clamp varies most from stud to stud.",
  "torque-tested-friction":
    "Torque wrench, with the friction found by tightening these studs with this lube and measuring: less spread than an estimated friction.",
  "angle-or-yield": "Snug to a torque, then turn a set angle (or to the yield point): the least spread of clamp.",
  "stretch-measured": "Tighten until a stretch gauge on the stud reads the target stretch: the clamp follows the stretch, not the torque.",
};

export const WIRE_LABEL: Record<PlanWrite["wireLocation"], string> = {
  none: "No wire ring",
  head: "Wire ring in the head",
  block: "Wire ring in the block / sleeve",
};

const Plain = z.object({
  name: z.string().trim().min(1, "Name the plan").max(120, "Keep the plan name under 120 characters"),
  gasketId: z.coerce.number({ error: "Pick a gasket" }).int("Pick a gasket").positive("Pick a gasket"),
  fastenerId: z.coerce.number({ error: "Pick a fastener" }).int("Pick a fastener").positive("Pick a fastener"),
  lubricant: z.string().trim().max(120, "Keep the lubricant under 120 characters").default(""),
  threadFriction: z.coerce
    .number({ error: "Thread friction is a number like 0.12" })
    .min(0.02, "Thread friction must be at least 0.02")
    .max(0.6, "Thread friction must be at most 0.6"),
  bearingFriction: z.coerce
    .number({ error: "Washer-face friction is a number like 0.12" })
    .min(0.02, "Washer-face friction must be at least 0.02")
    .max(0.6, "Washer-face friction must be at most 0.6"),
  method: z.enum(TIGHTENING_METHODS, "Pick how the studs are tightened"),
  wireLocation: z.enum(WIRE_LOCATIONS, "Pick where the wire ring sits"),
  targetMargin: z.coerce
    .number({ error: "Target margin is a number like 1.5" })
    .min(1, "A target margin under 1 means planning to leak; use at least 1")
    .max(10, "Target margin must be at most 10"),
  notes: z.string().max(4000, "Keep notes under 4000 characters").default(""),
});

type QuantityField = { name: string; quantity: Quantity; optional?: boolean; min: number; max: number; label: string };

// Quantity fields and their accepted SI range.
const QUANTITIES: QuantityField[] = [
  { name: "torque", quantity: "torque", min: 1, max: 5000, label: "Torque" },
  { name: "wireProjection", quantity: "smallLength", min: 0, max: 2, label: "Wire projection" },
  { name: "receiverGrooveDepth", quantity: "smallLength", min: 0, max: 2, label: "Receiver groove depth" },
  { name: "sleeveProtrusion", quantity: "smallLength", optional: true, min: -0.5, max: 1, label: "Sleeve protrusion" },
  { name: "targetStretch", quantity: "smallLength", optional: true, min: 0.01, max: 2, label: "Target stretch" },
];

// Plain numbers typed with a decimal comma are read like the quantities (see app/lib/units/decimal-comma.ts).
const PLAIN_NUMBERS = ["threadFriction", "bearingFriction", "targetMargin"] as const;

export type PlanFormResult = { ok: true; plan: PlanWrite } | { ok: false; errors: Record<string, string> };

function quantityIn(
  text: string,
  f: QuantityField,
  system: UnitSystem,
  fieldUnit: DisplayUnit = unitFor(f.quantity, system),
): { value?: number; unit?: DisplayUnit; error?: string } {
  const r = parseQuantity(decimalPoint(text), f.quantity, fieldUnit);
  if (!r.ok) return { error: `${f.label}: ${r.message}` };
  const lo = formatQuantity(f.min, f.quantity, system);
  const hi = formatQuantity(f.max, f.quantity, system);
  if (r.valueSi < f.min - 1e-9 || r.valueSi > f.max + 1e-9) return { error: `${f.label} must be between ${lo} and ${hi}` };
  return { value: r.valueSi, unit: r.unit };
}

const STAGE: QuantityField = { name: "stages", quantity: "torque", min: 1, max: 5000, label: "Each stage" };

/**
 * The stage list as typed: "60, 110, 150", "40, 80, then 115 lbf·ft" or "54,2; 108,5; 156".
 * A stage without a unit is read in the unit written in the list, else the unit typed with the
 * final torque, else the field's: the stages go with the torque when its unit changes.
 */
function stagesIn(text: string, torqueUnit: DisplayUnit, system: UnitSystem): { stagesNm: number[]; error?: string } {
  const parts = splitList(text).map((p) => p.replace(/^(then|and)\s+/i, ""));
  const suffixed = parts.map((p) => /\d\s*[^\d\s.,]/.test(p));
  let listUnit: DisplayUnit = torqueUnit;
  for (let i = parts.length - 1; i >= 0; i--) {
    if (!suffixed[i]) continue;
    const r = parseQuantity(decimalPoint(parts[i]!), "torque", torqueUnit);
    if (r.ok) listUnit = r.unit;
    break;
  }
  const stagesNm: number[] = [];
  for (const part of parts) {
    const r = quantityIn(part, STAGE, system, listUnit);
    if (r.error) return { stagesNm, error: r.error };
    stagesNm.push(r.value!);
  }
  return { stagesNm };
}

// ─── One post of the plan form ────────────────────────────────────────────────────────────

/**
 * The fields the form posts, each as typed: the plan's own, the marker of the maker's figures shown
 * (see figuresFollowStep) and whether every gasket is offered. Conform reads a blank field as missing,
 * so each may be absent.
 */
export const PLAN_FORM_FIELDS = [
  "name",
  "gasketId",
  "fastenerId",
  "lubricant",
  "threadFriction",
  "bearingFriction",
  "method",
  "torque",
  "stages",
  "wireLocation",
  "wireProjection",
  "receiverGrooveDepth",
  "sleeveProtrusion",
  "targetStretch",
  "targetMargin",
  "notes",
  "figuresFastenerId",
  "figuresSeen",
  "showAllGaskets",
] as const;
export type PlanFormField = (typeof PLAN_FORM_FIELDS)[number];

const typed = z.string().optional();
export const PlanFormFields = z.object(Object.fromEntries(PLAN_FORM_FIELDS.map((f) => [f, typed])) as Record<PlanFormField, typeof typed>);
/** What the form shows and posts: every field as a string. */
export type PlanFormValues = z.input<typeof PlanFormFields>;

/**
 * The plan form's schema for Conform (and, through parsePlanForm, the browser's live estimate): the
 * fields as typed in the person's units → the SI plan. Each message is filed under the field the
 * builder sees, the cross-field ones too: stages that do not rise or do not end at the torque under
 * "stages", a receiver groove deeper than the wire stands under "receiverGrooveDepth".
 */
function buildPlanFormSchema(system: UnitSystem) {
  return PlanFormFields.transform((typedForm, ctx): PlanWrite => {
    const form = Object.fromEntries(PLAN_FORM_FIELDS.map((f) => [f, typedForm[f] ?? ""])) as Record<PlanFormField, string>;
    const errors: Partial<Record<PlanFormField, string>> = {};
    const normalized: Record<string, unknown> = { ...form };
    for (const k of PLAIN_NUMBERS) normalized[k] = decimalPoint(form[k]);
    const plain = Plain.safeParse(normalized);
    if (!plain.success) for (const i of plain.error.issues) errors[String(i.path[0]) as PlanFormField] ??= i.message;

    const byStretch = form.method === "stretch-measured";
    const q: Record<string, number | null> = {};
    let torqueUnit = unitFor("torque", system);
    for (const f of QUANTITIES) {
      const name = f.name as PlanFormField;
      const text = form[name].trim();
      // the target stretch means something only with a stretch gauge
      if ((text === "" && f.optional) || (name === "targetStretch" && !byStretch)) {
        q[name] = null;
        continue;
      }
      const r = quantityIn(text, f, system);
      if (r.error) errors[name] = r.error;
      else q[name] = r.value!;
      if (name === "torque" && r.unit) torqueUnit = r.unit;
    }

    const stagesText = form.stages.trim();
    let stagesNm: number[] = [];
    if (stagesText !== "") {
      const r = stagesIn(stagesText, torqueUnit, system);
      stagesNm = r.stagesNm;
      if (r.error) errors.stages = r.error;
      else if (stagesNm.some((s, i) => i > 0 && s <= stagesNm[i - 1]!)) errors.stages = "Stages must rise, ending at the final torque";
    }
    const torqueNm = q.torque;
    if (!errors.stages && !errors.torque && torqueNm != null && stagesNm.length > 0) {
      const last = stagesNm[stagesNm.length - 1]!;
      if (Math.abs(last - torqueNm) > Math.max(0.5, torqueNm * 0.005)) errors.stages = "The last stage must equal the final torque";
      else stagesNm[stagesNm.length - 1] = torqueNm;
    }
    if (!errors.wireProjection && !errors.receiverGrooveDepth && q.receiverGrooveDepth! > q.wireProjection! + 1e-9 && q.wireProjection! > 0)
      errors.receiverGrooveDepth = "A receiver groove deeper than the wire stands proud leaves the wire unloaded";

    if (Object.keys(errors).length > 0 || !plain.success) {
      for (const [field, message] of Object.entries(errors)) ctx.addIssue({ code: "custom", path: [field], message });
      return z.NEVER;
    }
    return {
      ...plain.data,
      torqueNm: torqueNm!,
      stagesNm: stagesNm.length > 0 ? stagesNm : [torqueNm!],
      wireProjectionMm: plain.data.wireLocation === "none" ? 0 : q.wireProjection!,
      receiverGrooveDepthMm: plain.data.wireLocation === "none" ? 0 : q.receiverGrooveDepth!,
      sleeveProtrusionMm: q.sleeveProtrusion ?? null,
      targetStretchMm: byStretch ? (q.targetStretch ?? null) : null,
    };
  });
}

const schemaFor: Partial<Record<UnitSystem, ReturnType<typeof buildPlanFormSchema>>> = {};

/** The plan form's schema for the person's units, built once per unit system. */
export function planFormSchema(system: UnitSystem) {
  return (schemaFor[system] ??= buildPlanFormSchema(system));
}

/**
 * The plan form's schema as a plain function, for the live estimate in the browser and for an answer
 * that must estimate the values it shows: the SI plan, or the first message per field.
 */
export function parsePlanForm(form: Record<string, unknown>, system: UnitSystem): PlanFormResult {
  const r = planFormSchema(system).safeParse(form);
  if (r.success) return { ok: true, plan: r.data };
  const errors: Record<string, string> = {};
  for (const i of r.error.issues) errors[String(i.path[0] ?? "")] ??= i.message;
  return { ok: false, errors };
}

function num(valueSi: number, quantity: Quantity, system: UnitSystem, decimals: number): string {
  const v = toDisplay(quantity, valueSi, unitFor(quantity, system));
  return String(Number(v.toFixed(decimals)));
}

/** A saved plan as the form shows it, in the person's units. */
export function planFormValues(plan: PlanWrite, system: UnitSystem): Record<Exclude<PlanFormField, "showAllGaskets">, string> {
  const smallDecimals = system === "metric" ? 3 : 2;
  const values = {
    name: plan.name,
    gasketId: String(plan.gasketId),
    fastenerId: String(plan.fastenerId),
    lubricant: plan.lubricant,
    threadFriction: String(plan.threadFriction),
    bearingFriction: String(plan.bearingFriction),
    method: plan.method,
    torque: num(plan.torqueNm, "torque", system, 1),
    stages: plan.stagesNm.map((s) => num(s, "torque", system, 1)).join(", "),
    wireLocation: plan.wireLocation,
    wireProjection: num(plan.wireProjectionMm, "smallLength", system, smallDecimals),
    receiverGrooveDepth: num(plan.receiverGrooveDepthMm, "smallLength", system, smallDecimals),
    sleeveProtrusion: plan.sleeveProtrusionMm === null ? "" : num(plan.sleeveProtrusionMm, "smallLength", system, smallDecimals),
    targetStretch:
      plan.targetStretchMm === null || plan.targetStretchMm === undefined
        ? ""
        : num(plan.targetStretchMm, "smallLength", system, smallDecimals),
    targetMargin: String(plan.targetMargin),
    notes: plan.notes,
  };
  // which fastener the torque, stages, lubricant and friction shown belong to (see figuresFollowStep)
  return { ...values, figuresFastenerId: values.fastenerId, figuresSeen: figuresFingerprint(values) };
}

/** The copy-a-plan form: which engine of the shop gets the copy. */
export const CopyPlanSchema = z.object({
  targetEngineId: z.coerce
    .number({ error: "Pick the engine to copy the plan to." })
    .int("Pick the engine to copy the plan to.")
    .positive("Pick the engine to copy the plan to."),
});

/**
 * A new plan when the engine has none to start from: the fastener maker's figures (or wrench-set
 * defaults), a torque wrench, a target margin of 1.5 and, on a solid copper gasket, a wire ring in the
 * block standing 0.1 mm proud (common practice for a receiver-groove copper seal).
 */
export function startingPlan(
  fastener: MakerFigures | undefined,
  gasket: { id: number; type: string } | undefined,
  units: UnitSystem,
): PlanWrite {
  const copper = gasket?.type === "solid-copper";
  return {
    name: "",
    gasketId: gasket?.id ?? 0,
    ...makerPlanFigures(fastener, units),
    method: "torque-estimated-friction",
    wireLocation: copper ? "block" : "none",
    wireProjectionMm: copper ? 0.1 : 0,
    receiverGrooveDepthMm: 0,
    sleeveProtrusionMm: null,
    targetStretchMm: null,
    targetMargin: 1.5,
    notes: "",
  };
}

/** The accepted SI range of a torque and a sleeve protrusion (as the plan form's fields check them). */
const TORQUE_RANGE = QUANTITIES.find((q) => q.name === "torque")!;
const PROTRUSION_RANGE = QUANTITIES.find((q) => q.name === "sleeveProtrusion")!;

/**
 * The figures a suggestion's Apply button posts (torqueNm, protrusionMm, SI): read and range-checked
 * like the plan form's fields. A blank protrusion keeps `currentProtrusionMm`.
 */
export function readSuggestedFigures(
  form: { torqueNm?: unknown; protrusionMm?: unknown },
  currentProtrusionMm: number | null,
): { ok: true; torqueNm: number; protrusionMm: number | null } | { ok: false; message: string } {
  const torqueNm = Number(form.torqueNm);
  const blank = form.protrusionMm === undefined || form.protrusionMm === "";
  const protrusionMm = blank ? currentProtrusionMm : Number(form.protrusionMm);
  const inRange = (v: number, f: QuantityField) => v >= f.min && v <= f.max;
  if (!(inRange(torqueNm, TORQUE_RANGE) && torqueNm > 0) || (protrusionMm !== null && !inRange(protrusionMm, PROTRUSION_RANGE)))
    return { ok: false, message: "The suggested figures are out of range." };
  return { ok: true, torqueNm, protrusionMm };
}
