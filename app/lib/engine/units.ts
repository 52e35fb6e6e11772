// Display units for the engine record: one call per direction, so the shared units module
// (app/lib/units) can take over without touching the form or the pages.
export type Units = "metric" | "imperial";
export type Quantity = "length" | "manifold" | "peak" | "temperature" | "volume";

// Exact definitions: 1 in = 25.4 mm; 1 psi = 6.894757293168 kPa (NIST SP 811 B.8); °F = °C·9/5 + 32.
const MM_PER_IN = 25.4;
const KPA_PER_PSI = 6.894757293168;

const LABEL: Record<Quantity, Record<Units, string>> = {
  length: { metric: "mm", imperial: "in" },
  manifold: { metric: "kPa abs", imperial: "psi abs" },
  peak: { metric: "MPa", imperial: "psi" },
  temperature: { metric: "°C", imperial: "°F" },
  volume: { metric: "cc", imperial: "cc" },
};

// Decimals worth showing for each quantity in each system.
const DECIMALS: Record<Quantity, Record<Units, number>> = {
  length: { metric: 3, imperial: 4 },
  manifold: { metric: 0, imperial: 1 },
  peak: { metric: 1, imperial: 0 },
  temperature: { metric: 0, imperial: 0 },
  volume: { metric: 1, imperial: 1 },
};

export function unitLabel(q: Quantity, units: Units): string {
  return LABEL[q][units];
}

/** SI (mm, kPa, MPa, °C, cc) → the person's units. */
export function toDisplay(q: Quantity, si: number, units: Units): number {
  if (units === "metric") return si;
  switch (q) {
    case "length":
      return si / MM_PER_IN;
    case "manifold":
      return si / KPA_PER_PSI;
    case "peak":
      return (si * 1000) / KPA_PER_PSI;
    case "temperature":
      return (si * 9) / 5 + 32;
    case "volume":
      return si;
  }
}

/** The person's units → SI. */
export function fromDisplay(q: Quantity, value: number, units: Units): number {
  if (units === "metric") return value;
  switch (q) {
    case "length":
      return value * MM_PER_IN;
    case "manifold":
      return value * KPA_PER_PSI;
    case "peak":
      return (value * KPA_PER_PSI) / 1000;
    case "temperature":
      return ((value - 32) * 5) / 9;
    case "volume":
      return value;
  }
}

/** A figure for an input's value: rounded to the quantity's decimals, trailing zeros dropped. */
export function inputValue(q: Quantity, si: number | null | undefined, units: Units): string {
  if (si === null || si === undefined) return "";
  const d = DECIMALS[q][units] + 1;
  return String(Number(toDisplay(q, si, units).toFixed(d)));
}

/** A figure with its unit for reading, e.g. "86.000 mm" or "3.3858 in". */
export function formatQuantity(q: Quantity, si: number | null | undefined, units: Units): string {
  if (si === null || si === undefined) return "—";
  return `${toDisplay(q, si, units).toFixed(DECIMALS[q][units])} ${LABEL[q][units]}`;
}
