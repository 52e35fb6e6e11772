// The suggestion (app/lib/clamp/suggest.ts): the smallest torque that reaches the target margin under
// the ceiling, or what has to change.
import { describe, expect, it } from "vitest";
import { evaluatePlan, type PlanInput } from "../../../../app/lib/clamp";
import { suggest } from "../../../../app/lib/clamp/suggest";
import { workedExample } from "./fixtures";

const atTorque = (p: PlanInput, torqueNm: number): PlanInput => ({
  ...p,
  tightening: { ...p.tightening, target: { mode: "torque", torqueNm } },
});
// the worked example with a softer gasket body, at a given peak pressure: a target of 1.2 is reachable
const softBody = (peakPressureMpa: number): PlanInput => {
  const p = workedExample();
  return { ...p, firing: { mode: "entered", peakPressureMpa }, gasket: { ...p.gasket, bodyModulusMpa: 1000 } };
};

describe("suggest, reachable", () => {
  const plan = softBody(4);
  const s = suggest(plan, { targetMargin: 1.2 });
  it("finds a torque under the ceiling whose weakest margin is the target; 1 % less falls short", () => {
    expect(s.reachable).toBe(true);
    const T = s.torqueNm!;
    expect(T).toBeGreaterThan(50);
    expect(T).toBeLessThan(s.limit.torqueNm);
    expect(Math.abs(evaluatePlan(atTorque(plan, T)).weakestMargin - 1.2)).toBeLessThan(1e-3);
    expect(evaluatePlan(atTorque(plan, T * 0.99)).weakestMargin).toBeLessThan(1.2);
    expect(s.changes).toEqual([]);
    expect(s.summary).toMatch(
      /^\d+ N·m gives a seal margin of 1\.20 on the weakest cylinder at the bottom of the scatter band, below the torque ceiling \(\d+ N·m, .+\)\.$/,
    );
  });
  it("more firing pressure asks for more torque; a higher target too (trends)", () => {
    const harder = suggest(softBody(8), { targetMargin: 1.2 });
    expect(harder.reachable).toBe(true);
    expect(harder.torqueNm!).toBeGreaterThan(s.torqueNm!);
    const higher = suggest(plan, { targetMargin: 1.4 });
    expect(higher.reachable).toBe(true);
    expect(higher.torqueNm!).toBeGreaterThan(s.torqueNm!);
  });
  it("without a sleeve there is no protrusion to suggest", () => {
    expect(plan.sleeve.kind).toBe("none");
    expect(s.protrusion).toBeNull();
  });
});

describe("suggest, out of reach", () => {
  it("a target no torque reaches under the ceiling: no torque, the changes, and the margin at the ceiling", () => {
    const plan = workedExample();
    const s = suggest(plan, { targetMargin: 50 });
    expect(s.reachable).toBe(false);
    expect(s.torqueNm).toBeNull();
    expect(s.changes.length).toBeGreaterThan(0);
    expect(s.marginAtLimit).toBeCloseTo(evaluatePlan(atTorque(plan, s.limit.torqueNm)).weakestMargin, 6);
    expect(s.summary).toBe(
      `No torque reaches a seal margin of 50.00 below the ceiling: at ${s.limit.torqueNm.toFixed(0)} N·m, ${
        {
          "stud-assembly": "stud while tightened",
          "stud-working": "stud hot and fired",
          bearing: "washer bearing on the head",
          "thread-strip": "thread in the block",
          crush: "seal-line crush",
        }[s.limit.cause]
      } the weakest cylinder has ${s.marginAtLimit.toFixed(2)}.`,
    );
  });
  it("a stiff gasket body that cannot seal coolant says so first", () => {
    const p = workedExample();
    const s = suggest({ ...p, gasket: { ...p.gasket, bodyModulusMpa: 20_000 } }, { targetMargin: 1.2 });
    expect(s.reachable).toBe(false);
    expect(s.changes.join(" ")).toMatch(/seal|clamp/);
  });
});
