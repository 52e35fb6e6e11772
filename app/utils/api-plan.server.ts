import { PlanInputSchema } from "~/lib/clamp";
import { apiError, apiFieldErrors } from "./api.server";

/**
 * The plan's engine part first: the plan's cross-field checks loop over its cylinder count, so they only
 * ever see a count that passed its own check (a count of 10⁹ once exhausted the heap). Null when it passes.
 */
export function planEnginePrecheck(body: unknown): Response | null {
  const input = (body as { input?: unknown }).input;
  if (!input || typeof input !== "object" || Array.isArray(input)) {
    return apiError(400, "The request has problems; nothing was done.", {
      errors: [{ path: "input", message: "Send the plan as an object (docs/clamp-model.md#inputs)" }],
    });
  }
  const engine = PlanInputSchema.shape.engine.safeParse((input as { engine?: unknown }).engine);
  if (engine.success) return null;
  return apiError(400, "The request has problems; nothing was done.", { errors: apiFieldErrors(engine.error, ["input", "engine"]) });
}
