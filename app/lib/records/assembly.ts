// The assembly record: a plan installed on an engine, as it was tightened. Pure; SI inside.
import { z } from "zod";
import { preloadForStretchN } from "../plan/stretch";
import type { UnitSystem } from "../units";
import { isoDate, optionalNumber, optionalQuantity } from "./run";

export interface StageDone {
  targetNm: number;
  reachedNm: number | null;
  angleDeg: number | null;
}
export interface StudStretch {
  label: string;
  stretchMm: number;
}

export interface AssemblyRecord {
  id: number;
  engineId: number;
  planId: number;
  assembledOn: string;
  assembledBy: string;
  lubricant: string;
  stagesDone: StageDone[];
  studStretch: StudStretch[];
  finalTorqueNm: number | null;
  measuredProtrusionMm: number | null;
  gasketCompressedMm: number | null;
  notes: string;
  createdAt: string;
}

/** What the form needs to know of the plan picked: its stages and the engine's stud labels; the person's units. */
export interface AssemblyFormContext {
  planIds: number[];
  stagesNm: number[];
  studLabels: string[];
  units: UnitSystem;
}

/** The assembly form, typed in the person's units: fixed fields, then stage-N-reached / stage-N-angle and stretch-<i> per stud. */
export function parseAssemblyForm(form: Record<string, string>, ctx: AssemblyFormContext) {
  const base = z
    .object({
      planId: z.coerce.number().refine((n) => ctx.planIds.includes(n), "Pick one of this engine's seal plans"),
      assembledOn: isoDate("Date"),
      assembledBy: z.string().trim().min(1, "Say who assembled it").max(120, "At most 120 characters"),
      lubricant: z.string().trim().max(120, "Lubricant: at most 120 characters"),
      measuredProtrusionMm: optionalQuantity("Measured protrusion", "smallLength", ctx.units, -0.5, 1),
      gasketCompressedMm: optionalQuantity("Gasket compressed thickness", "smallLength", ctx.units, 0.1, 10),
      notes: z.string().max(4000, "Notes: at most 4,000 characters"),
    })
    .safeParse({
      planId: form.planId ?? "",
      assembledOn: form.assembledOn ?? "",
      assembledBy: form.assembledBy ?? "",
      lubricant: form.lubricant ?? "",
      measuredProtrusionMm: form.measuredProtrusionMm ?? "",
      gasketCompressedMm: form.gasketCompressedMm ?? "",
      notes: form.notes ?? "",
    });
  const errors: Record<string, string> = {};
  if (!base.success) for (const i of base.error.issues) errors[i.path.map(String).join(".")] ??= i.message;
  const stagesDone: StageDone[] = ctx.stagesNm.map((targetNm, i) => {
    const reached = optionalQuantity(`Stage ${i + 1} torque reached`, "torque", ctx.units, 1, 5000).safeParse(
      form[`stage-${i}-reached`] ?? "",
    );
    const angle = optionalNumber(`Stage ${i + 1} angle`, 1, 720).safeParse(form[`stage-${i}-angle`] ?? "");
    if (!reached.success) errors[`stage-${i}-reached`] = reached.error.issues[0]!.message;
    if (!angle.success) errors[`stage-${i}-angle`] = angle.error.issues[0]!.message;
    return { targetNm, reachedNm: reached.success ? (reached.data ?? null) : null, angleDeg: angle.success ? (angle.data ?? null) : null };
  });
  if (ctx.stagesNm.length > 0 && stagesDone.every((s) => s.reachedNm === null && s.angleDeg === null))
    errors["stage-0-reached"] ??= "Record at least one stage as done (torque reached or angle turned)";
  const studStretch: StudStretch[] = [];
  ctx.studLabels.forEach((label, i) => {
    // a stud stretch beyond 2 mm is a typing slip (heads studs stretch a few tenths at most)
    const s = optionalQuantity(`Stretch of stud ${label}`, "smallLength", ctx.units, 0.005, 2).safeParse(form[`stretch-${i}`] ?? "");
    if (!s.success) errors[`stretch-${i}`] = s.error.issues[0]!.message;
    else if (s.data !== undefined) studStretch.push({ label, stretchMm: s.data });
  });
  if (!base.success || Object.keys(errors).length > 0) return { ok: false as const, errors };
  const last = [...stagesDone].reverse().find((s) => s.reachedNm !== null);
  return {
    ok: true as const,
    value: { ...base.data, stagesDone, studStretch, finalTorqueNm: last?.reachedNm ?? null },
  };
}

/** Measured stretch of one stud beside the preload it implies and the preload the torque predicted. */
export interface ImpliedPreload {
  label: string;
  stretchMm: number;
  impliedPreloadN: number;
  predictedPreloadN: number | null;
  /** implied / predicted − 1 */
  difference: number | null;
}

/**
 * Preload from each measured stretch through the model's stud stiffness k (F = k·δ, the same rule the
 * plan form uses), beside the preload the clamp model gave for the torque reached.
 */
export function impliedPreloads(
  stretch: readonly StudStretch[],
  studStiffnessNPerMm: number,
  predictedPreloadN: number | null,
): ImpliedPreload[] {
  return stretch.map((s) => {
    const impliedPreloadN = preloadForStretchN(s.stretchMm, studStiffnessNPerMm);
    return {
      label: s.label,
      stretchMm: s.stretchMm,
      impliedPreloadN,
      predictedPreloadN,
      difference: predictedPreloadN && predictedPreloadN > 0 ? impliedPreloadN / predictedPreloadN - 1 : null,
    };
  });
}
