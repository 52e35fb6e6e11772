import { PageQuerySchema } from "~/lib/api/schemas";
import { engineById, planListForApi } from "~/models/api-v1.server";
import { apiCaller, apiQuery, apiRead, notFound } from "~/utils/api.server";
import { parseId } from "~/utils/ids";
import type { Route } from "./+types/plans";

// GET /api/v1/engines/:engineId/plans?page&limit → the engine's seal plans (not retired), oldest first.
export async function loader({ request, context, params }: Route.LoaderArgs) {
  const caller = await apiCaller(request, context);
  const query = apiQuery(request, PageQuerySchema);
  const id = parseId(params.engineId);
  const engine = id === null ? null : await engineById(caller, id);
  if (!engine) throw notFound("No such engine in this shop.");
  return apiRead(request, await planListForApi(caller.teamId, engine, query.page, query.limit));
}
