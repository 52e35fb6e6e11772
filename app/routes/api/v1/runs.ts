import { RunCreateSchema, RunListQuerySchema } from "~/lib/api/schemas";
import { createRunForApi, listRunsForApi } from "~/models/run-api.server";
import { apiBody, apiCaller, apiError, apiQuery, apiRead, requireApiRole, wrongMethod } from "~/utils/api.server";
import type { Route } from "./+types/runs";

// GET /api/v1/runs?engineId&kind&outcome&from&to&cursor&limit → the team's run log, newest first.
// POST /api/v1/runs (builder or owner) logs one run.

export async function loader({ request, context }: Route.LoaderArgs) {
  const caller = await apiCaller(request, context);
  const query = apiQuery(request, RunListQuerySchema);
  const { cursor, ...rest } = query;
  const page = await listRunsForApi(caller, { ...rest, cursor: cursor === undefined ? undefined : Number(cursor) });
  return apiRead(request, { items: page.rows, limit: query.limit, nextCursor: page.nextCursor });
}

export async function action({ request, context }: Route.ActionArgs) {
  if (request.method !== "POST") return wrongMethod("GET, POST");
  const caller = await apiCaller(request, context);
  requireApiRole(caller, "builder");
  const run = await apiBody(request, RunCreateSchema);
  const created = await createRunForApi(caller, run);
  if (!created.ok) {
    const error = created.status === 404 ? "No such engine in this shop." : "The request has problems; nothing was done.";
    throw apiError(created.status, error, { errors: [{ path: created.path, message: created.message }] });
  }
  return Response.json(created.run, { status: 201, headers: { Location: `/api/v1/runs?engineId=${created.run.engineId}` } });
}
