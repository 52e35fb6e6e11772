import { compressionRatio, chamberProblems, type CompressionResult } from "~/lib/chamber";
import { chamberInput } from "~/lib/plan/assemble";
import type { EstimateView } from "~/lib/plan/estimate-view";
import type { UnitSystem } from "~/lib/units";
import type { EngineRow } from "./engine.server";
import { materialNames } from "./engine.server";
import { estimatePlan } from "./plan-estimate.server";
import { requirePlan, type FastenerInfo, type GasketInfo, type PlanRow } from "./plan.server";

// Everything the build sheet shows for an engine's chosen plan, gathered once for the page and the
// e-mail: the plan, its parts, the estimate (the same service the editor uses) and the chamber figures.

export type BuildSheet =
  | { ok: false; reason: string }
  | {
      ok: true;
      plan: PlanRow;
      fastener: FastenerInfo;
      gasket: GasketInfo;
      view: EstimateView;
      chamber: CompressionResult | null;
      materials: { block: string; head: string };
    };

/** The engine must already be one the asker may see (requireEngine). */
export async function buildSheet(teamId: number, engine: EngineRow, units: UnitSystem): Promise<BuildSheet> {
  if (engine.chosenPlanId === null) return { ok: false, reason: "No seal plan is chosen for this engine yet." };
  const plan = await requirePlan(teamId, engine.id, String(engine.chosenPlanId)).catch(() => null);
  if (!plan) return { ok: false, reason: "The chosen seal plan is no longer there; choose another." };
  const estimate = await estimatePlan(teamId, engine, plan, { units });
  if (!estimate.ok) return { ok: false, reason: `The chosen plan cannot be estimated: ${estimate.problems.join(" ")}` };
  const input = chamberInput(engine, estimate.gasket);
  const chamber = input && chamberProblems(input).length === 0 ? compressionRatio(input) : null;
  const names = await materialNames(teamId, [engine.blockMaterialId, engine.headMaterialId]);
  return {
    ok: true,
    plan,
    fastener: estimate.fastener,
    gasket: estimate.gasket,
    view: estimate.view,
    chamber,
    materials: { block: names[engine.blockMaterialId] ?? "—", head: names[engine.headMaterialId] ?? "—" },
  };
}
