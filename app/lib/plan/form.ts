// The seal-plan form's schema: what the builder types (in their display units) → the SI plan the database
// keeps. One schema (planFormSchema) for the new-plan and editor actions (through Conform) and the live
// estimate in the browser (parsePlanForm). The fields and labels are in ./form-fields.
import { z } from "zod";
import { TIGHTENING_METHODS } from "../clamp/plan-lists";
import { formatQuantity, parseQuantity, unitFor, type DisplayUnit, type UnitSystem } from "../units";
import { decimalPoint, splitList } from "../units/decimal-comma";
import { PLAN_FORM_FIELDS, PLAN_QUANTITIES, WIRE_LOCATIONS, type PlanFormField, type PlanWrite, type QuantityField } from "./form-fields";

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

const typed = z.string().optional();
export const PlanFormFields = z.object(Object.fromEntries(PLAN_FORM_FIELDS.map((f) => [f, typed])) as Record<PlanFormField, typeof typed>);

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
    for (const f of PLAN_QUANTITIES) {
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

/** The copy-a-plan form: which engine of the shop gets the copy. */
export const CopyPlanSchema = z.object({
  targetEngineId: z.coerce
    .number({ error: "Pick the engine to copy the plan to." })
    .int("Pick the engine to copy the plan to.")
    .positive("Pick the engine to copy the plan to."),
});
