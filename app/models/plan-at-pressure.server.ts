import { evaluatePlan, parsePlan, prepare, type PlanEstimate, type Prepared } from "~/lib/clamp";
import { assemblePlanInput } from "~/lib/plan/assemble";
import type { EngineRow } from "./engine.server";
import { planParts, type FastenerInfo, type GasketInfo, type PlanRow } from "./plan.server";

// The clamp model run for a stored plan with the firing the shop logged instead of the engine's target:
// a measured peak cylinder pressure, or the manifold pressure the model turns into one. The records pages
// and the evidence view use it, so every margin they show comes from the clamp core at that pressure.

export interface Firing {
  peakMpa?: number | null;
  manifoldKpa?: number | null;
}

export type PlanAtPressure =
  { ok: true; estimate: PlanEstimate; prepared: Prepared; fastener: FastenerInfo; gasket: GasketInfo } | { ok: false; problems: string[] };

export async function evaluateAtFiring(teamId: number, engine: EngineRow, plan: PlanRow, firing: Firing = {}): Promise<PlanAtPressure> {
  // A measured peak goes in as entered; without one, the manifold pressure is the model's estimate input.
  const fired: EngineRow =
    firing.peakMpa && firing.peakMpa > 0
      ? { ...engine, peakPressureMpa: firing.peakMpa }
      : firing.manifoldKpa && firing.manifoldKpa > 0
        ? { ...engine, peakPressureMpa: null, targetManifoldKpa: firing.manifoldKpa }
        : engine;
  const parts = await planParts(teamId, fired, plan);
  if (!parts) return { ok: false, problems: ["The plan's gasket, fastener or the engine's materials are missing from the library."] };
  const parsed = parsePlan(assemblePlanInput(parts));
  if (!parsed.ok) return { ok: false, problems: parsed.errors.map((e) => e.message) };
  return {
    ok: true,
    estimate: evaluatePlan(parsed.plan),
    prepared: prepare(parsed.plan),
    fastener: parts.fastenerInfo,
    gasket: parts.gasketInfo,
  };
}
