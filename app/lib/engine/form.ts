// The engine form: fields as typed in the person's units ⇄ the SI engine input.
import { z } from "zod";
import { defaultStudPattern } from "../clamp/pattern";
import type { Stud } from "../clamp/schema";
import { formatShare } from "./labels";
import { EngineSchema, type EngineInput } from "./schema";
import { inputValue, readQuantity, type Quantity, type UnitSystem } from "../units";
import { decimalPoint } from "../units/decimal-comma";

/** Numeric fields of the form and the quantity each is typed in (null: a plain number). */
export const NUMBER_FIELDS = {
  cylinders: null,
  boreMm: "length",
  strokeMm: "length",
  rodLengthMm: "length",
  headThicknessAtStudMm: "length",
  blockDepthToThreadMm: "length",
  sleeveWallMm: "length",
  sleeveSupportLengthMm: "length",
  sleeveProtrusionMm: "smallLength",
  targetManifoldKpa: "manifold",
  peakPressureMpa: "pressure",
  pressureRiseFactor: null,
  runningHeadC: "temperature",
  runningBlockC: "temperature",
  chamberCc: "volume",
  pistonVolumeCc: "volume",
  deckClearanceMm: "smallLength",
} as const satisfies Record<string, Quantity | null>;
export type NumberField = keyof typeof NUMBER_FIELDS;

const ID_FIELDS = ["blockMaterialId", "headMaterialId", "sleeveMaterialId"] as const;
const TEXT_FIELDS = ["name", "customer", "layout", "sleeveKind", "fuel", "peakPressureSource", "status", "notes"] as const;

/** One row of the stud editor, as typed. */
export interface StudRow {
  label: string;
  cylinders: string;
  shares: string;
}

/** A typed number: blank → undefined, anything unreadable → NaN (the schema words both). Decimal commas are read. */
export function readNumber(raw: string | undefined): number | undefined {
  const s = (raw ?? "").trim();
  if (s === "") return undefined;
  return Number(decimalPoint(s));
}

/** "1 2", "1, 2" or "1;2" → numbers. */
function splitList(raw: string): string[] {
  return raw
    .split(/[\s,;]+/)
    .map((s) => s.trim())
    .filter(Boolean);
}

/** A share as typed: "0.5", "½" or "1/3". */
function readShare(raw: string): number {
  const vulgar: Record<string, number> = { "½": 1 / 2, "⅓": 1 / 3, "⅔": 2 / 3, "¼": 1 / 4, "¾": 3 / 4 };
  if (raw in vulgar) return vulgar[raw]!;
  const m = /^(\d+(?:\.\d+)?)\/(\d+(?:\.\d+)?)$/.exec(raw);
  if (m) return Number(m[1]) / Number(m[2]);
  return Number(raw);
}

/** A stud row as typed → a stud (numbers may be NaN; the schema reports them). Blank rows → null. */
export function readStudRow(row: StudRow): Stud | null {
  const cylinders = splitList(row.cylinders);
  const shares = splitList(row.shares);
  if (cylinders.length === 0 && shares.length === 0 && row.label.trim() === "") return null;
  // Shares left blank: split evenly, as the default pattern does.
  const serves = cylinders.map((c, j) => ({
    cylinder: Number(c),
    share: shares.length === 0 ? 1 / cylinders.length : shares[j] === undefined ? NaN : readShare(shares[j]!),
  }));
  const label = row.label.trim();
  return label ? { label, serves } : { serves };
}

export function studToRow(stud: Stud): StudRow {
  return {
    label: stud.label ?? "",
    cylinders: stud.serves.map((s) => String(s.cylinder)).join(" "),
    shares: stud.serves.map((s) => formatShare(s.share)).join(" "),
  };
}

/** The posted form (name → value) → the raw engine input in SI, ready for EngineSchema. */
export function formToRaw(form: Record<string, string | undefined>, studs: StudRow[], units: UnitSystem): Record<string, unknown> {
  const raw: Record<string, unknown> = {};
  for (const f of TEXT_FIELDS) raw[f] = form[f] ?? "";
  for (const f of ID_FIELDS) raw[f] = readNumber(form[f]);
  for (const [f, q] of Object.entries(NUMBER_FIELDS)) {
    const text = (form[f] ?? "").trim();
    // a unit typed after the number wins over the field's ("3.386 in", "20 psi boost")
    raw[f] = text === "" ? undefined : q === null ? readNumber(text) : readQuantity(text, q, units);
  }
  // A sleeve's fields mean nothing without a sleeve.
  if (raw.sleeveKind === "none") {
    raw.sleeveMaterialId = raw.sleeveWallMm = raw.sleeveSupportLengthMm = undefined;
  } else if (raw.sleeveKind !== "wet-mid") raw.sleeveSupportLengthMm = undefined;
  raw.studs = studs.map(readStudRow).filter((s): s is Stud => s !== null);
  return raw;
}

/** An engine as stored (SI) → what the form shows in the person's units. */
export function engineToForm(engine: object & { studs: Stud[] }, units: UnitSystem): EngineFormValues {
  const e = engine as Record<string, unknown> & { studs: Stud[] };
  const fields: Record<EngineFormField, string> = {} as Record<EngineFormField, string>;
  for (const f of TEXT_FIELDS) fields[f] = String(e[f] ?? "");
  for (const f of ID_FIELDS) fields[f] = e[f] === undefined || e[f] === null ? "" : String(e[f]);
  for (const [f, q] of Object.entries(NUMBER_FIELDS) as [NumberField, Quantity | null][]) {
    const v = e[f];
    fields[f] = typeof v !== "number" ? "" : q === null ? String(v) : inputValue(v, q, units);
  }
  return { ...fields, studs: e.studs.map(studToRow), studsPerSide: "" };
}

// ─── One post of the engine form ──────────────────────────────────────────────────────────

// Every field as typed: Conform reads a blank field as missing, so each may be absent.
const typed = z.string().optional();
/** The form's text, number and choice fields (each posted under its own name). */
export const ENGINE_FORM_FIELDS = [...TEXT_FIELDS, ...ID_FIELDS, ...(Object.keys(NUMBER_FIELDS) as NumberField[])] as const;
type EngineFormField = (typeof ENGINE_FORM_FIELDS)[number];

/** What the form posts: the fields as typed, studsPerSide and the stud rows (Conform's list `studs[i].label` …). */
export const EngineFormFields = z.object({
  ...(Object.fromEntries(ENGINE_FORM_FIELDS.map((f) => [f, typed])) as Record<EngineFormField, typeof typed>),
  studsPerSide: typed,
  // a row may be missing from a hand-made post (studs[0], studs[5]): a hole reads as a blank row
  studs: z.array(z.object({ label: typed, cylinders: typed, shares: typed }).optional()).optional(),
});
/** What the form shows and posts: every field as a string, plus the stud rows. */
export type EngineFormValues = z.input<typeof EngineFormFields>;

/**
 * The engine form's schema for Conform: the fields as typed in the person's units → the SI engine
 * input (EngineSchema). A message about a stud names the row as the form numbers it (`studs[3]`),
 * blank rows counted, so it lands beside the row the builder sees.
 */
export function engineFormSchema(units: UnitSystem) {
  return EngineFormFields.transform((form, ctx): EngineInput => {
    const rows = (form.studs ?? []).map((r) => ({ label: r?.label ?? "", cylinders: r?.cylinders ?? "", shares: r?.shares ?? "" }));
    // the stud at position k of the input is the k-th row that was not blank
    const rowOf = rows.flatMap((r, i) => (readStudRow(r) ? [i] : []));
    const fields: Record<string, string> = {};
    for (const f of ENGINE_FORM_FIELDS) fields[f] = form[f] ?? "";
    const r = EngineSchema.safeParse(formToRaw(fields, rows, units));
    if (r.success) return r.data;
    for (const issue of r.error.issues) {
      const [head, k] = issue.path;
      const path = head === "studs" && typeof k === "number" ? ["studs", rowOf[k] ?? k] : head === undefined ? [] : [String(head)];
      ctx.addIssue({ code: "custom", path, message: issue.message });
    }
    return z.NEVER;
  });
}

/**
 * The engine form's own buttons, besides Conform's list intents (add and remove a stud): "save",
 * "pattern" (the default studs from the layout, answered by the server so it works without JavaScript)
 * and, on edit, "archive". No button: save (Enter in a field).
 */
export const ENGINE_FORM_INTENTS = ["save", "pattern", "archive"] as const;

/** A blank stud row, as "Add a stud" inserts it. */
export const BLANK_STUD_ROW: StudRow = { label: "", cylinders: "", shares: "" };

/** The default stud pattern as editor rows, or a message saying why it cannot be made. */
export function generateStudRows(
  layout: string | undefined,
  cylindersRaw: string | undefined,
  studsPerSideRaw: string | undefined,
): { rows: StudRow[] } | { error: string } {
  const cylinders = readNumber(cylindersRaw);
  const perSide = readNumber(studsPerSideRaw);
  if (layout !== "inline" && layout !== "V") return { error: "Pick inline or V first" };
  if (cylinders === undefined || !Number.isInteger(cylinders) || cylinders < 1 || cylinders > 16)
    return { error: "Give a cylinder count from 1 to 16 first" };
  if (perSide !== undefined && (!Number.isInteger(perSide) || perSide < 2 || perSide > 20))
    return { error: "Studs per side is a whole number from 2 to 20" };
  try {
    return { rows: defaultStudPattern(layout, cylinders, perSide).map(studToRow) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : "That layout has no default pattern" };
  }
}

/** Blank form for a new engine: an inline four with its default studs. */
export function blankEngineForm(units: UnitSystem): EngineFormValues {
  return {
    name: "",
    customer: "",
    cylinders: "4",
    layout: "inline",
    sleeveKind: "none",
    peakPressureSource: "estimated",
    status: "quoted",
    sleeveProtrusionMm: "0",
    blockDepthToThreadMm: "0",
    deckClearanceMm: "0",
    pistonVolumeCc: "0",
    pressureRiseFactor: "3",
    runningHeadC: inputValue(110, "temperature", units),
    runningBlockC: inputValue(95, "temperature", units),
    studs: defaultStudPattern("inline", 4).map(studToRow),
    studsPerSide: "",
  };
}
