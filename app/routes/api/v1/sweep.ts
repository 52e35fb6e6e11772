import { SweepRequestSchema } from "~/lib/api/schemas";
import { torqueSweep } from "~/lib/clamp";
import { displayWording } from "~/lib/plan/wording";
import { apiBody, apiCaller, wrongMethod } from "~/utils/api.server";
import { planEnginePrecheck } from "~/utils/api-plan.server";
import type { Route } from "./+types/sweep";

// POST /api/v1/sweep  { input, fromNm, toNm, points?, units? } → the clamp model over that torque range:
// preload band, weakest seal margin, stud and washer use per point, and the torque ceiling. Stores nothing.
export async function action({ request, context }: Route.ActionArgs) {
  if (request.method !== "POST") return wrongMethod("POST");
  await apiCaller(request, context);
  const body = await apiBody(request, SweepRequestSchema, planEnginePrecheck);
  const { fromNm, toNm, points } = body;
  return Response.json(torqueSweep(body.input, { fromNm, toNm, points }, displayWording(body.units ?? "metric")));
}

export function loader(_args: Route.LoaderArgs) {
  return wrongMethod("POST");
}
