// The seal-plan form: what the builder types (in their display units) ⇄ the SI plan the database keeps.
// Shared by the editor's action (server) and its live estimate (browser).
import { z } from "zod";
import { TIGHTENING_METHODS } from "../clamp/schema";
import { formatQuantity, parseQuantity, toDisplay, unitFor, type Quantity, type UnitSystem } from "../units";

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
  targetMargin: number;
  notes: string;
}

export const METHOD_LABEL: Record<PlanWrite["method"], string> = {
  "torque-estimated-friction": "Torque wrench, friction estimated",
  "torque-tested-friction": "Torque wrench, friction tested on the parts",
  "angle-or-yield": "Torque plus angle, or yield-controlled",
  "stretch-measured": "Stud stretch measured",
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
    .number({ error: "Bearing friction is a number like 0.12" })
    .min(0.02, "Bearing friction must be at least 0.02")
    .max(0.6, "Bearing friction must be at most 0.6"),
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
];

export type PlanFormResult =
  | { ok: true; plan: PlanWrite }
  | { ok: false; errors: Record<string, string> };

function quantityIn(text: string, f: QuantityField, system: UnitSystem): { value?: number; error?: string } {
  const r = parseQuantity(text, f.quantity, unitFor(f.quantity, system));
  if (!r.ok) return { error: `${f.label}: ${r.message}` };
  const lo = formatQuantity(f.min, f.quantity, system);
  const hi = formatQuantity(f.max, f.quantity, system);
  if (r.valueSi < f.min - 1e-9 || r.valueSi > f.max + 1e-9) return { error: `${f.label} must be between ${lo} and ${hi}` };
  return { value: r.valueSi };
}

/** Parse the submitted form (display units) into an SI plan, or messages keyed by field name. */
export function parsePlanForm(form: Record<string, unknown>, system: UnitSystem): PlanFormResult {
  const errors: Record<string, string> = {};
  const plain = Plain.safeParse(form);
  if (!plain.success) for (const i of plain.error.issues) errors[String(i.path[0])] ??= i.message;

  const q: Record<string, number | null> = {};
  for (const f of QUANTITIES) {
    const text = String(form[f.name] ?? "").trim();
    if (text === "" && f.optional) {
      q[f.name] = null;
      continue;
    }
    const r = quantityIn(text, f, system);
    if (r.error) errors[f.name] = r.error;
    else q[f.name] = r.value!;
  }

  const stagesText = String(form.stages ?? "").trim();
  const stagesNm: number[] = [];
  if (stagesText !== "") {
    for (const part of stagesText.split(/[,;/]+/)) {
      const r = quantityIn(part, { name: "stages", quantity: "torque", min: 1, max: 5000, label: "Each stage" }, system);
      if (r.error) {
        errors.stages ??= r.error;
        break;
      }
      stagesNm.push(r.value!);
    }
    if (!errors.stages && stagesNm.some((s, i) => i > 0 && s <= stagesNm[i - 1]!))
      errors.stages = "Stages must rise, ending at the final torque";
  }
  const torqueNm = q.torque;
  if (!errors.stages && !errors.torque && torqueNm != null && stagesNm.length > 0) {
    const last = stagesNm[stagesNm.length - 1]!;
    if (Math.abs(last - torqueNm) > Math.max(0.5, torqueNm * 0.005)) errors.stages = "The last stage must equal the final torque";
    else stagesNm[stagesNm.length - 1] = torqueNm;
  }
  if (!errors.wireProjection && !errors.receiverGrooveDepth && q.receiverGrooveDepth! > q.wireProjection! + 1e-9 && q.wireProjection! > 0)
    errors.receiverGrooveDepth = "A receiver groove deeper than the wire stands proud leaves the wire unloaded";

  if (Object.keys(errors).length > 0 || !plain.success) return { ok: false, errors };
  return {
    ok: true,
    plan: {
      ...plain.data,
      torqueNm: torqueNm!,
      stagesNm: stagesNm.length > 0 ? stagesNm : [torqueNm!],
      wireProjectionMm: plain.data.wireLocation === "none" ? 0 : q.wireProjection!,
      receiverGrooveDepthMm: plain.data.wireLocation === "none" ? 0 : q.receiverGrooveDepth!,
      sleeveProtrusionMm: q.sleeveProtrusion ?? null,
    },
  };
}

function num(valueSi: number, quantity: Quantity, system: UnitSystem, decimals: number): string {
  const v = toDisplay(quantity, valueSi, unitFor(quantity, system));
  return String(Number(v.toFixed(decimals)));
}

/** A saved plan as the form shows it, in the person's units. */
export function planFormValues(plan: PlanWrite, system: UnitSystem): Record<string, string> {
  const smallDecimals = system === "metric" ? 3 : 2;
  return {
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
    targetMargin: String(plan.targetMargin),
    notes: plan.notes,
  };
}
