// The machining and measurement record of a build, and the plan's estimate re-run with what was
// measured in place of what was planned. Pure; SI inside (mm, µm Ra).
import { z } from "zod";
import { rankChecks, type LimitCheck, type PlanEstimate, type Status } from "../clamp";
import type { PlanParts } from "../plan/assemble";
import { marginStatus } from "../plan/margin";
import type { UnitSystem } from "../units";
import { MACHINING_FIGURE_BOUNDS, type MachiningFigure } from "./machining-figures";
import { isoDate, optionalQuantity } from "./run";

export interface MachiningFigures {
  headFlatnessMm: number | null;
  deckFlatnessMm: number | null;
  headFinishUm: number | null;
  deckFinishUm: number | null;
  headRemovedMm: number | null;
  deckRemovedMm: number | null;
  /** Per bore, cylinder 1 first; null where that bore was not measured. */
  sleeveProtrusionMm: (number | null)[];
  wireProjectionMm: number | null;
  receiverGrooveDepthMm: number | null;
  gasketCompressedMm: number | null;
}

export interface MachiningRecord extends MachiningFigures {
  id: number;
  engineId: number;
  planId: number;
  measuredOn: string;
  measuredBy: string;
  notes: string;
  createdAt: string;
}

export type MachiningInput = MachiningFigures & { planId: number; measuredOn: string; measuredBy: string; notes: string };

export interface MachiningFormContext {
  planIds: number[];
  cylinders: number;
  units: UnitSystem;
}

/** The machining form, typed in the person's units: the figures above, then protrusion-<i> per bore. */
export function parseMachiningForm(form: Record<string, string>, ctx: MachiningFormContext) {
  const errors: Record<string, string> = {};
  const base = z
    .object({
      planId: z.coerce.number().refine((n) => ctx.planIds.includes(n), "Pick one of this engine's seal plans"),
      measuredOn: isoDate("Date"),
      measuredBy: z.string().trim().min(1, "Say who measured it").max(120, "At most 120 characters"),
      notes: z.string().max(4000, "Notes: at most 4,000 characters"),
    })
    .safeParse({
      planId: form.planId ?? "",
      measuredOn: form.measuredOn ?? "",
      measuredBy: form.measuredBy ?? "",
      notes: form.notes ?? "",
    });
  if (!base.success) for (const i of base.error.issues) errors[i.path.map(String).join(".")] ??= i.message;
  const figures: Partial<Record<MachiningFigure, number | null>> = {};
  for (const [name, label, quantity, min, max] of MACHINING_FIGURE_BOUNDS) {
    const r = optionalQuantity(label, quantity, ctx.units, min, max).safeParse(form[name] ?? "");
    if (!r.success) errors[name] = r.error.issues[0]!.message;
    else figures[name] = r.data ?? null;
  }
  const sleeveProtrusionMm = Array.from({ length: ctx.cylinders }, (_, i) => {
    const r = optionalQuantity(`Protrusion of bore ${i + 1}`, "smallLength", ctx.units, -0.5, 1).safeParse(form[`protrusion-${i}`] ?? "");
    if (!r.success) errors[`protrusion-${i}`] = r.error.issues[0]!.message;
    return r.success ? (r.data ?? null) : null;
  });
  if (Object.keys(errors).length === 0 && Object.values(figures).every((v) => v === null) && sleeveProtrusionMm.every((v) => v === null))
    errors.headFlatnessMm = "Record at least one measurement";
  if (!base.success || Object.keys(errors).length > 0) return { ok: false as const, errors };
  return { ok: true as const, value: { ...base.data, ...(figures as Record<MachiningFigure, number | null>), sleeveProtrusionMm } };
}

/** Whether a measured figure enters the re-run estimate, and why not when it does not. */
export interface FigureUse {
  name: MachiningFigure | "sleeveProtrusionMm";
  enters: boolean;
  why: string;
}

/** What each figure does in the re-run, for this engine (sleeved or not) and plan (with a wire or not). */
export function figureUses(sleeved: boolean, wired: boolean): FigureUse[] {
  const flat = "recorded only: the model takes the faces as flat";
  const finish = "recorded only: the model's settling uses a typical finish class, not a measured Ra";
  const grip = "enters: the grip is shortened by the cut (the chamber volume is not re-measured)";
  const wire = wired ? "enters: the seal line's head start over the gasket body" : "recorded only: this plan has no wire";
  return [
    { name: "headFlatnessMm", enters: false, why: flat },
    { name: "deckFlatnessMm", enters: false, why: flat },
    { name: "headFinishUm", enters: false, why: finish },
    { name: "deckFinishUm", enters: false, why: finish },
    { name: "headRemovedMm", enters: true, why: grip },
    { name: "deckRemovedMm", enters: true, why: grip },
    {
      name: "sleeveProtrusionMm",
      enters: sleeved,
      why: sleeved ? "enters: each bore is estimated at its own protrusion" : "recorded only: this engine has no sleeves in its record",
    },
    { name: "wireProjectionMm", enters: wired, why: wire },
    { name: "receiverGrooveDepthMm", enters: wired, why: wire },
    { name: "gasketCompressedMm", enters: true, why: "enters: the gasket's stiffness, the grip and the compression ratio" },
  ];
}

/**
 * The distinct protrusions the re-run needs: one estimate per measured value (every bore at it), the
 * plan's own where a bore was not measured or the engine has no sleeves. `runOfBore[b]` is the estimate
 * bore b reads its figures from.
 */
export function protrusionRuns(m: Pick<MachiningFigures, "sleeveProtrusionMm">, cylinders: number, sleeved: boolean) {
  const values: (number | null)[] = [];
  const runOfBore = Array.from({ length: cylinders }, (_, b) => {
    const v = sleeved ? (m.sleeveProtrusionMm[b] ?? null) : null;
    const at = values.indexOf(v);
    if (at >= 0) return at;
    values.push(v);
    return values.length - 1;
  });
  return { values, runOfBore };
}

/** The plan's parts with the measured figures in place of the planned ones; `protrusionMm` null keeps the plan's. */
export function measuredParts(parts: PlanParts, m: MachiningFigures, protrusionMm: number | null): PlanParts {
  const { engine, plan, gasket } = parts;
  return {
    ...parts,
    engine: {
      ...engine,
      headThicknessAtStudMm: engine.headThicknessAtStudMm - (m.headRemovedMm ?? 0),
      blockDepthToThreadMm: Math.max(0, engine.blockDepthToThreadMm - (m.deckRemovedMm ?? 0)),
    },
    plan: {
      ...plan,
      sleeveProtrusionMm: protrusionMm ?? plan.sleeveProtrusionMm,
      wireProjectionMm: m.wireProjectionMm ?? plan.wireProjectionMm,
      receiverGrooveDepthMm: m.receiverGrooveDepthMm ?? plan.receiverGrooveDepthMm,
    },
    gasket: { ...gasket, compressedThicknessMm: m.gasketCompressedMm ?? gasket.compressedThicknessMm },
  };
}

export interface CylinderSide {
  cylinder: number;
  planned: number;
  measured: number;
  plannedStatus: Status;
  measuredStatus: Status;
}

export interface SideBySide {
  cylinders: CylinderSide[];
  /** The check that decides each verdict (the worst of all checks), with its status. */
  planned: LimitCheck;
  measured: LimitCheck;
}

/** The check a verdict names: the worst checked one, or the seal when every check passes (as the model's verdict). */
function deciding(checks: LimitCheck[]): LimitCheck {
  const worst = rankChecks(checks)[0]!;
  return worst.checked && worst.status !== "holds" ? worst : checks.find((c) => c.id === "seal")!;
}

/**
 * Planned against measured, per cylinder and in one verdict each. Bore b reads its seal and body
 * margins from runs[runOfBore[b]] (the estimate at its own protrusion); the stud, bearing, thread and
 * crush checks are taken at their worst over the runs, which judges them as though every bore stood at
 * the protrusion that is hardest on them (on the safe side).
 */
export function sideBySide(planned: PlanEstimate, runs: readonly PlanEstimate[], runOfBore: readonly number[]): SideBySide {
  const seal = planned.verdict.checks.find((c) => c.id === "seal")!;
  const thin = seal.thinBelow;
  const bores = runOfBore.map((r, b) => runs[r]!.cylinders[b]!);
  const cylinders = bores.map((c, b) => ({
    cylinder: b + 1,
    planned: planned.cylinders[b]!.sealMargin,
    measured: c.sealMargin,
    plannedStatus: marginStatus(planned.cylinders[b]!.sealMargin, thin),
    measuredStatus: marginStatus(c.sealMargin, thin),
  }));
  const weakest = (key: "sealMargin" | "bodyMargin") => bores.reduce((w, c) => (c[key] < w[key] ? c : w));
  const ws = weakest("sealMargin");
  const wb = weakest("bodyMargin");
  const body = planned.verdict.checks.find((c) => c.id === "body-seal")!;
  const measuredChecks: LimitCheck[] = [
    {
      ...seal,
      ratio: ws.sealMargin,
      status: marginStatus(ws.sealMargin, thin),
      detail: `margin ${ws.sealMargin.toFixed(2)} on cylinder ${ws.cylinder}`,
      cylinder: ws.cylinder,
    },
    {
      ...body,
      ratio: wb.bodyMargin,
      status: marginStatus(wb.bodyMargin, 1),
      detail: `body margin ${wb.bodyMargin.toFixed(2)} on cylinder ${wb.cylinder}`,
      cylinder: wb.cylinder,
    },
    ...runs.flatMap((r) => r.verdict.checks.filter((c) => c.id !== "seal" && c.id !== "body-seal")),
  ];
  return { cylinders, planned: deciding(planned.verdict.checks), measured: deciding(measuredChecks) };
}
