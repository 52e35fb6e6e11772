import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { PlanInputSchema, prepare } from "../../../../app/lib/clamp";
import { boreSealMargin } from "../../../../app/lib/clamp/cylinders";
import { scatterBore, scatterSealMargin } from "../../../../app/lib/clamp/scatter-bore";
import { rawPlan } from "./arbitraries";
import { v8Raw, workedExampleRaw } from "./fixtures";

// The scatter run's closed-form bore against leanBore (the evaluation's solve) on the same clamps:
// cold and hot clamps from 0 to well past every path's limit, heat adding and taking clamp.
describe("scatter run's bore solve", () => {
  const plans = [
    PlanInputSchema.parse(v8Raw()),
    PlanInputSchema.parse(workedExampleRaw()),
    ...fc
      .sample(rawPlan, { numRuns: 80, seed: 25 })
      .map((r) => PlanInputSchema.safeParse(r))
      .flatMap((r) => (r.success ? [r.data] : [])),
  ];

  it("gives leanBore's seal margin to rounding on fixtures and generated plans", () => {
    expect(plans.length).toBeGreaterThan(40);
    let compared = 0;
    for (const plan of plans) {
      const p = prepare(plan);
      const b = scatterBore(p);
      const top = Math.max(...p.paths.elements.map((e) => (Number.isFinite(e.limitN) ? e.limitN : 0)), p.requirement.seatingLoadN) * 3;
      for (let i = 0; i <= 24; i++) {
        const cold = (top * i) / 24;
        for (const heat of [0.7, 0.95, 1, 1.08, 1.3]) {
          const hot = cold * heat;
          const want = boreSealMargin(p, cold, hot);
          const got = scatterSealMargin(b, cold, hot);
          expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(want)));
          compared++;
        }
      }
    }
    expect(compared).toBeGreaterThan(5000);
  });
});
