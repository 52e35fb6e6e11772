import { EstimateRequestSchema } from "~/lib/api/schemas";
import { estimateInput } from "~/models/plan-estimate.server";
import { apiBody, apiCaller, wrongMethod } from "~/utils/api.server";
import { planEnginePrecheck } from "~/utils/api-plan.server";
import type { Route } from "./+types/estimate";

// POST /api/v1/estimate  { input: PlanInput (SI), units?: "metric" | "imperial" } → the estimate, sweep and
// uncertainty. Figures are SI; `units` only sets how the sentences (warnings, squeeze point) read.
// The plan editor posts here as the builder types (cookie); scripts post with a token. Computes only.
export async function action({ request, context }: Route.ActionArgs) {
  if (request.method !== "POST") return wrongMethod("POST");
  await apiCaller(request, context);
  const body = await apiBody(request, EstimateRequestSchema, planEnginePrecheck);
  return Response.json(estimateInput(body.input, body.units ?? "metric"));
}

export function loader(_args: Route.LoaderArgs) {
  return wrongMethod("POST");
}
