import { PlanInputSchema } from "~/lib/clamp";
import { estimateView } from "~/lib/plan/estimate-view";
import { requireApiMember } from "~/utils/auth.server";
import { readJsonBody } from "~/utils/json-body.server";

// POST /api/v1/estimate  { input: PlanInput (SI) } → the estimate, sweep and uncertainty.
// Session-authorized; validated with the clamp model's own schema; computes only, stores nothing.
export async function action({ request }: { request: Request }) {
  if (request.method !== "POST") return Response.json({ error: "Use POST." }, { status: 405 });
  await requireApiMember(request);
  const body = (await readJsonBody(request)) as { input?: unknown } | null;
  const parsed = PlanInputSchema.safeParse(body && typeof body === "object" ? body.input : undefined);
  if (!parsed.success) {
    const errors = parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
    return Response.json({ error: "The plan has problems; nothing was estimated.", errors }, { status: 400 });
  }
  return Response.json(estimateView(parsed.data));
}

export function loader() {
  return Response.json({ error: "Use POST with a JSON body { input: … }." }, { status: 405 });
}
