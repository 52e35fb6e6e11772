// Builds the clamp model's input from the shop's records: the records and the torque-target input are
// in ./parts (no model, for the browser's first JavaScript); this module adds the step that needs the
// model, a stretch target turned into a preload through the stud's stiffness. Servers and tests import
// from here; the editor's browser code imports ./parts and does that step once the model has loaded.
import type { PlanInputRaw } from "../clamp";
import { assembleTorqueInput, plannedByStretch, type PlanParts } from "./parts";
import { withStretchTarget } from "./stretch";

export * from "./parts";

export function assemblePlanInput(parts: PlanParts): PlanInputRaw {
  const raw = assembleTorqueInput(parts);
  // A stretch target becomes a preload through the stud's stiffness, which does not depend on the target.
  return plannedByStretch(parts.plan) ? withStretchTarget(raw, parts.plan.targetStretchMm) : raw;
}
