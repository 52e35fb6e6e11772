// Display units for the engine record, on top of the shared units module (app/lib/units) so the
// engine pages read the same as the plan pages. The few quantities it does not carry
// (manifold pressure in kPa absolute, temperature, volume) are converted here.
import {
  DEFAULT_DECIMALS,
  parseQuantity,
  fromDisplay as sharedFromDisplay,
  toDisplay as sharedToDisplay,
  unitFor,
  type UnitSystem,
} from "../units";
import { decimalPoint } from "../units/decimal-comma";

export type Units = UnitSystem;
/** length: bore, stroke…; smallLength: protrusion, deck clearance; manifold: kPa abs (SI) shown kPa abs or psi abs;
 *  peak: MPa (SI) shown bar or psi; temperature: °C; volume: cc. */
export type Quantity = "length" | "smallLength" | "manifold" | "peak" | "temperature" | "volume";

// °F = °C·9/5 + 32 (NIST SP 811 §B.9, exact).
const cToF = (c: number) => (c * 9) / 5 + 32;
const fToC = (f: number) => ((f - 32) * 5) / 9;

export function unitLabel(q: Quantity, units: Units): string {
  switch (q) {
    case "length":
    case "smallLength":
      return unitFor(q, units);
    case "manifold":
      return units === "imperial" ? "psi abs" : "kPa abs";
    case "peak":
      return unitFor("pressure", units);
    case "temperature":
      return units === "imperial" ? "°F" : "°C";
    case "volume":
      return "cc";
  }
}

/** SI (mm, kPa, MPa, °C, cc) → the person's units. */
export function toDisplay(q: Quantity, si: number, units: Units): number {
  switch (q) {
    case "length":
    case "smallLength":
      return sharedToDisplay(q, si, unitFor(q, units));
    case "manifold":
      return units === "imperial" ? sharedToDisplay("pressure", si / 1000, "psi") : si;
    case "peak":
      return sharedToDisplay("pressure", si, unitFor("pressure", units));
    case "temperature":
      return units === "imperial" ? cToF(si) : si;
    case "volume":
      return si;
  }
}

/** The person's units → SI. */
export function fromDisplay(q: Quantity, value: number, units: Units): number {
  switch (q) {
    case "length":
    case "smallLength":
      return sharedFromDisplay(q, value, unitFor(q, units));
    case "manifold":
      return units === "imperial" ? sharedFromDisplay("pressure", value, "psi") * 1000 : value;
    case "peak":
      return sharedFromDisplay("pressure", value, unitFor("pressure", units));
    case "temperature":
      return units === "imperial" ? fToC(value) : value;
    case "volume":
      return value;
  }
}

function decimals(q: Quantity, units: Units): number {
  switch (q) {
    case "length":
    case "smallLength":
      return DEFAULT_DECIMALS[unitFor(q, units)];
    case "manifold":
      return units === "imperial" ? 1 : 0;
    case "peak":
      return DEFAULT_DECIMALS[unitFor("pressure", units)];
    case "temperature":
      return 0;
    case "volume":
      return 1;
  }
}

/** A figure for an input's value: a little finer than the display, trailing zeros dropped. */
export function inputValue(q: Quantity, si: number | null | undefined, units: Units): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "";
  return String(Number(toDisplay(q, si, units).toFixed(decimals(q, units) + 2)));
}

/** A figure with its unit for reading, e.g. "86.00 mm" or "3.386 in"; a dash when missing. */
export function formatQuantity(q: Quantity, si: number | null | undefined, units: Units): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const text = toDisplay(q, si, units).toFixed(decimals(q, units));
  return `${/^-0(\.0+)?$/.test(text) ? text.slice(1) : text} ${unitLabel(q, units)}`;
}

// ─── Reading what a builder typed ─────────────────────────────────────────────────────────

// Standard atmosphere, 101.325 kPa (ISO 2533): gauge pressure + atmosphere = absolute.
export const ATMOSPHERE_KPA = 101.325;

const TEMPERATURE_UNITS: Record<string, "C" | "F"> = { c: "C", "°c": "C", degc: "C", f: "F", "°f": "F", degf: "F" };
const VOLUME_UNITS = new Set(["cc", "cm3", "cm³", "ml"]);
// Manifold pressure: the unit, and whether the figure is gauge (boost) or absolute.
const MANIFOLD_UNITS: Record<string, { unit: "kPa" | "bar" | "psi" | "MPa"; gauge: boolean }> = {};
for (const [unit, names] of [
  ["kPa", ["kpa"]],
  ["bar", ["bar"]],
  ["psi", ["psi"]],
  ["MPa", ["mpa"]],
] as const) {
  for (const n of names) {
    MANIFOLD_UNITS[n] = { unit, gauge: false };
    MANIFOLD_UNITS[`${n} abs`] = { unit, gauge: false };
    MANIFOLD_UNITS[`${n}a`] = { unit, gauge: false };
    MANIFOLD_UNITS[`${n} g`] = { unit, gauge: true };
    MANIFOLD_UNITS[`${n}g`] = { unit, gauge: true };
    MANIFOLD_UNITS[`${n} gauge`] = { unit, gauge: true };
    MANIFOLD_UNITS[`${n} boost`] = { unit, gauge: true };
  }
}
const KPA_PER: Record<"kPa" | "bar" | "psi" | "MPa", number> = { kPa: 1, bar: 100, MPa: 1000, psi: sharedFromDisplay("pressure", 1, "psi") * 1000 };

/**
 * A figure typed into an engine field, in SI; NaN when it cannot be read (the schema words it).
 * Decimal commas are read as in app/lib/units/decimal-comma.ts, and a unit typed after the number
 * wins over the field's: "3.386 in", "4 thou", "230 °F", "20 psi boost" (gauge: atmosphere is added).
 */
export function readEngineQuantity(text: string, q: Quantity, units: Units): number {
  const typed = decimalPoint(text.trim());
  const m = /^([-+]?[0-9.,]+(?:e[-+]?\d+)?)\s*(.*)$/i.exec(typed);
  if (!m) return NaN;
  const suffix = m[2]!.trim().toLowerCase().replace(/\s+/g, " ");
  const bare = Number(m[1]!.replace(/^([-+]?\d{1,3}(,\d{3})+(\.\d+)?)$/, (s) => s.replace(/,/g, "")));
  if (!Number.isFinite(bare)) return NaN;
  if (suffix === "") return fromDisplay(q, bare, units);
  switch (q) {
    case "length":
    case "smallLength": {
      const r = parseQuantity(typed, q, unitFor(q, units));
      return r.ok ? r.valueSi : NaN;
    }
    case "peak": {
      const r = parseQuantity(typed, "pressure", unitFor("pressure", units));
      return r.ok ? r.valueSi : NaN;
    }
    case "manifold": {
      const u = MANIFOLD_UNITS[suffix];
      if (!u) return NaN;
      const kpa = bare * KPA_PER[u.unit];
      return u.gauge ? kpa + ATMOSPHERE_KPA : kpa;
    }
    case "temperature": {
      const u = TEMPERATURE_UNITS[suffix.replace(/\s/g, "")];
      if (!u) return NaN;
      return u === "C" ? bare : ((bare - 32) * 5) / 9;
    }
    case "volume":
      return VOLUME_UNITS.has(suffix) ? bare : NaN;
  }
}
