// The clamp model's public API (app/lib/clamp/index.ts): the pages import it, so each name must be the
// module's own function, not a copy.
import { describe, expect, it } from "vitest";
import * as clamp from "../../../../app/lib/clamp";
import { evaluatePlan } from "../../../../app/lib/clamp/evaluate";
import { prepare } from "../../../../app/lib/clamp/model";
import { PlanInputSchema } from "../../../../app/lib/clamp/schema";
import { rankChecks } from "../../../../app/lib/clamp/limits";
import { threadGeometry } from "../../../../app/lib/clamp/thread";
import { torqueForPreload } from "../../../../app/lib/clamp/torque";
import { CEILING_WORDS } from "../../../../app/lib/clamp/ceiling";
import { workedExampleRaw } from "./fixtures";

describe("clamp index", () => {
  it("re-exports the modules' own functions and tables", () => {
    expect(clamp.evaluatePlan).toBe(evaluatePlan);
    expect(clamp.prepare).toBe(prepare);
    expect(clamp.PlanInputSchema).toBe(PlanInputSchema);
    expect(clamp.rankChecks).toBe(rankChecks);
    expect(clamp.threadGeometry).toBe(threadGeometry);
    expect(clamp.torqueForPreload).toBe(torqueForPreload);
    expect(clamp.CEILING_WORDS).toBe(CEILING_WORDS);
  });
  it("the public API is enough to run a plan end to end", () => {
    const e = clamp.evaluatePlan(clamp.PlanInputSchema.parse(workedExampleRaw()));
    expect(e.verdict.status).toMatch(/^(holds|thin|short)$/);
  });
});
