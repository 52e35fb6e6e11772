import { PlanReadQuerySchema } from "~/lib/api/schemas";
import { engineById, planWithEstimateForApi } from "~/models/api-v1.server";
import { apiCaller, apiQuery, apiRead, notFound } from "~/utils/api.server";
import { parseId } from "~/utils/ids";
import type { Route } from "./+types/plan";

// GET /api/v1/engines/:engineId/plans/:planId?units → the plan, its clamp-model input and its estimate.
export async function loader({ request, context, params }: Route.LoaderArgs) {
  const caller = await apiCaller(request, context);
  const query = apiQuery(request, PlanReadQuerySchema);
  const engineId = parseId(params.engineId);
  const planId = parseId(params.planId);
  const engine = engineId === null ? null : await engineById(caller, engineId);
  const answer = engine && planId !== null ? await planWithEstimateForApi(caller.teamId, engine, planId, query.units ?? "metric") : null;
  if (!answer) throw notFound("No such seal plan on this engine.");
  return apiRead(request, answer);
}
