// Plain-English warnings for the builder, each failing check with its own direct remedies, and the
// assumptions the estimate rests on. Figures read in the person's units through the Wording.
import type { PlanEstimate } from "./evaluate";
import type { CheckId } from "./limits";
import type { Prepared } from "./model";
import type { PlanInput } from "./schema";
import { peakPressureNote, SI_WORDING, type Wording } from "./wording";

/** What a builder would try for each failed check, in the order they would try it. */
export const REMEDIES: Record<CheckId, string[]> = {
  seal: [
    "more torque, up to the ceiling",
    "more sleeve protrusion or wire projection, so the seal line takes clamp before the body",
    "a gasket with a harder or wider seal line",
    "more or larger studs around that bore",
  ],
  "body-seal": [
    "less sleeve protrusion or wire projection, so the body keeps some clamp",
    "a gasket body that seals at a lower pressure (a coated multilayer steel body)",
    "more torque, up to the ceiling",
  ],
  "stud-assembly": [
    "the stud maker's lubricant and torque (a slicker lubricant than theirs puts more preload on the stud for the same torque)",
    "a tightening method with less scatter (torque with the lube tested on these studs, torque + angle, or a stretch gauge)",
    "less torque",
    "a stronger or larger stud",
  ],
  "stud-working": [
    "the stud maker's lubricant and torque",
    "a tightening method with less scatter",
    "less torque",
    "a stronger or larger stud",
  ],
  fatigue: [
    "a stud with a reduced shank (it takes less of the firing load)",
    "a stud whose thread is rolled after heat treatment",
    "larger studs",
  ],
  bearing: [
    "a larger or hardened washer, which spreads the load on the head",
    "a spot-faced boss or a steel insert under the washer",
    "less torque",
  ],
  "thread-strip": ["a longer thread engagement in the block", "a thread insert in the block", "less torque"],
  crush: ["less torque", "a gasket whose seal line takes more pressure without damage"],
};

/**
 * The remedies for one check that fit this plan: sleeve protrusion only where there is a sleeve, wire
 * projection only where there is a wire (or as a wire ring to add), less of either only where there is some.
 */
export function remediesFor(id: CheckId, plan: PlanInput): string[] {
  const sleeve = plan.sleeve.kind !== "none";
  const wire = plan.sealing.wireProjectionMm > 0;
  const proud = sleeve ? (wire ? "sleeve protrusion or wire projection" : "sleeve protrusion") : wire ? "wire projection" : null;
  const stands =
    sleeve || wire ? plan.sealing.sleeveProtrusionMm > 0 || plan.sealing.wireProjectionMm > plan.sealing.receiverGrooveDepthMm : false;
  return REMEDIES[id].flatMap((r) => {
    if (r.startsWith("more sleeve protrusion or wire projection"))
      return proud
        ? [r.replace("sleeve protrusion or wire projection", proud)]
        : ["a wire ring standing proud of the gasket, so the seal line takes clamp before the body"];
    if (r.startsWith("less sleeve protrusion or wire projection"))
      return proud && stands ? [r.replace("sleeve protrusion or wire projection", proud)] : [];
    return [r];
  });
}

const pct = (x: number) => `${Math.round(x * 100)} %`;

function list(xs: string[]): string {
  if (xs.length <= 1) return xs.join("");
  return `${xs.slice(0, -1).join("; ")}; or ${xs[xs.length - 1]}`;
}

export function planWarnings(p: Prepared, e: PlanEstimate, w: Wording = SI_WORDING): string[] {
  const kN = w.force;
  const out: string[] = [];
  const plan = p.plan;
  for (const c of e.verdict.checks) {
    if (!c.checked || c.status === "holds") continue;
    const word = c.status === "short" ? "fails" : "is thin";
    out.push(`${c.label} ${word}: ${c.detail}. Try ${list(remediesFor(c.id, plan))}.`);
  }
  const lifted = e.cylinders.filter((c) => c.remainingSealLineHotSettledN <= 0);
  if (lifted.length > 0) {
    out.push(
      `Firing lifts the seal line off cylinder${lifted.length > 1 ? "s" : ""} ${lifted.map((c) => c.cylinder).join(", ")} when hot and settled.`,
    );
  }
  const letGo = e.cylinders.filter((c) => c.beadReserveMm !== null && c.beadReserveMm <= 0);
  if (letGo.length > 0) {
    out.push(
      `Firing lifts the head further than the bead can follow on cylinder${letGo.length > 1 ? "s" : ""} ${letGo.map((c) => c.cylinder).join(", ")} (bottom of the band): the bead lets go of the head.`,
    );
  }
  if (e.squeeze.mostlySqueezing) {
    out.push(
      e.squeeze.reason === "line-at-limit"
        ? `More torque now mostly squeezes the head: the seal line is at its limit (${kN(e.seal.lineLimitN)}) and +10 % torque puts only ${pct(e.gain.share)} of the added clamp on it under firing; the rest goes into the gasket body and the head.`
        : `More torque now mostly squeezes the head: the head compresses ${w.length(e.squeeze.headCompressionMm)} at the stud boss, past the ${pct(e.squeeze.strainLimit)} strain we take as its limit.`,
    );
  }
  const opened = e.studs.filter((s) => s.memberFiredN <= 0);
  if (opened.length > 0) out.push(`Firing would open the joint at ${opened.length} stud(s): the clamp on the gasket there falls to zero.`);
  if (e.hotSettled.preloadN < 0.5 * e.tightening.preload.nominalN) {
    out.push(
      `Hot and settled, the preload falls to ${kN(e.hotSettled.preloadN)}, under half of the ${kN(e.tightening.preload.nominalN)} set at assembly.`,
    );
  }
  // common practice (docs/references.md §9): engagement ≥ 2·d in aluminium, ≈ 1.25·d in iron or steel
  const d = plan.fastener.diameterMm;
  const needed = plan.block.modulusMpa < 90_000 ? 2 * d : 1.25 * d;
  if (plan.fastener.engagementMm < needed) {
    out.push(`Thread engagement ${w.length(plan.fastener.engagementMm)} is short of the shop rule for this block (${w.length(needed)}).`);
  }
  if (p.peakEstimated)
    out.push(`Peak cylinder pressure ${w.pressure(p.peakPressureMpa)} is an estimate. ${peakPressureNote(plan.firing, w)}`);
  return out;
}

/** What this estimate assumed where the plan gave no figure. */
export function planAssumptions(p: Prepared, w: Wording = SI_WORDING): string[] {
  const out: string[] = [];
  if (p.requirement.basis === "asme-stand-in")
    out.push(
      "The seal's needs use flange-code figures (seal hold factor m and seating stress y) as a conservative stand-in; the gasket maker's seating and service pressures replace them.",
    );
  if (p.deck.assumed)
    out.push(`Head fire deck taken as ${w.length(p.deck.thicknessMm)} thick (an eighth of the bore); enter the real figure on the engine.`);
  if (p.studSpacingAssumed)
    out.push(`Stud spacing taken as ${w.length(p.studSpacingMm)} from the stud pattern (bores about 1.15 bores apart).`);
  if (p.bodySealAssumed)
    out.push(`The gasket body is taken to seal coolant and oil at ${w.stress(p.bodySealPressureMpa)} (a typical figure for this family).`);
  if (p.plan.fastener.nutFaceOdMm === undefined && !p.plan.fastener.washerTurns)
    out.push("Washer-face friction acts on a nut face of 1.45 × the stud diameter; enter the nut's face diameter in the fastener library.");
  return out;
}
