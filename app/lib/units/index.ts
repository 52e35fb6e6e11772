// The one units module: people read and type metric or imperial; the core and the database stay SI
// (mm, N, N·m, MPa, kPa abs, °C, cc). Every page formats and parses through here, so a figure reads
// the same on the plan pages, the engine pages and the library tables.
import { decimalPoint } from "./decimal-comma";
import { ATMOSPHERE_KPA, unitBySpelling, unitDef, unitFor, unitsOf, type Quantity, type UnitSystem } from "./table";

export { ATMOSPHERE_KPA, UNIT_SYSTEMS, unitFor, unitsOf, type Quantity, type UnitSystem } from "./table";
export { splitList } from "./decimal-comma";

/** A unit's label as shown after a figure ("mm", "lbf·ft", "ksi"). */
export type DisplayUnit = string;

/** SI value → the value in a display unit. */
export function toDisplay(quantity: Quantity, valueSi: number, unit: DisplayUnit): number {
  const d = unitDef(quantity, unit);
  return valueSi * d.factor + d.offset;
}

/** A value in a display unit → SI. */
export function fromDisplay(quantity: Quantity, value: number, unit: DisplayUnit): number {
  const d = unitDef(quantity, unit);
  const si = (value - d.offset) / d.factor;
  return d.gauge ? si + ATMOSPHERE_KPA : si;
}

// One formatter per precision, made once: Intl.NumberFormat is slow to build and fast to use.
const FORMATTERS = new Map<string, Intl.NumberFormat>();
function formatter(decimals: number, grouping: boolean): Intl.NumberFormat {
  const key = `${decimals}:${grouping}`;
  let f = FORMATTERS.get(key);
  if (!f) {
    f = new Intl.NumberFormat("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, useGrouping: grouping });
    FORMATTERS.set(key, f);
  }
  return f;
}

/** A number as text with fixed decimals; never "-0.0". */
export function formatNumber(value: number, decimals: number, grouping = true): string {
  const text = formatter(decimals, grouping).format(value);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

export interface FormatOptions {
  /** Override the person's unit for this figure. */
  unit?: DisplayUnit;
  decimals?: number;
  /** false: the number alone (a table whose header carries the unit). */
  withUnit?: boolean;
}

/** "12.5 kN", "0.004 in", "23.9 ksi"; a dash for a missing or non-finite figure. */
export function formatQuantity(
  valueSi: number | null | undefined,
  quantity: Quantity,
  system: UnitSystem,
  options: FormatOptions = {},
): string {
  if (valueSi === null || valueSi === undefined || !Number.isFinite(valueSi)) return "—";
  const unit = options.unit ?? unitFor(quantity, system);
  const decimals = options.decimals ?? unitDef(quantity, unit).decimals;
  const text = formatNumber(toDisplay(quantity, valueSi, unit), decimals);
  return options.withUnit === false || unit === "" ? text : `${text} ${unit}`;
}

/** The figure to put back into an input: the person's unit, two decimals finer than the display, no grouping. */
export function inputValue(valueSi: number | null | undefined, quantity: Quantity, system: UnitSystem): string {
  if (valueSi === null || valueSi === undefined || !Number.isFinite(valueSi)) return "";
  const unit = unitFor(quantity, system);
  return String(Number(toDisplay(quantity, valueSi, unit).toFixed(unitDef(quantity, unit).decimals + 2)));
}

export type ParseResult = { ok: true; valueSi: number; unit: DisplayUnit } | { ok: false; message: string };

/**
 * Read what a person typed in a form ("0.004", "0,45", "120 lbf·ft", "1,250", "20 psi boost") into SI.
 * Decimal commas follow the rule in ./decimal-comma.ts; a unit typed after the number wins over the
 * field's unit when it belongs to the quantity.
 */
export function parseQuantity(text: string, quantity: Quantity, fieldUnit: DisplayUnit): ParseResult {
  const trimmed = decimalPoint(text.trim());
  if (trimmed === "") return { ok: false, message: "Enter a number" };
  const m = /^([-+]?[0-9.,]+(?:e[-+]?\d+)?)\s*(.*)$/i.exec(trimmed);
  if (!m) return { ok: false, message: `“${text.trim()}” is not a number` };
  let numText = m[1]!;
  if (/^[-+]?\d{1,3}(,\d{3})+(\.\d+)?$/.test(numText)) numText = numText.replace(/,/g, "");
  else if (numText.includes(",")) return { ok: false, message: "Write one decimal mark (1.5 or 1,5)" };
  const value = Number(numText);
  if (!Number.isFinite(value)) return { ok: false, message: `“${text.trim()}” is not a number` };
  const suffix = m[2]!.trim();
  if (suffix === "") return { ok: true, valueSi: fromDisplay(quantity, value, fieldUnit), unit: fieldUnit };
  const d = unitBySpelling(quantity, suffix);
  if (!d) return { ok: false, message: `${suffix} is not a unit for this field (use ${unitsOf(quantity).join(", ")})` };
  return { ok: true, valueSi: fromDisplay(quantity, value, d.label), unit: d.label };
}

/** parseQuantity in the person's unit for the quantity, as a number (NaN when it cannot be read). */
export function readQuantity(text: string, quantity: Quantity, system: UnitSystem): number {
  const r = parseQuantity(text, quantity, unitFor(quantity, system));
  return r.ok ? r.valueSi : Number.NaN;
}
