// The one table of units: what each quantity is stored in (SI as the core and the database keep it),
// the one unit each unit system reads it in, the other units a person may type, and the decimals
// that read sensibly at the bench. Factors come from convert-units (NIST SP 811 values), computed
// once here so nothing converts on the calculation's hot path.
import configureMeasurements, { type Measure } from "convert-units";
import area from "convert-units/definitions/area";
import force from "convert-units/definitions/force";
import length from "convert-units/definitions/length";
import pressure from "convert-units/definitions/pressure";
import temperature from "convert-units/definitions/temperature";
import torque from "convert-units/definitions/torque";
import volume from "convert-units/definitions/volume";

type AnyMeasure = Measure<string, string>;

// convert-units ships rounded metric↔imperial anchors (3.28084 ft/m, 4.44822 N/lbf, 1.355818 N·m per
// lbf·ft); NIST SP 811 defines them exactly, so the anchors are set here from the definitions:
// 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N (0.45359237 kg × 9.80665 m/s²).
const M_PER_FT = 0.3048;
const N_PER_LBF = 4.4482216152605;
const KPA_PER_KSI = (N_PER_LBF * 1000) / (0.0254 * 0.0254) / 1000;

function exactAnchors(m: unknown, metricToImperial: number): AnyMeasure {
  const d = m as AnyMeasure;
  return {
    ...d,
    anchors: { metric: { imperial: { ratio: metricToImperial } }, imperial: { metric: { ratio: 1 / metricToImperial } } },
  } as AnyMeasure;
}
function exactLbf(m: unknown): AnyMeasure {
  const d = m as AnyMeasure & { systems: Record<string, Record<string, { to_anchor: number }>> };
  const si = d.systems.SI!;
  return { ...d, systems: { ...d.systems, SI: { ...si, lbf: { ...si.lbf!, to_anchor: N_PER_LBF } } } } as unknown as AnyMeasure;
}

// The measures have different unit unions; widen them so one converter serves them all.
const measures: Record<string, AnyMeasure> = {
  area: exactAnchors(area, 1 / (M_PER_FT * M_PER_FT)),
  force: exactLbf(force),
  length: exactAnchors(length, 1 / M_PER_FT),
  pressure: exactAnchors(pressure, 1 / KPA_PER_KSI),
  temperature: temperature as unknown as AnyMeasure,
  torque: exactAnchors(torque, 1 / (N_PER_LBF * M_PER_FT)),
  volume: volume as unknown as AnyMeasure,
};
const convert = configureMeasurements(measures);

/** display = SI × factor + offset, from convert-units' definitions. */
function linear(from: string, to: string, scale = 1): { factor: number; offset: number } {
  const offset = convert(0).from(from).to(to);
  const factor = (convert(1).from(from).to(to) - offset) * scale;
  return { factor, offset: offset * scale };
}

export const UNIT_SYSTEMS = ["metric", "imperial"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export type Quantity =
  | "length" // mm: bore, stud diameter, seal diameter
  | "smallLength" // mm: protrusion, stretch, gasket thickness, quench
  | "area" // mm²
  | "force" // N
  | "torque" // N·m
  | "pressure" // MPa: cylinder pressure
  | "stress" // MPa: yield, seating and gasket stress
  | "modulus" // MPa stored, read as GPa or Mpsi
  | "expansion" // µm/m·°C
  | "roughness" // µm Ra
  | "temperature" // °C
  | "volume" // cc
  | "manifold" // kPa absolute
  | "plain"; // a ratio or factor: no unit

export interface UnitDef {
  label: string;
  factor: number;
  offset: number;
  decimals: number;
  /** Lower-case spellings a person may type after the number. */
  aliases: string[];
  /** Typed as gauge (boost): the standard atmosphere is added (manifold only). */
  gauge?: boolean;
}

const u = (label: string, conv: { factor: number; offset: number }, decimals: number, aliases: string[] = [], gauge = false): UnitDef => ({
  label,
  ...conv,
  decimals,
  aliases: [label.toLowerCase(), ...aliases],
  gauge,
});
const SAME = { factor: 1, offset: 0 };

// Standard atmosphere, 101.325 kPa (ISO 2533): gauge pressure + atmosphere = absolute.
export const ATMOSPHERE_KPA = 101.325;

const gaugeSpellings = (name: string) => [`${name} g`, `${name}g`, `${name} gauge`, `${name} boost`];
const absSpellings = (name: string) => [name, `${name} abs`, `${name}a`];

/** Every unit a quantity is read or typed in; the first two are the metric and imperial choice. */
const UNITS: Record<Quantity, { metric: string; imperial: string; units: UnitDef[] }> = {
  length: {
    metric: "mm",
    imperial: "in",
    units: [u("mm", SAME, 2), u("in", linear("mm", "in"), 3, ['"', "inch"]), u("thou", linear("mm", "mil"), 1, ["mil"])],
  },
  smallLength: {
    metric: "mm",
    imperial: "thou",
    units: [u("mm", SAME, 2), u("thou", linear("mm", "mil"), 1, ["mil"]), u("in", linear("mm", "in"), 4, ['"', "inch"])],
  },
  area: { metric: "mm²", imperial: "in²", units: [u("mm²", SAME, 0, ["mm2"]), u("in²", linear("mm2", "in2"), 3, ["in2", "sq in"])] },
  force: {
    metric: "kN",
    imperial: "lbf",
    units: [u("kN", linear("N", "kN"), 1), u("lbf", linear("N", "lbf"), 0, ["lb"]), u("N", SAME, 0)],
  },
  torque: {
    metric: "N·m",
    imperial: "lbf·ft",
    units: [
      u("N·m", SAME, 0, ["nm", "n-m", "n.m"]),
      u("lbf·ft", linear("Nm", "lbf-ft"), 0, ["lbf-ft", "ft-lb", "ft·lbf", "ft-lbf", "lb-ft", "ft-lbs", "ft lb"]),
    ],
  },
  pressure: {
    metric: "bar",
    imperial: "psi",
    units: [u("bar", linear("MPa", "bar"), 1), u("psi", linear("MPa", "psi"), 0), u("MPa", SAME, 2), u("kPa", linear("MPa", "kPa"), 0)],
  },
  // stresses read in ksi for imperial everywhere (plan pages and library tables alike)
  stress: {
    metric: "MPa",
    imperial: "ksi",
    units: [
      u("MPa", SAME, 0, ["n/mm²", "n/mm2"]),
      u("ksi", linear("MPa", "ksi"), 1),
      u("psi", linear("MPa", "psi"), 0),
      u("GPa", linear("MPa", "kPa", 1e-6), 3),
    ],
  },
  modulus: {
    metric: "GPa",
    imperial: "Mpsi",
    units: [u("GPa", linear("MPa", "kPa", 1e-6), 1), u("Mpsi", linear("MPa", "psi", 1e-6), 2, ["msi"]), u("MPa", SAME, 0)],
  },
  // a Fahrenheit degree is 5/9 of a Celsius degree, so a per-degree figure is 5/9 as large per °F
  expansion: {
    metric: "µm/m·°C",
    imperial: "µin/in·°F",
    units: [
      u("µm/m·°C", SAME, 1, ["um/m", "µm/m", "ppm/c"]),
      u("µin/in·°F", { factor: 1 / linear("C", "F").factor, offset: 0 }, 1, ["uin/in", "µin/in", "ppm/f"]),
    ],
  },
  // µm → µin is the mm → thou ratio (1 µin = 0.0254 µm)
  roughness: {
    metric: "µm Ra",
    imperial: "µin Ra",
    units: [u("µm Ra", SAME, 2, ["µm", "um", "ra µm"]), u("µin Ra", linear("mm", "mil"), 0, ["µin", "uin", "ra µin"])],
  },
  temperature: { metric: "°C", imperial: "°F", units: [u("°C", SAME, 0, ["c", "degc"]), u("°F", linear("C", "F"), 0, ["f", "degf"])] },
  volume: { metric: "cc", imperial: "cc", units: [u("cc", SAME, 1, ["cm3", "cm³", "ml"])] },
  manifold: {
    metric: "kPa abs",
    imperial: "psi abs",
    units: [
      u("kPa abs", SAME, 0, absSpellings("kpa")),
      u("psi abs", linear("kPa", "psi"), 1, absSpellings("psi")),
      u("bar abs", linear("kPa", "bar"), 2, absSpellings("bar")),
      u("MPa abs", linear("kPa", "MPa"), 3, absSpellings("mpa")),
      u("kPa g", SAME, 0, gaugeSpellings("kpa"), true),
      u("psi g", linear("kPa", "psi"), 1, gaugeSpellings("psi"), true),
      u("bar g", linear("kPa", "bar"), 2, gaugeSpellings("bar"), true),
    ],
  },
  plain: { metric: "", imperial: "", units: [u("", SAME, 3)] },
};

/** The unit a quantity reads in for a unit system: one choice each, the same on every page. */
export function unitFor(quantity: Quantity, system: UnitSystem): string {
  return UNITS[quantity][system];
}

/** The labels a quantity may be shown in. */
export function unitsOf(quantity: Quantity): string[] {
  return UNITS[quantity].units.filter((d) => !d.gauge).map((d) => d.label);
}

export function unitDef(quantity: Quantity, label: string): UnitDef {
  const d = UNITS[quantity].units.find((x) => x.label === label);
  if (!d) throw new RangeError(`${label} is not a unit of ${quantity}`);
  return d;
}

/** The unit a typed suffix names for this quantity, or undefined. */
export function unitBySpelling(quantity: Quantity, typed: string): UnitDef | undefined {
  const t = typed.trim().toLowerCase().replace(/\s+/g, " ");
  return UNITS[quantity].units.find((d) => d.aliases.includes(t) || d.aliases.includes(t.replace(/\s/g, "")));
}
