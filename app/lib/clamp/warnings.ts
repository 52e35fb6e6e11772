// Plain-English warnings for the builder. Figures are SI; the UI may restate them in its units.
import type { PlanEstimate } from "./evaluate";
import type { Prepared } from "./model";
import { peakPressureNote, SI_WORDING, type Wording } from "./wording";

const pct = (x: number) => `${Math.round(x * 100)} %`;
const f2 = (x: number) => x.toFixed(2);

export function planWarnings(p: Prepared, e: PlanEstimate, w: Wording = SI_WORDING): string[] {
  const kN = w.force;
  const out: string[] = [];
  const plan = p.plan;
  const limitFraction = plan.model.studLimitFraction;
  if (e.studStress.atMax.utilization > limitFraction) {
    out.push(
      `At the top of the preload band the stud's equivalent stress is ${pct(e.studStress.atMax.utilization)} of yield, past the ${pct(limitFraction)} we check against. Ask the fastener maker before going on: their torque and lubricant govern. A tightening method with less scatter (friction tested, angle, or measured stretch) narrows the band; a stronger or larger stud raises the limit.`,
    );
  }
  if (e.head.bearingUtilizationMax > 1) {
    out.push(
      `Under the washer the head sees up to ${w.stress(e.head.bearingPressureMaxMpa)}, above the ${w.stress(e.head.limitMpa)} the head alloy carries: the washer will sink into the head. Use a larger washer or less torque.`,
    );
  }
  const below = e.cylinders.filter((c) => c.sealMargin < 1);
  if (below.length > 0) {
    out.push(
      `Seal margin is below 1 on cylinder${below.length > 1 ? "s" : ""} ${below.map((c) => c.cylinder).join(", ")} (weakest ${f2(e.weakestMargin)} on cylinder ${e.weakestCylinder}).`,
    );
  }
  const lifted = e.cylinders.filter((c) => c.remainingSealLineHotSettledN <= 0);
  if (lifted.length > 0) {
    out.push(`Firing lifts the seal line off cylinder${lifted.length > 1 ? "s" : ""} ${lifted.map((c) => c.cylinder).join(", ")} when hot and settled.`);
  }
  if (e.squeeze.yieldedCylinders.length > 0) {
    out.push(
      `The seal line is at its indentation limit (${kN(e.seal.lineLimitN)}) on cylinder${e.squeeze.yieldedCylinders.length > 1 ? "s" : ""} ${e.squeeze.yieldedCylinders.join(", ")}: more torque there goes into the gasket body and the head, not the seal line.`,
    );
  } else if (e.squeeze.mostlySqueezing) {
    out.push(
      `This torque is past the squeeze point: more torque now mostly squeezes the head and gasket body instead of adding seal on cylinder ${e.weakestCylinder}.`,
    );
  }
  const opened = e.studs.filter((s) => s.memberFiredN <= 0);
  if (opened.length > 0) out.push(`Firing would open the joint at ${opened.length} stud(s): the clamp there falls to zero.`);
  if (e.hotSettled.preloadN < 0.5 * e.tightening.preload.nominalN) {
    out.push(
      `Hot and settled, the preload falls to ${kN(e.hotSettled.preloadN)}, under half of the ${kN(e.tightening.preload.nominalN)} set at assembly.`,
    );
  }
  // common practice (REFERENCES §9): engagement ≥ 2·d in aluminium, ≈ 1.25·d in iron or steel
  const d = plan.fastener.diameterMm;
  const needed = plan.block.modulusMpa < 90_000 ? 2 * d : 1.25 * d;
  if (plan.fastener.engagementMm < needed) {
    out.push(
      `Thread engagement ${w.length(plan.fastener.engagementMm)} is short for this block; shops usually want ${w.length(needed)}.`,
    );
  }
  if (p.peakEstimated) out.push(`Peak cylinder pressure ${w.pressure(p.peakPressureMpa)} is an estimate. ${peakPressureNote(plan.firing, w)}`);
  return out;
}
