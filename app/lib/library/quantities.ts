// Display units for the library forms and tables: one call each way, SI inside.
// Conversion factors: NIST SP 811 (1 in = 25.4 mm exactly, 1 lbf·ft = 1.3558179 N·m, 1 psi = 6894.757 Pa).
// When app/lib/units lands, toSi/fromSi are the two calls to swap for it.

export type UnitSystem = "metric" | "imperial";

export type Quantity =
  | "length" // mm | in
  | "small-length" // mm | thou (stretch, projection)
  | "area" // mm² | in²
  | "stress" // MPa | ksi
  | "modulus" // GPa | Mpsi (stored MPa)
  | "torque" // N·m | lbf·ft
  | "expansion" // µm/m·°C | µin/in·°F
  | "roughness" // Ra µm | Ra µin
  | "plain"; // no unit (friction, m, percent)

interface UnitDef {
  metric: { label: string; perSi: number };
  imperial: { label: string; perSi: number };
}

const MM_PER_IN = 25.4;
const NM_PER_LBF_FT = 1.3558179;
const MPA_PER_KSI = 6.894757;

// perSi: display value = SI value × perSi.
const UNITS: Record<Exclude<Quantity, "plain">, UnitDef> = {
  length: { metric: { label: "mm", perSi: 1 }, imperial: { label: "in", perSi: 1 / MM_PER_IN } },
  "small-length": { metric: { label: "mm", perSi: 1 }, imperial: { label: "thou", perSi: 1000 / MM_PER_IN } },
  area: { metric: { label: "mm²", perSi: 1 }, imperial: { label: "in²", perSi: 1 / (MM_PER_IN * MM_PER_IN) } },
  stress: { metric: { label: "MPa", perSi: 1 }, imperial: { label: "ksi", perSi: 1 / MPA_PER_KSI } },
  modulus: { metric: { label: "GPa", perSi: 1 / 1000 }, imperial: { label: "Mpsi", perSi: 1 / (MPA_PER_KSI * 1000) } },
  torque: { metric: { label: "N·m", perSi: 1 }, imperial: { label: "lbf·ft", perSi: 1 / NM_PER_LBF_FT } },
  // 1 µm/m·°C = 1/1.8 µin/in·°F (a Fahrenheit degree is 5/9 of a Celsius degree)
  expansion: { metric: { label: "µm/m·°C", perSi: 1 }, imperial: { label: "µin/in·°F", perSi: 1 / 1.8 } },
  // 1 µm = 1/0.0254 µin
  roughness: { metric: { label: "µm Ra", perSi: 1 }, imperial: { label: "µin Ra", perSi: 1 / 0.0254 } },
};

export function unitLabel(q: Quantity, system: UnitSystem): string {
  return q === "plain" ? "" : UNITS[q][system].label;
}

/** SI (as stored) → the person's display value. */
export function fromSi(q: Quantity, si: number, system: UnitSystem): number {
  return q === "plain" ? si : si * UNITS[q][system].perSi;
}

/** The person's display value → SI (as stored). */
export function toSi(q: Quantity, shown: number, system: UnitSystem): number {
  return q === "plain" ? shown : shown / UNITS[q][system].perSi;
}

/** A figure for a dense table: sensible significant digits, thin unit after it. */
export function formatQuantity(q: Quantity, si: number | null | undefined, system: UnitSystem, withUnit = true): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const v = fromSi(q, si, system);
  const text = trimNumber(v);
  const unit = unitLabel(q, system);
  return withUnit && unit ? `${text} ${unit}` : text;
}

/** Four significant figures, no trailing zeros, thousands grouped. */
export function trimNumber(v: number): string {
  if (v === 0) return "0";
  const abs = Math.abs(v);
  const digits = abs >= 1000 ? 0 : Math.max(0, 3 - Math.floor(Math.log10(abs)));
  const rounded = Number(v.toFixed(Math.min(digits, 6)));
  return rounded.toLocaleString("en-US", { maximumFractionDigits: Math.min(digits, 6) });
}

/** The value to put back into an input: display units, rounded to 6 significant digits, no grouping. */
export function inputValue(q: Quantity, si: number | null | undefined, system: UnitSystem): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "";
  return String(Number(fromSi(q, si, system).toPrecision(6)));
}
