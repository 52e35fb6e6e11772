// The run log: what a run is, in the builder's words, and the form schema. Pure; SI inside.
import { z } from "zod";
import { formatQuantity, parseQuantity, unitFor, type Quantity, type UnitSystem } from "../units";

export const RUN_KINDS = ["dyno", "pass", "street"] as const;
export type RunKind = (typeof RUN_KINDS)[number];
export const RUN_KIND_LABEL: Record<RunKind, string> = { dyno: "Dyno session", pass: "Pass", street: "Street use" };

export const OUTCOMES = [
  "held",
  "seeping",
  "coolant-leak",
  "combustion-leak",
  "lifted-head",
  "blown-gasket",
  "stud-failure",
  "other",
] as const;
export type Outcome = (typeof OUTCOMES)[number];
export const OUTCOME_LABEL: Record<Outcome, string> = {
  held: "Held",
  seeping: "Seeping",
  "coolant-leak": "Coolant leak",
  "combustion-leak": "Combustion leak",
  "lifted-head": "Lifted head",
  "blown-gasket": "Blown gasket",
  "stud-failure": "Stud failure",
  other: "Other",
};
/** Outcomes where the head seal itself gave way (a stud failure or "other" is not counted as one). */
export const SEAL_FAILURES: readonly Outcome[] = ["seeping", "coolant-leak", "combustion-leak", "lifted-head", "blown-gasket"];
export const isSealFailure = (o: Outcome) => SEAL_FAILURES.includes(o);

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;
export const isoDate = (label: string) =>
  z
    .string()
    .trim()
    .regex(ISO_DATE, `${label} must be written as YYYY-MM-DD`)
    .refine(
      (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
      `${label} is not a real date`,
    );

/** "" → undefined, else a finite number within [min, max]. */
export const optionalNumber = (label: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .transform((s, ctx) => {
      if (s === "") return undefined;
      const n = Number(s.replace(",", "."));
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: "custom", message: `${label} must be a number` });
        return z.NEVER;
      }
      if (n < min || n > max) {
        ctx.addIssue({ code: "custom", message: `${label} must be between ${min} and ${max}` });
        return z.NEVER;
      }
      return n;
    });

/**
 * "" → undefined, else a figure typed in the person's unit (or with a unit of the quantity after it) read
 * into SI, within [minSi, maxSi]; the bounds are worded in the person's unit.
 */
export const optionalQuantity = (label: string, quantity: Quantity, system: UnitSystem, minSi: number, maxSi: number) =>
  z
    .string()
    .trim()
    .transform((s, ctx) => {
      if (s === "") return undefined;
      const r = parseQuantity(s, quantity, unitFor(quantity, system));
      if (!r.ok) {
        ctx.addIssue({ code: "custom", message: `${label}: ${r.message}` });
        return z.NEVER;
      }
      if (r.valueSi < minSi || r.valueSi > maxSi) {
        const f = (x: number) => formatQuantity(x, quantity, system);
        ctx.addIssue({ code: "custom", message: `${label} must be between ${f(minSi)} and ${f(maxSi)}` });
        return z.NEVER;
      }
      return r.valueSi;
    });

/** "1, 3 4" → [1, 3, 4]: each a cylinder of this engine. */
export function cylinderList(cylinders: number) {
  return z
    .string()
    .trim()
    .max(100, "List at most a few dozen cylinders")
    .transform((s, ctx) => {
      if (s === "") return [];
      const parts = s.split(/[\s,;]+/).filter(Boolean);
      const out: number[] = [];
      for (const p of parts) {
        const n = Number(p);
        if (!Number.isInteger(n) || n < 1 || n > cylinders) {
          ctx.addIssue({ code: "custom", message: `Cylinders are numbered 1 to ${cylinders}; "${p.slice(0, 10)}" is not one` });
          return z.NEVER;
        }
        if (!out.includes(n)) out.push(n);
      }
      return out.sort((a, b) => a - b);
    });
}

/** The run form in the person's units (pressures read into kPa absolute and MPa). */
export function runSchema(cylinders: number, units: UnitSystem) {
  return z
    .object({
      ranOn: isoDate("Date"),
      kind: z.enum(RUN_KINDS, "Pick dyno, pass or street"),
      // kPa absolute; 1000 kPa is about 10 bar of boost, far past any engine here
      manifoldPressureKpa: optionalQuantity("Manifold pressure", "manifold", units, 20, 1000),
      fuel: z.string().trim().max(60, "Fuel: at most 60 characters"),
      peakCylinderPressureMpa: optionalQuantity("Peak cylinder pressure", "pressure", units, 1, 100),
      outcome: z.enum(OUTCOMES, "Pick an outcome"),
      cylindersAffected: cylinderList(cylinders),
      notes: z.string().max(4000, "Notes: at most 4,000 characters"),
      teardownFindings: z.string().max(4000, "Teardown findings: at most 4,000 characters"),
    })
    .superRefine((r, ctx) => {
      if (r.peakCylinderPressureMpa === undefined && r.manifoldPressureKpa === undefined)
        ctx.addIssue({
          code: "custom",
          path: ["manifoldPressureKpa"],
          message: "Give the manifold pressure, or the measured peak cylinder pressure",
        });
      if (r.outcome !== "held" && r.outcome !== "other" && r.cylindersAffected.length === 0)
        ctx.addIssue({ code: "custom", path: ["cylindersAffected"], message: "Say which cylinders it affected" });
      if (r.outcome === "held" && r.cylindersAffected.length > 0)
        ctx.addIssue({ code: "custom", path: ["cylindersAffected"], message: "A run that held affects no cylinders: leave this empty" });
    });
}
export type RunInput = z.output<ReturnType<typeof runSchema>>;

export const RUN_FIELDS = [
  "ranOn",
  "kind",
  "manifoldPressureKpa",
  "fuel",
  "peakCylinderPressureMpa",
  "outcome",
  "cylindersAffected",
  "notes",
  "teardownFindings",
] as const;

/**
 * The run form as posted through Conform, which reads a blank field as missing: each field as typed
 * (blank as ""), checked by runSchema, its messages filed under the fields the builder sees.
 */
export function runFormSchema(cylinders: number, units: UnitSystem) {
  const typed = z.string().optional();
  const schema = runSchema(cylinders, units);
  return z.object(Object.fromEntries(RUN_FIELDS.map((name) => [name, typed]))).transform((form, ctx) => {
    const parsed = schema.safeParse(Object.fromEntries(RUN_FIELDS.map((name) => [name, form[name] ?? ""])));
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
    return z.NEVER;
  });
}

/** A stored run, as the pages and the CSV see it. */
export interface RunRecord {
  id: number;
  engineId: number;
  planId: number | null;
  ranOn: string;
  kind: RunKind;
  manifoldPressureKpa: number | null;
  fuel: string;
  peakCylinderPressureMpa: number | null;
  peakPressureSource: "measured" | "estimated";
  outcome: Outcome;
  cylindersAffected: number[];
  notes: string;
  teardownFindings: string;
  createdAt: string;
}

export const RUN_SORTS = ["ranOn", "kind", "manifoldPressureKpa", "peakCylinderPressureMpa", "outcome", "fuel"] as const;
export type RunSort = (typeof RUN_SORTS)[number];

export interface RunFilter {
  kind?: RunKind;
  outcome?: Outcome | "failed";
  fuel?: string;
}

/** Filter and sort a run list (the table's query string); unknown values are ignored. */
export function selectRuns(
  runs: readonly RunRecord[],
  filter: RunFilter,
  sort: RunSort = "ranOn",
  dir: "asc" | "desc" = "desc",
): RunRecord[] {
  const kept = runs.filter(
    (r) =>
      (!filter.kind || r.kind === filter.kind) &&
      (!filter.outcome || (filter.outcome === "failed" ? r.outcome !== "held" : r.outcome === filter.outcome)) &&
      (!filter.fuel || r.fuel === filter.fuel),
  );
  const sign = dir === "asc" ? 1 : -1;
  return [...kept].sort((a, b) => {
    const x = a[sort];
    const y = b[sort];
    if (x === y) return sign * (a.id - b.id);
    if (x === null) return 1;
    if (y === null) return -1;
    return sign * (x < y ? -1 : 1);
  });
}

export const RUN_CSV_COLUMNS = [
  "date",
  "kind",
  "manifold_kpa_abs",
  "fuel",
  "peak_cylinder_pressure_mpa",
  "peak_pressure_source",
  "outcome",
  "cylinders_affected",
  "notes",
  "teardown_findings",
] as const;

/** One CSV row per run, SI figures; the CSV library does the quoting. */
export function runCsvRows(runs: readonly RunRecord[]): string[][] {
  return runs.map((r) => [
    r.ranOn,
    r.kind,
    r.manifoldPressureKpa === null ? "" : String(r.manifoldPressureKpa),
    r.fuel,
    r.peakCylinderPressureMpa === null ? "" : String(r.peakCylinderPressureMpa),
    r.peakPressureSource,
    r.outcome,
    r.cylindersAffected.join(" "),
    r.notes,
    r.teardownFindings,
  ]);
}
