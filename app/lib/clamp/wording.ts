// How figures read inside the model's sentences (warnings, squeeze point, suggestions).
// SI by default; the app passes one in the person's display units. Pure: formatting only.
import type { PlanInput } from "./schema";
export interface Wording {
  torque(nm: number): string;
  force(n: number): string;
  stress(mpa: number): string;
  length(mm: number): string;
  /** Gas pressure (cylinder, manifold), MPa. */
  pressure(mpa: number): string;
}

export const SI_WORDING: Wording = {
  torque: (x) => `${x.toFixed(0)} N·m`,
  force: (n) => `${(n / 1000).toFixed(1)} kN`,
  stress: (x) => `${x.toFixed(0)} MPa`,
  length: (x) => `${x.toFixed(3)} mm`,
  pressure: (x) => `${x.toFixed(1)} MPa`,
};

const round = (x: number) => String(Math.round(x * 100) / 100);

/** Where the peak cylinder pressure came from, in words. */
export function peakPressureNote(firing: PlanInput["firing"], w: Wording = SI_WORDING): string {
  if (firing.mode === "entered") return "Peak cylinder pressure as entered.";
  return (
    `Estimate: ${w.pressure(firing.manifoldAbsKpa / 1000)} manifold × ${round(firing.compressionRatio)}^${firing.exponent} compression × ` +
    `${round(firing.pressureRiseFactor)} combustion rise. Measured peak pressure, when you have it, is better.`
  );
}
