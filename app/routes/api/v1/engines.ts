import { EngineListQuerySchema } from "~/lib/api/schemas";
import { engineListForApi } from "~/models/api-v1.server";
import { apiCaller, apiQuery, apiRead } from "~/utils/api.server";
import type { Route } from "./+types/engines";

// GET /api/v1/engines?page&limit&q&status → one page of the caller's team's engines, newest change first.
export async function loader({ request, context }: Route.LoaderArgs) {
  const caller = await apiCaller(request, context);
  const query = apiQuery(request, EngineListQuerySchema);
  return apiRead(request, await engineListForApi(caller, query));
}
