import type { z } from "zod";
import type { EngineListSchema, EngineSchema, PlanSchema, PlanWithEstimateSchema } from "~/lib/api/schemas";
import type { UnitSystem } from "~/lib/units";
import type { Asker } from "./viewer-scope.server";
import { getEngine, listEngines, type EngineRow, type EngineStatus } from "./engine.server";
import { checkedPlanInput, estimatePlan } from "./plan-estimate.server";
import { listPlans, type PlanRow } from "./plan.server";

// The API's reads, through the same team-scoped model functions the pages use (so any scoping they
// gain applies here too), shaped as app/lib/api/schemas.ts documents them.

type Engine = z.output<typeof EngineSchema>;
type Plan = z.output<typeof PlanSchema>;

export async function engineListForApi(
  who: Asker,
  query: { page: number; limit: number; q?: string; status?: EngineStatus },
): Promise<z.output<typeof EngineListSchema>> {
  const { rows, total } = await listEngines(who, {
    page: query.page,
    pageSize: query.limit,
    q: query.q,
    status: query.status,
    sort: "updated",
    dir: "desc",
  });
  return { items: rows, page: query.page, limit: query.limit, total, nextPage: query.page * query.limit < total ? query.page + 1 : null };
}

export function engineForApi(e: EngineRow): Engine {
  const { teamId: _team, ...rest } = e;
  return rest;
}

export async function engineById(who: Asker, engineId: number): Promise<EngineRow | null> {
  return getEngine(who, engineId);
}

function planForApi(p: PlanRow, engine: EngineRow): Plan {
  return { ...p, chosen: engine.chosenPlanId === p.id };
}

export async function planListForApi(teamId: number, engine: EngineRow, page: number, limit: number) {
  // an engine has a handful of plans: one query, paged here
  const all = await listPlans(teamId, engine.id);
  const items = all.slice((page - 1) * limit, page * limit).map((p) => planForApi(p, engine));
  return { items, page, limit, total: all.length, nextPage: page * limit < all.length ? page + 1 : null };
}

export async function planWithEstimateForApi(
  teamId: number,
  engine: EngineRow,
  planId: number,
  units: UnitSystem,
): Promise<z.output<typeof PlanWithEstimateSchema> | null> {
  const plan = (await listPlans(teamId, engine.id)).find((p) => p.id === planId);
  if (!plan) return null;
  const [result, input] = await Promise.all([estimatePlan(teamId, engine, plan, { units }), checkedPlanInput(teamId, engine, plan, units)]);
  return {
    plan: planForApi(plan, engine),
    input: input.ok ? (input.plan as unknown as Record<string, unknown>) : null,
    estimate: result.ok ? (result.view as unknown as z.output<typeof PlanWithEstimateSchema>["estimate"]) : null,
    problems: result.ok ? [] : result.problems,
  };
}
