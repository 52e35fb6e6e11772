// Display units for the UI: the core and the database stay SI (mm, N, N·m, MPa); people read
// metric or imperial. Built on convert-units; not used on the calculation's hot path.
import configureMeasurements, { type Measure } from "convert-units";
import force from "convert-units/definitions/force";
import length from "convert-units/definitions/length";
import pressure from "convert-units/definitions/pressure";
import torque from "convert-units/definitions/torque";

// The measures have different unit unions; widen them so one converter serves all four.
const measures = { length, force, torque, pressure } as unknown as Record<
  "length" | "force" | "torque" | "pressure",
  Measure<string, string>
>;
const convert = configureMeasurements(measures);

export type UnitSystem = "metric" | "imperial";
export type Quantity = "length" | "smallLength" | "force" | "torque" | "pressure" | "stress";
export type DisplayUnit = "mm" | "in" | "thou" | "N" | "kN" | "lbf" | "N·m" | "lbf·ft" | "MPa" | "bar" | "psi";

/** The SI unit each quantity is stored in. */
export const SI_UNIT: Record<Quantity, DisplayUnit> = {
  length: "mm",
  smallLength: "mm",
  force: "N",
  torque: "N·m",
  pressure: "MPa",
  stress: "MPa",
};

/** What each person sees for a quantity in their chosen system. */
export const DISPLAY_UNIT: Record<Quantity, Record<UnitSystem, DisplayUnit>> = {
  length: { metric: "mm", imperial: "in" },
  smallLength: { metric: "mm", imperial: "thou" },
  force: { metric: "kN", imperial: "lbf" },
  torque: { metric: "N·m", imperial: "lbf·ft" },
  pressure: { metric: "bar", imperial: "psi" },
  stress: { metric: "MPa", imperial: "psi" },
};

/** Units a quantity may be shown or entered in. */
export const UNITS_OF: Record<Quantity, DisplayUnit[]> = {
  length: ["mm", "in", "thou"],
  smallLength: ["mm", "in", "thou"],
  force: ["N", "kN", "lbf"],
  torque: ["N·m", "lbf·ft"],
  pressure: ["MPa", "bar", "psi"],
  stress: ["MPa", "bar", "psi"],
};

const LIBRARY_ABBR: Record<DisplayUnit, string> = {
  mm: "mm",
  in: "in",
  thou: "mil",
  N: "N",
  kN: "kN",
  lbf: "lbf",
  "N·m": "Nm",
  "lbf·ft": "lbf-ft",
  MPa: "MPa",
  bar: "bar",
  psi: "psi",
};

/** Decimals that read sensibly at the bench. */
export const DEFAULT_DECIMALS: Record<DisplayUnit, number> = {
  mm: 2,
  in: 3,
  thou: 1,
  N: 0,
  kN: 1,
  lbf: 0,
  "N·m": 0,
  "lbf·ft": 0,
  MPa: 1,
  bar: 1,
  psi: 0,
};

export function unitFor(quantity: Quantity, system: UnitSystem): DisplayUnit {
  return DISPLAY_UNIT[quantity][system];
}

function assertUnit(quantity: Quantity, unit: DisplayUnit): void {
  if (!UNITS_OF[quantity].includes(unit)) throw new RangeError(`${unit} is not a unit of ${quantity}`);
}

/** SI value → the value in a display unit. */
export function toDisplay(quantity: Quantity, valueSi: number, unit: DisplayUnit): number {
  assertUnit(quantity, unit);
  const from = SI_UNIT[quantity];
  if (from === unit) return valueSi;
  return convert(valueSi).from(LIBRARY_ABBR[from]).to(LIBRARY_ABBR[unit]);
}

/** A value in a display unit → SI. */
export function fromDisplay(quantity: Quantity, value: number, unit: DisplayUnit): number {
  assertUnit(quantity, unit);
  const to = SI_UNIT[quantity];
  if (to === unit) return value;
  return convert(value).from(LIBRARY_ABBR[unit]).to(LIBRARY_ABBR[to]);
}

export interface FormatOptions {
  /** Override the person's unit for this figure. */
  unit?: DisplayUnit;
  decimals?: number;
}

/** "12.5 kN", "0.004 in"; a dash for a missing or non-finite figure. */
export function formatQuantity(
  valueSi: number | null | undefined,
  quantity: Quantity,
  system: UnitSystem,
  options: FormatOptions = {},
): string {
  if (valueSi === null || valueSi === undefined || !Number.isFinite(valueSi)) return "—";
  const unit = options.unit ?? unitFor(quantity, system);
  const decimals = options.decimals ?? DEFAULT_DECIMALS[unit];
  const v = toDisplay(quantity, valueSi, unit);
  const text = v.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
  // never show "-0.0"
  return `${/^-0(\.0+)?$/.test(text) ? text.slice(1) : text} ${unit}`;
}

export type ParseResult = { ok: true; valueSi: number; unit: DisplayUnit } | { ok: false; message: string };

const ALIASES: Record<string, DisplayUnit> = {
  mm: "mm",
  in: "in",
  '"': "in",
  inch: "in",
  thou: "thou",
  mil: "thou",
  n: "N",
  kn: "kN",
  lbf: "lbf",
  lb: "lbf",
  "n·m": "N·m",
  nm: "N·m",
  "n-m": "N·m",
  "n.m": "N·m",
  "lbf·ft": "lbf·ft",
  "lbf-ft": "lbf·ft",
  "ft-lb": "lbf·ft",
  "ft·lbf": "lbf·ft",
  "ft-lbf": "lbf·ft",
  "lb-ft": "lbf·ft",
  mpa: "MPa",
  bar: "bar",
  psi: "psi",
};

/**
 * Read what a person typed in a form ("0.004", "120 lbf·ft", "1,250") into SI.
 * A unit typed after the number wins over the field's unit when it belongs to the quantity.
 */
export function parseQuantity(text: string, quantity: Quantity, fieldUnit: DisplayUnit): ParseResult {
  const trimmed = text.trim();
  if (trimmed === "") return { ok: false, message: "Enter a number" };
  const m = /^([-+]?[0-9.,]+(?:e[-+]?\d+)?)\s*(.*)$/i.exec(trimmed);
  if (!m) return { ok: false, message: `“${trimmed}” is not a number` };
  let numText = m[1];
  if (/^[-+]?\d{1,3}(,\d{3})+(\.\d+)?$/.test(numText)) numText = numText.replace(/,/g, "");
  else if (numText.includes(",")) return { ok: false, message: "Use a point for decimals (1.5, not 1,5)" };
  const value = Number(numText);
  if (!Number.isFinite(value)) return { ok: false, message: `“${trimmed}” is not a number` };
  let unit = fieldUnit;
  const suffix = m[2].trim();
  if (suffix !== "") {
    const u = ALIASES[suffix.toLowerCase()] ?? (UNITS_OF[quantity].includes(suffix as DisplayUnit) ? (suffix as DisplayUnit) : undefined);
    if (!u || !UNITS_OF[quantity].includes(u))
      return { ok: false, message: `${suffix} is not a unit for this field (use ${UNITS_OF[quantity].join(", ")})` };
    unit = u;
  }
  return { ok: true, valueSi: fromDisplay(quantity, value, unit), unit };
}
