import { engineById, engineForApi } from "~/models/api-v1.server";
import { apiCaller, apiRead, notFound } from "~/utils/api.server";
import { parseId } from "~/utils/ids";
import type { Route } from "./+types/engine";

// GET /api/v1/engines/:engineId → the engine record (SI). Another team's engine is not found.
export async function loader({ request, context, params }: Route.LoaderArgs) {
  const caller = await apiCaller(request, context);
  const id = parseId(params.engineId);
  const engine = id === null ? null : await engineById(caller, id);
  if (!engine) throw notFound("No such engine in this shop.");
  return apiRead(request, engineForApi(engine));
}
