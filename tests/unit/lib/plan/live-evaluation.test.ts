// The editor's in-browser evaluation (app/lib/plan/live-evaluation.ts).
import { describe, expect, it } from "vitest";
import { estimateView } from "../../../../app/lib/plan/estimate-view";
import { validPlanInput, withEvaluation } from "../../../../app/lib/plan/live-evaluation";
import { workedExample, workedExampleRaw } from "../clamp/fixtures";

describe("validPlanInput", () => {
  it("the model's input where the schema takes it, null where it refuses", () => {
    expect(validPlanInput(workedExampleRaw())).not.toBeNull();
    const raw = workedExampleRaw();
    expect(validPlanInput({ ...raw, engine: { ...raw.engine, boreMm: -1 } })).toBeNull();
  });
});

describe("withEvaluation", () => {
  const plan = workedExample();
  const slow = estimateView(plan);
  it("takes the new figures now and keeps the earlier sweep and scatter run", () => {
    const next = { ...plan, tightening: { ...plan.tightening, target: { mode: "torque" as const, torqueNm: 200 } } };
    const v = withEvaluation(slow, next, "metric");
    expect(v.torqueNm).toBe(200);
    expect(v.estimate.tightening.torqueNm).toBe(200);
    expect(v.ceiling).toBe(v.estimate.ceiling);
    expect(v.sweep).toBe(slow.sweep);
    expect(v.probabilityMarginBelowOne).toBe(slow.probabilityMarginBelowOne);
  });
  it("the sentences read in the person's units", () => {
    const v = withEvaluation(slow, plan, "imperial");
    expect(v.estimate.warnings.join(" ")).not.toMatch(/\d N·m\b/);
    expect(v.estimate.warnings.join(" ")).toMatch(/lbf|psi|ksi|thou|in\b/);
  });
});
