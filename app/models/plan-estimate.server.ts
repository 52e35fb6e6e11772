import { parsePlan } from "~/lib/clamp";
import { assemblePlanInput, type PlanRecord } from "~/lib/plan/assemble";
import { estimateView, type EstimateView } from "~/lib/plan/estimate-view";
import { displayWording } from "~/lib/plan/wording";
import type { UnitSystem } from "~/lib/units";
import type { EngineRow } from "./engine.server";
import { planParts, type FastenerInfo, type GasketInfo } from "./plan.server";

export type PlanEstimateResult =
  | { ok: true; view: EstimateView; fastener: FastenerInfo; gasket: GasketInfo }
  | { ok: false; problems: string[]; fastener: FastenerInfo | null; gasket: GasketInfo | null };

/** Loads the plan's parts from this team's rows, builds the model input and runs the estimate. */
export async function estimatePlan(
  teamId: number,
  engine: EngineRow,
  plan: PlanRecord & { gasketId: number; fastenerId: number },
  units: UnitSystem = "metric",
): Promise<PlanEstimateResult> {
  const parts = await planParts(teamId, engine, plan);
  if (!parts) return { ok: false, problems: ["The plan's gasket, fastener or the engine's materials are missing from the library."], fastener: null, gasket: null };
  const parsed = parsePlan(assemblePlanInput(parts));
  if (!parsed.ok) {
    return { ok: false, problems: parsed.errors.map((e) => e.message), fastener: parts.fastenerInfo, gasket: parts.gasketInfo };
  }
  return { ok: true, view: estimateView(parsed.plan, displayWording(units)), fastener: parts.fastenerInfo, gasket: parts.gasketInfo };
}
