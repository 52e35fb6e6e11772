// The builder's warnings (app/lib/clamp/warnings.ts): each failed check with the remedies that fit the
// plan, the squeeze sentence with its fired-share figure, and the assumptions the estimate rests on.
import { describe, expect, it } from "vitest";
import { evaluatePlan, PlanInputSchema, prepare, type PlanInput } from "../../../../app/lib/clamp";
import { planAssumptions, planWarnings, REMEDIES, remediesFor } from "../../../../app/lib/clamp/warnings";
import { v8Raw, workedExample } from "./fixtures";

const pctOf = (x: number) => `${Math.round(x * 100)} %`;

describe("the squeeze warning's fired-share figure", () => {
  // the V8 copper line at 2 MPa peak pressure: the line is at its limit and +10 % torque goes to the body
  const v8 = PlanInputSchema.parse(v8Raw());
  const low: PlanInput = { ...v8, firing: { mode: "entered", peakPressureMpa: 2 } };
  const p = prepare(low);
  const e = evaluatePlan(low);

  it("names the share of the added clamp that stays on the seal line under firing, in whole percent", () => {
    expect(e.squeeze.reason).toBe("line-at-limit");
    const line = planWarnings(p, e).find((s) => s.startsWith("More torque now mostly squeezes the head"));
    expect(line).toBeDefined();
    const figure = /puts only (\d+) % of the added clamp on it under firing/.exec(line!);
    expect(figure).not.toBeNull();
    // the figure is the model's gain share (under the threshold that raised the warning), not its complement
    expect(Math.abs(Number(figure![1]) - e.gain.share * 100)).toBeLessThanOrEqual(0.5);
    expect(`${figure![1]} %`).toBe(pctOf(e.gain.share));
    expect(e.gain.share).toBeLessThan(low.model.squeezeGainThreshold);
    expect(Number(figure![1])).toBeLessThanOrEqual(Math.round(low.model.squeezeGainThreshold * 100));
  });

  it("names the seal line's limit in kN (SI wording, one decimal)", () => {
    const line = planWarnings(p, e).find((s) => s.startsWith("More torque"))!;
    expect(line).toContain(`at its limit (${(e.seal.lineLimitN / 1000).toFixed(1)} kN)`);
  });

  it("is silent while +10 % torque still reaches the seal line (the V8 at its own firing pressure)", () => {
    const full = evaluatePlan(v8);
    expect(full.gain.share).toBeGreaterThan(0.5);
    expect(planWarnings(prepare(v8), full).some((s) => s.startsWith("More torque"))).toBe(false);
  });
});

describe("failed checks", () => {
  it("the worked example's short seal reads 'fails' with the seal remedies, in the order a builder tries them", () => {
    const plan = workedExample();
    const e = evaluatePlan(plan);
    const w = planWarnings(prepare(plan), e);
    const seal = w.find((s) => s.startsWith("Combustion seal"));
    expect(seal).toMatch(/fails: margin \d\.\d\d on cylinder \d/);
    expect(seal).toContain("Try more torque, up to the ceiling; ");
    expect(seal!.endsWith("; or more or larger studs around that bore.")).toBe(true);
  });
});

describe("remedies that fit the plan", () => {
  const plan = workedExample();
  const noWire: PlanInput = { ...plan, sealing: { ...plan.sealing, wireProjectionMm: 0, sleeveProtrusionMm: 0 } };
  it("without a sleeve or a wire, the seal's second remedy is a wire ring to add", () => {
    const r = remediesFor("seal", { ...noWire, sleeve: { ...noWire.sleeve, kind: "none" } });
    expect(r[1]).toBe("a wire ring standing proud of the gasket, so the seal line takes clamp before the body");
    expect(r).toHaveLength(REMEDIES.seal.length);
  });
  it("with nothing standing proud there is nothing to take away for the body seal", () => {
    const r = remediesFor("body-seal", { ...noWire, sleeve: { ...noWire.sleeve, kind: "none" } });
    expect(r).toHaveLength(REMEDIES["body-seal"].length - 1);
    expect(r.some((x) => x.startsWith("less"))).toBe(false);
  });
  it("with a wire standing proud, the remedies speak of the wire projection", () => {
    const wired: PlanInput = {
      ...plan,
      sleeve: { ...plan.sleeve, kind: "none" },
      sealing: { ...plan.sealing, wireProjectionMm: 0.1, receiverGrooveDepthMm: 0, sleeveProtrusionMm: 0 },
    };
    expect(remediesFor("seal", wired)[1]).toBe("more wire projection, so the seal line takes clamp before the body");
    expect(remediesFor("body-seal", wired)[0]).toBe("less wire projection, so the body keeps some clamp");
  });
  it("other checks keep their list as written", () => {
    expect(remediesFor("thread-strip", plan)).toEqual(REMEDIES["thread-strip"]);
  });
});

describe("short engagement (common practice: ≥ 2·d in aluminium, ≈ 1.25·d in iron or steel)", () => {
  const plan = workedExample();
  const at = (engagementMm: number, modulusMpa: number): string[] => {
    const q: PlanInput = { ...plan, fastener: { ...plan.fastener, engagementMm }, block: { ...plan.block, modulusMpa } };
    return planWarnings(prepare(q), evaluatePlan(q)).filter((s) => s.startsWith("Thread engagement"));
  };
  it("an aluminium block (E < 90 GPa) wants 2·d = 28 mm for the M14 stud: 27.9 warns, 28 does not", () => {
    expect(at(27.9, 72_000)).toEqual(["Thread engagement 27.900 mm is short of the shop rule for this block (28.000 mm)."]);
    expect(at(28, 72_000)).toEqual([]);
  });
  it("an iron block wants 1.25·d = 17.5 mm", () => {
    expect(at(17.4, 100_000)).toHaveLength(1);
    expect(at(17.5, 100_000)).toEqual([]);
  });
});

describe("assumptions", () => {
  it("says the nut face was taken as 1.45 × d when the library gives none and the washer stays put", () => {
    const plan = workedExample();
    const a = planAssumptions(prepare(plan));
    expect(plan.fastener.nutFaceOdMm).toBeUndefined();
    expect(plan.fastener.washerTurns).toBe(false);
    expect(a).toContain(
      "Washer-face friction acts on a nut face of 1.45 × the stud diameter; enter the nut's face diameter in the fastener library.",
    );
    const given = { ...plan, fastener: { ...plan.fastener, nutFaceOdMm: 21 } };
    expect(planAssumptions(prepare(given)).some((s) => s.includes("nut face of 1.45"))).toBe(false);
  });
});
