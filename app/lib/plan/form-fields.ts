// The seal-plan form's fields and how a saved plan fills them, without the schema that reads a post
// (app/lib/plan/form.ts): the page shows these with its first JavaScript; the schema, and zod with it,
// loads with the live estimate after the first paint.
import type { TIGHTENING_METHODS } from "../clamp/plan-lists";
import { toDisplay, unitFor, type Quantity, type UnitSystem } from "../units";
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

export type QuantityField = { name: string; quantity: Quantity; optional?: boolean; min: number; max: number; label: string };

// Quantity fields and their accepted SI range.
export const PLAN_QUANTITIES: QuantityField[] = [
  { name: "torque", quantity: "torque", min: 1, max: 5000, label: "Torque" },
  { name: "wireProjection", quantity: "smallLength", min: 0, max: 2, label: "Wire projection" },
  { name: "receiverGrooveDepth", quantity: "smallLength", min: 0, max: 2, label: "Receiver groove depth" },
  { name: "sleeveProtrusion", quantity: "smallLength", optional: true, min: -0.5, max: 1, label: "Sleeve protrusion" },
  { name: "targetStretch", quantity: "smallLength", optional: true, min: 0.01, max: 2, label: "Target stretch" },
];

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
/** What the form shows and posts: every field as a string. */
export type PlanFormValues = Partial<Record<PlanFormField, string>>;

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
const TORQUE_RANGE = PLAN_QUANTITIES.find((q) => q.name === "torque")!;
const PROTRUSION_RANGE = PLAN_QUANTITIES.find((q) => q.name === "sleeveProtrusion")!;

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
