import { PlanInputSchema } from "~/lib/clamp";
import { UNIT_SYSTEMS, type UnitSystem } from "~/lib/units";
import { estimateInput } from "~/models/plan-estimate.server";
import { requireApiMember } from "~/utils/auth.server";
import { clientAddress } from "~/utils/client-address.server";
import { readJsonBody } from "~/utils/json-body.server";
import { takeAll, tooManyHeaders, waitWords } from "~/utils/rate-limit.server";
import type { Route } from "./+types/estimate";

// POST /api/v1/estimate  { input: PlanInput (SI), units?: "metric" | "imperial" } → the estimate, sweep and
// uncertainty. Figures are SI; `units` only sets how the sentences (warnings, squeeze point) read.
// Session-authorized; validated with the clamp model's own schema; computes only, stores nothing.
export async function action({ request, context }: Route.ActionArgs) {
  if (request.method !== "POST") return Response.json({ error: "Use POST." }, { status: 405 });
  const address = clientAddress(context);
  const beforeSignIn = await takeAll([["apiAddress", address]]);
  if (beforeSignIn > 0) return tooMany(beforeSignIn);
  const { user } = await requireApiMember(request);
  const wait = await takeAll([["apiUser", String(user.id)]]);
  if (wait > 0) return tooMany(wait);
  const body = (await readJsonBody(request)) as { input?: unknown; units?: unknown } | null;
  if (!body || typeof body !== "object" || Array.isArray(body) || !body.input || typeof body.input !== "object") {
    return Response.json({ error: 'Send a JSON object { "input": { …the plan in SI… } }; see docs/clamp-model.md for its fields.' }, { status: 400 });
  }
  // The engine part first: the plan's cross-field checks loop over its cylinder count, so they only
  // ever see a count that passed its own check (a count of 10⁹ once exhausted the heap).
  const engine = PlanInputSchema.shape.engine.safeParse((body.input as { engine?: unknown }).engine);
  if (!engine.success) {
    const errors = engine.error.issues.map((i) => ({ path: ["engine", ...i.path].join("."), message: i.message }));
    return Response.json({ error: "The plan has problems; nothing was estimated.", errors }, { status: 400 });
  }
  const parsed = PlanInputSchema.safeParse(body.input);
  if (!parsed.success) {
    const errors = parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
    return Response.json({ error: "The plan has problems; nothing was estimated.", errors }, { status: 400 });
  }
  // the sentences read in the units asked for, else in the signed-in person's own
  const units: UnitSystem = UNIT_SYSTEMS.find((u) => u === body.units) ?? user.units;
  return Response.json(estimateInput(parsed.data, units));
}

function tooMany(waitMs: number) {
  return Response.json({ error: `Too many estimates at once; try again in ${waitWords(waitMs)}.` }, { status: 429, headers: tooManyHeaders(waitMs) });
}

export function loader() {
  return Response.json({ error: "Use POST with a JSON body { input: … }." }, { status: 405 });
}
