// The library forms: which fields each kind has, in what units they are typed, and how a posted
// form turns into an SI record (or field errors). Pure: used by the route action and the form.
import { z } from "zod";
import { TYPICAL_GASKETS } from "../clamp/gasket-families";
import { parseQuantity, toDisplay, unitFor, type Quantity, type UnitSystem } from "../units";
import { decimalPoint } from "../units/decimal-comma";
import { LIBRARY_GASKET_TYPES, type LibraryKind } from "./labels";
import { FastenerSchema, GasketSchema, MaterialSchema } from "./schemas";

export interface NumberField {
  name: string;
  label: string;
  quantity: Quantity;
  optional?: boolean;
  hint?: string;
  /** Typed in something other than the quantity's display unit (the pitch). */
  special?: "pitch";
}

export const MATERIAL_NUMBER_FIELDS: NumberField[] = [
  { name: "modulusMpa", label: "Modulus (Young's)", quantity: "modulus" },
  {
    name: "yieldMpa",
    label: "Yield strength",
    quantity: "stress",
    optional: true,
    hint: "Leave empty when the material has no yield point (gray iron).",
  },
  { name: "expansionUmPerMC", label: "Expansion coefficient", quantity: "expansion" },
  {
    name: "limitingSurfacePressureMpa",
    label: "Washer bearing limit",
    quantity: "stress",
    optional: true,
    hint: "What the face can carry under a washer before it sinks in (the limiting surface pressure of VDI 2230).",
  },
  {
    name: "shearStrengthMpa",
    label: "Shear strength",
    quantity: "stress",
    optional: true,
    hint: "For the thread in a block of this material. Without it the yield ÷ √3 is used; gray iron has no yield, so give it here.",
  },
];

export const FASTENER_GEOMETRY_FIELDS: NumberField[] = [
  { name: "diameterMm", label: "Thread diameter", quantity: "length" },
  { name: "pitchMm", label: "Pitch", quantity: "plain", special: "pitch", hint: "Metric: pitch in mm. Unified inch: threads per inch." },
  {
    name: "reducedShankDiameterMm",
    label: "Reduced shank diameter",
    quantity: "length",
    optional: true,
    hint: "Empty for a full-shank stud.",
  },
  { name: "reducedShankLengthMm", label: "Reduced shank length", quantity: "length" },
  {
    name: "freeThreadLengthMm",
    label: "Free thread in the grip",
    quantity: "length",
    hint: "Loaded thread between nut and block, both ends together.",
  },
  { name: "engagementMm", label: "Thread engagement in the block", quantity: "length" },
  { name: "washerOdMm", label: "Washer outer diameter", quantity: "length" },
  { name: "washerHoleMm", label: "Washer hole", quantity: "length" },
  { name: "washerThicknessMm", label: "Washer thickness", quantity: "length" },
  {
    name: "washerHardnessHv",
    label: "Washer hardness (HV)",
    quantity: "plain",
    optional: true,
    hint: "Vickers. Hardened head-stud washers are about 370–450 HV and spread the load over their whole face; a softer one (under 300 HV) carries it nearer the nut. Empty: taken as hardened.",
  },
  {
    name: "nutFaceOdMm",
    label: "Nut face diameter",
    quantity: "length",
    optional: true,
    hint: "Outer diameter of the nut's bearing face, where the washer-face friction acts. Empty: 1.45 × the stud diameter.",
  },
];

export const FASTENER_MAKER_FIELDS: NumberField[] = [
  { name: "makerTorqueNm", label: "Maker's recommended torque", quantity: "torque", optional: true },
  {
    name: "makerStretchMm",
    label: "Maker's stretch figure",
    quantity: "smallLength",
    optional: true,
    hint: "Elongation at full torque, if the sheet gives one.",
  },
];

export const FASTENER_FRICTION_FIELDS: NumberField[] = [
  {
    name: "threadFriction",
    label: "Thread friction",
    quantity: "plain",
    hint: "μG. About 0.10–0.14 with moly paste, 0.14–0.18 with engine oil.",
  },
  { name: "bearingFriction", label: "Washer-face friction", quantity: "plain", hint: "μK, between the nut face and the washer." },
];

export const GASKET_NUMBER_FIELDS: NumberField[] = [
  { name: "compressedThicknessMm", label: "Compressed thickness", quantity: "smallLength" },
  { name: "boreMm", label: "Gasket bore", quantity: "length" },
  { name: "sealDiameterMm", label: "Seal diameter (mean of the band)", quantity: "length" },
  { name: "ringWidthMm", label: "Ring width", quantity: "length" },
  { name: "ringModulusMpa", label: "Ring modulus", quantity: "modulus", hint: "The ring, wire or stopper layer." },
  { name: "sealLineYieldMpa", label: "Seal-line yield", quantity: "stress", hint: "The softest material in the seal line." },
  {
    name: "sealLineHardnessMpa",
    label: "Seal-line hardness",
    quantity: "stress",
    optional: true,
    hint: "Indentation pressure of the softer face the ring or wire bites into (HV × 9.807 MPa). Empty: annealed copper (40 HV) for copper gaskets, else 3 × the yield.",
  },
  { name: "bodyModulusMpa", label: "Body modulus (effective)", quantity: "modulus" },
  { name: "bodyAreaPerBoreMm2", label: "Body area per bore", quantity: "area" },
  {
    name: "bodySealPressureMpa",
    label: "Body seal pressure",
    quantity: "stress",
    optional: true,
    hint: "Least pressure on the body that still seals coolant and oil. Empty: the typical figure of the family.",
  },
  {
    name: "beadLoadNPerMm",
    label: "Bead load (N per mm of circumference)",
    quantity: "plain",
    optional: true,
    hint: "Multilayer steel: line load of the bead pressed down to the stopper.",
  },
  {
    name: "beadTravelMm",
    label: "Bead travel to the stopper",
    quantity: "smallLength",
    optional: true,
    hint: "Multilayer steel: how far the bead gives before the stopper carries.",
  },
  { name: "expansionUmPerMC", label: "Expansion coefficient", quantity: "expansion" },
  {
    name: "seatingPressureMpa",
    label: "Seating pressure (maker's)",
    quantity: "stress",
    optional: true,
    hint: "From the gasket maker, in the terms of EN 13555: Qmin(L), the pressure that seats it tight. Give it with the service pressure; together they replace the flange-code factors.",
  },
  {
    name: "minServicePressureMpa",
    label: "Minimum service pressure (maker's)",
    quantity: "stress",
    optional: true,
    hint: "EN 13555 QSmin(L): least pressure left in service that keeps it tight.",
  },
  {
    name: "maxPressureMpa",
    label: "Maximum pressure (maker's)",
    quantity: "stress",
    optional: true,
    hint: "EN 13555 QSmax: most the seal line takes without damage.",
  },
  {
    name: "m",
    label: "Seal hold factor m (flange code)",
    quantity: "plain",
    hint: "A stand-in from the pressure-vessel flange code (ASME VIII-1 table 2-5.1) used while the maker's pressures are not known.",
  },
  { name: "yMpa", label: "Seating stress y (flange code)", quantity: "stress", hint: "Flange-code stand-in, as m." },
  { name: "relaxationPercent", label: "Relaxation after heat cycles (%)", quantity: "plain" },
  { name: "finishMinRaUm", label: "Smoothest finish", quantity: "roughness", optional: true },
  { name: "finishMaxRaUm", label: "Roughest finish", quantity: "roughness", optional: true },
];

export const NUMBER_FIELDS: Record<LibraryKind, NumberField[]> = {
  materials: MATERIAL_NUMBER_FIELDS,
  fasteners: [...FASTENER_GEOMETRY_FIELDS, ...FASTENER_MAKER_FIELDS, ...FASTENER_FRICTION_FIELDS],
  gaskets: GASKET_NUMBER_FIELDS,
};

const TEXT_FIELDS: Record<LibraryKind, string[]> = {
  materials: ["name", "kind"],
  fasteners: ["name", "threadSystem", "makerLubricant", "makerStages"],
  gaskets: ["name", "type"],
};

const SCHEMAS = { materials: MaterialSchema, fasteners: FastenerSchema, gaskets: GasketSchema } as const;

const MM_PER_IN = 25.4;

/** Pitch as typed: mm for metric threads, threads per inch for unified. */
function pitchToMm(typed: number, threadSystem: string): number {
  return threadSystem === "unified" ? MM_PER_IN / typed : typed;
}
function pitchFromMm(pitchMm: number, threadSystem: string): number {
  return threadSystem === "unified" ? MM_PER_IN / pitchMm : pitchMm;
}

/** A plain typed number (the pitch), decimal commas read as in the units module. */
function parseNumber(raw: string): number | null | typeof NaN {
  const t = decimalPoint(raw.trim());
  if (t === "") return null;
  return Number(/^\d{1,3}(,\d{3})+(\.\d+)?$/.test(t) ? t.replace(/,/g, "") : t);
}

export type ParsedLibrary<K extends LibraryKind> =
  { ok: true; value: z.infer<(typeof SCHEMAS)[K]> } | { ok: false; errors: Record<string, string> };

/**
 * A posted form (strings, in the person's units) → the SI record, or one message per field.
 * Empty optional numbers become null; an empty required number is reported, not guessed.
 */
export function parseLibraryForm<K extends LibraryKind>(kind: K, form: Record<string, string>, units: UnitSystem): ParsedLibrary<K> {
  const errors: Record<string, string> = {};
  const out: Record<string, unknown> = {};
  for (const f of TEXT_FIELDS[kind]) out[f] = form[f] ?? "";
  if (kind === "fasteners") {
    const id = (form.materialId ?? "").trim();
    out.materialId = id === "" ? undefined : Number(id);
  }
  for (const field of NUMBER_FIELDS[kind]) {
    const typed = (form[field.name] ?? "").trim();
    if (typed === "") {
      if (field.optional) out[field.name] = null;
      else if (field.name === "reducedShankLengthMm" || field.name === "washerThicknessMm" || field.name === "relaxationPercent")
        out[field.name] = 0;
      else errors[field.name] = `Enter the ${field.label.charAt(0).toLowerCase()}${field.label.slice(1)}`;
      continue;
    }
    if (field.special === "pitch") {
      const n = parseNumber(typed);
      if (n === null || !Number.isFinite(n)) errors[field.name] = `${field.label} must be a number`;
      else if (n <= 0) errors[field.name] = "Thread pitch must be greater than zero";
      else out[field.name] = pitchToMm(n, String(out.threadSystem));
      continue;
    }
    // the one reader of typed figures: decimal commas, and a unit typed after the number wins
    const r = parseQuantity(typed, field.quantity, unitFor(field.quantity, units));
    if (r.ok) out[field.name] = r.valueSi;
    else errors[field.name] = r.message.startsWith("“") ? `${field.label} must be a number` : `${field.label}: ${r.message}`;
  }
  const parsed = SCHEMAS[kind].safeParse(out);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path.map(String).join(".");
      errors[key] ??= issue.message;
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { ok: false, errors };
  return { ok: true, value: parsed.data as z.infer<(typeof SCHEMAS)[K]> };
}

/** A stored SI record → the strings the form shows, in the person's units. */
export function formValues(kind: LibraryKind, record: Record<string, unknown>, units: UnitSystem): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of TEXT_FIELDS[kind]) out[f] = record[f] == null ? "" : String(record[f]);
  if (kind === "fasteners") out.materialId = record.materialId == null ? "" : String(record.materialId);
  for (const field of NUMBER_FIELDS[kind]) {
    const v = record[field.name];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      out[field.name] = "";
      continue;
    }
    const shown =
      field.special === "pitch"
        ? pitchFromMm(v, String(record.threadSystem))
        : toDisplay(field.quantity, v, unitFor(field.quantity, units));
    out[field.name] = String(Number(shown.toPrecision(6)));
  }
  return out;
}

/** Every field the library form posts for a kind. */
function libraryFieldNames(kind: LibraryKind): string[] {
  return [...TEXT_FIELDS[kind], ...(kind === "fasteners" ? ["materialId"] : []), ...NUMBER_FIELDS[kind].map((f) => f.name)];
}

/**
 * The library form's schema for Conform: the fields as typed in the person's units (blank reads as
 * missing) → the SI row, each message filed under its field (parseLibraryForm's words).
 */
export function libraryFormSchema<K extends LibraryKind>(kind: K, units: UnitSystem) {
  const typed = z.string().optional();
  return z.object(Object.fromEntries(libraryFieldNames(kind).map((name) => [name, typed]))).transform((form, ctx) => {
    const fields = Object.fromEntries(Object.entries(form).map(([name, v]) => [name, v ?? ""]));
    const parsed = parseLibraryForm(kind, fields, units);
    if (parsed.ok) return parsed.value;
    for (const [name, message] of Object.entries(parsed.errors)) ctx.addIssue({ code: "custom", path: name.split("."), message });
    return z.NEVER;
  });
}

/** A gasket family the new-gasket page may start from (?type=), or null. */
export function typicalGasketType(type: string | null): (typeof LIBRARY_GASKET_TYPES)[number] | null {
  return (LIBRARY_GASKET_TYPES as readonly string[]).includes(type ?? "") ? (type as (typeof LIBRARY_GASKET_TYPES)[number]) : null;
}

/**
 * A new row's starting figures: a fastener's usual 0.12 frictions (common practice for oiled steel
 * threads) and no reduced shank or washer; a gasket of a named family starts from that family's
 * typical figures, to be replaced with the gasket maker's (the form says so).
 */
export function libraryDefaults(kind: LibraryKind, type: string | null, units: UnitSystem): Record<string, string> {
  if (kind === "fasteners")
    return { threadSystem: "unified", reducedShankLengthMm: "0", washerThicknessMm: "0", threadFriction: "0.12", bearingFriction: "0.12" };
  if (kind === "gaskets") {
    const family = typicalGasketType(type);
    if (!family) return { type: "mls", relaxationPercent: "0" };
    const { label: _label, notes: _notes, ...figures } = TYPICAL_GASKETS[family];
    return { ...formValues("gaskets", { ...figures, type: family }, units), name: "" };
  }
  return { kind: "aluminium" };
}
