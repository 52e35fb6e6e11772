// Display units for the engine record, on top of the shared units module (app/lib/units) so the
// engine pages read the same as the plan pages. The few quantities it does not carry
// (manifold pressure in kPa absolute, temperature, volume) are converted here.
import {
  DEFAULT_DECIMALS,
  fromDisplay as sharedFromDisplay,
  toDisplay as sharedToDisplay,
  unitFor,
  type UnitSystem,
} from "../units";

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
