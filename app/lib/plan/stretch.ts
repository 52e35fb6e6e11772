// Stud stretch ⇄ preload through the stud's own stiffness, for plans tightened with a stretch gauge.
// Pure; SI (mm, N, N·m). The stiffness comes from the clamp model (its sections in series, VDI 2230).
import { evaluatePlan, parsePlan, prepare, type PlanInputRaw } from "../clamp";

/** The stud's axial stiffness (N/mm) for this plan input, or null while the input is not valid. */
export function studStiffnessFor(raw: PlanInputRaw): number | null {
  const parsed = parsePlan(raw);
  if (!parsed.ok) return null;
  const k = prepare(parsed.plan).stud.stiffnessNPerMm;
  return Number.isFinite(k) && k > 0 ? k : null;
}

// Hooke's law on the stud as a spring in series: F = k·Δl (Shigley §8-4)
export const preloadForStretchN = (stretchMm: number, stiffnessNPerMm: number) => stretchMm * stiffnessNPerMm;
export const stretchForPreloadMm = (preloadN: number, stiffnessNPerMm: number) => preloadN / stiffnessNPerMm;

/**
 * The input with its tightening target turned from torque into the preload the target stretch gives.
 * Left as it is when the input is not valid yet (the model's own checks then say what is wrong).
 */
export function withStretchTarget(raw: PlanInputRaw, targetStretchMm: number): PlanInputRaw {
  const k = studStiffnessFor(raw);
  if (k === null) return raw;
  return { ...raw, tightening: { ...raw.tightening, target: { mode: "preload", preloadN: preloadForStretchN(targetStretchMm, k) } } };
}

/** What the plan form says about stretch: by torque, the stretch the torque gives; by stretch, the torque it takes. */
export interface StretchLine {
  mode: "torque" | "stretch";
  stretchMm: number;
  preloadN: number;
  torqueNm: number;
  studStiffnessNPerMm: number;
}

/** From the estimate's nominal preload and torque and the stud stiffness. */
export function stretchLine(
  mode: "torque" | "stretch",
  preloadN: number,
  torqueNm: number,
  stiffnessNPerMm: number | null,
): StretchLine | null {
  if (stiffnessNPerMm === null || !(preloadN > 0)) return null;
  return { mode, stretchMm: stretchForPreloadMm(preloadN, stiffnessNPerMm), preloadN, torqueNm, studStiffnessNPerMm: stiffnessNPerMm };
}

/** The stretch line for a plan input, by one evaluation of the model (for pages without an estimate of their own). */
export function stretchLineFor(raw: PlanInputRaw): StretchLine | null {
  const parsed = parsePlan(raw);
  if (!parsed.ok) return null;
  const t = evaluatePlan(parsed.plan).tightening;
  const mode = parsed.plan.tightening.target.mode === "preload" ? "stretch" : "torque";
  return stretchLine(mode, t.preload.nominalN, t.torqueNm, prepare(parsed.plan).stud.stiffnessNPerMm);
}
