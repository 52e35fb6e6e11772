import { describe, expect, it } from "vitest";
import { decimalPoint, splitList } from "../../../../app/lib/units/decimal-comma";
import { parsePlanForm, planFormSchema } from "../../../../app/lib/plan/form";
import { METHOD_LABEL, planFormValues, readSuggestedFigures, startingPlan } from "../../../../app/lib/plan/form-fields";
import { figuresFingerprint } from "../../../../app/lib/plan/fastener-figures";
import { LBF_FT_TO_NM, relErr } from "../nist";

const FORM = {
  name: "Plan",
  gasketId: "1",
  fastenerId: "1",
  lubricant: "Moly paste",
  threadFriction: "0.12",
  bearingFriction: "0.12",
  method: "torque-estimated-friction",
  torque: "150",
  stages: "60, 110, 150",
  wireLocation: "none",
  wireProjection: "0",
  receiverGrooveDepth: "0",
  sleeveProtrusion: "",
  targetStretch: "",
  targetMargin: "1.5",
  notes: "",
};

function ok(form: Record<string, string>, system: "metric" | "imperial" = "metric") {
  const r = parsePlanForm(form, system);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.plan;
}

describe("decimal commas (the rule in app/lib/units/decimal-comma.ts)", () => {
  it("reads a single comma as the decimal mark, but three digits after a leading group as thousands", () => {
    expect(decimalPoint("1,5")).toBe("1.5");
    expect(decimalPoint("0,125 mm")).toBe("0.125 mm");
    expect(decimalPoint("-0,05")).toBe("-0.05");
    expect(decimalPoint("1,250")).toBe("1,250");
    expect(decimalPoint("1.250,5")).toBe("1250.5");
    expect(decimalPoint("1,250.5")).toBe("1,250.5");
  });
  it("splits lists on semicolons when there are any, else on commas", () => {
    expect(splitList("54,2; 108,5; 156")).toEqual(["54,2", "108,5", "156"]);
    expect(splitList("40, 80,115")).toEqual(["40", "80", "115"]);
  });
  it("the plan form takes decimal commas in friction, margin, lengths and stages", () => {
    const plan = ok({
      ...FORM,
      threadFriction: "0,11",
      bearingFriction: "0,13",
      targetMargin: "1,25",
      torque: "156",
      stages: "54,5; 108; 156",
      wireLocation: "block",
      wireProjection: "0,1",
    });
    expect(plan.threadFriction).toBe(0.11);
    expect(plan.bearingFriction).toBe(0.13);
    expect(plan.targetMargin).toBe(1.25);
    expect(plan.stagesNm).toEqual([54.5, 108, 156]);
    expect(plan.wireProjectionMm).toBeCloseTo(0.1, 12);
  });
});

describe("stages go with the torque's unit", () => {
  it("bare stages are read in the unit typed with the final torque", () => {
    const plan = ok({ ...FORM, torque: "115 lbf·ft", stages: "40, 80, 115" });
    expect(relErr(plan.torqueNm, 115 * LBF_FT_TO_NM)).toBeLessThan(1e-6);
    expect(relErr(plan.stagesNm[0]!, 40 * LBF_FT_TO_NM)).toBeLessThan(1e-6);
    expect(plan.stagesNm[2]).toBe(plan.torqueNm);
  });
  it("a unit written in the list covers its bare stages, and 'then' is allowed", () => {
    const plan = ok({ ...FORM, torque: "156", stages: "40, 80, then 115 lbf·ft" });
    expect(relErr(plan.stagesNm[1]!, 80 * LBF_FT_TO_NM)).toBeLessThan(1e-6);
    expect(plan.stagesNm[2]).toBe(156);
  });
  it("without the unit, 40, 80, 115 under a 156 N·m torque is refused", () => {
    const r = parsePlanForm({ ...FORM, torque: "156", stages: "40, 80, 115" }, "metric");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.stages).toBe("The last stage must equal the final torque");
  });
});

describe("target stretch", () => {
  it("is kept only with the stretch-gauge method, in the person's units", () => {
    expect(ok({ ...FORM, targetStretch: "0.18" }).targetStretchMm).toBeNull();
    expect(ok({ ...FORM, method: "stretch-measured", targetStretch: "0,18" }).targetStretchMm).toBeCloseTo(0.18, 12);
    expect(ok({ ...FORM, method: "stretch-measured", targetStretch: "7" }, "imperial").targetStretchMm).toBeCloseTo(0.1778, 7);
    expect(ok({ ...FORM, method: "stretch-measured", targetStretch: "" }).targetStretchMm).toBeNull();
  });
  it("refuses a stretch out of range", () => {
    const r = parsePlanForm({ ...FORM, method: "stretch-measured", targetStretch: "5" }, "metric");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.targetStretch).toMatch(/^Target stretch must be between 0\.01 mm and 2\.00 mm/);
  });
  it("round-trips through the form values, with the marker of the figures shown", () => {
    const plan = ok({ ...FORM, method: "stretch-measured", targetStretch: "0.178" });
    const values = planFormValues(plan, "metric");
    expect(values.targetStretch).toBe("0.178");
    expect(values.figuresFastenerId).toBe("1");
    expect(values.figuresSeen).toBe(figuresFingerprint(values));
  });
});

describe("words on the plan form", () => {
  it("names the tightening methods as a builder does, keeping the stored values", () => {
    expect(METHOD_LABEL).toEqual({
      "torque-estimated-friction": "Torque wrench",
      "torque-tested-friction": "Torque wrench, lube tested on these studs",
      "angle-or-yield": "Torque, then angle",
      "stretch-measured": "Stretch gauge",
    });
  });
  it("says washer-face friction, not bearing friction, in its messages", () => {
    const r = parsePlanForm({ ...FORM, bearingFriction: "x" }, "metric");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.bearingFriction).toBe("Washer-face friction is a number like 0.12");
  });
});

describe("gaskets by bore", () => {
  it("the ones whose bore suits the engine first (closest first), the others apart", async () => {
    const { gasketsByFit } = await import("../../../../app/lib/plan/assemble");
    const gaskets = [
      { id: 1, boreMm: 107 },
      { id: 2, boreMm: 88 },
      { id: 3, boreMm: 87 },
      { id: 4, boreMm: 85 },
      { id: 5, boreMm: 92.5 },
    ];
    const { fitting, others } = gasketsByFit(gaskets, 86);
    // common practice: not smaller than the bore, at most 6 mm over it
    expect(fitting.map((g) => g.id)).toEqual([3, 2]);
    expect(others.map((g) => g.id)).toEqual([1, 4, 5]);
  });
});

describe("a new plan with nothing to start from, and a suggestion's posted figures", () => {
  it("copper gaskets start with a block wire ring 0.1 mm proud (common practice); others with none", () => {
    const copper = startingPlan(undefined, { id: 7, type: "solid-copper" }, "metric");
    expect(copper).toMatchObject({
      gasketId: 7,
      wireLocation: "block",
      wireProjectionMm: 0.1,
      targetMargin: 1.5,
      method: "torque-estimated-friction",
    });
    const mls = startingPlan(undefined, { id: 8, type: "mls" }, "metric");
    expect(mls).toMatchObject({ wireLocation: "none", wireProjectionMm: 0, sleeveProtrusionMm: null, targetStretchMm: null });
    expect(startingPlan(undefined, undefined, "metric").gasketId).toBe(0);
  });
  it("reads the suggested torque and protrusion inside the form's ranges", () => {
    expect(readSuggestedFigures({ torqueNm: "150", protrusionMm: "" }, 0.05)).toEqual({ ok: true, torqueNm: 150, protrusionMm: 0.05 });
    expect(readSuggestedFigures({ torqueNm: "150", protrusionMm: "0.1" }, null)).toEqual({ ok: true, torqueNm: 150, protrusionMm: 0.1 });
    for (const bad of [{ torqueNm: "0" }, { torqueNm: "5001" }, { torqueNm: "x" }, { torqueNm: "100", protrusionMm: "1.5" }])
      expect(readSuggestedFigures(bad, null).ok, JSON.stringify(bad)).toBe(false);
  });
});

describe("the last stage against the final torque (0.5 % or 0.5 N·m, whichever is more)", () => {
  const stagesError = (torque: string, stages: string) => {
    const r = parsePlanForm({ ...FORM, torque, stages }, "metric");
    return r.ok ? null : (r.errors.stages ?? null);
  };
  it("200 N·m allows 1 N·m of rounding: 201 is taken (and set to 200), 201.5 is refused", () => {
    expect(ok({ ...FORM, torque: "200", stages: "100, 150, 201" }).stagesNm).toEqual([100, 150, 200]);
    expect(ok({ ...FORM, torque: "200", stages: "100, 150, 199.1" }).stagesNm).toEqual([100, 150, 200]);
    expect(stagesError("200", "100, 150, 201.5")).toBe("The last stage must equal the final torque");
    expect(stagesError("200", "100, 150, 198.8")).toBe("The last stage must equal the final torque");
  });
  it("under 100 N·m the floor of 0.5 N·m holds: 50.4 is taken at 50, 50.6 is refused", () => {
    expect(ok({ ...FORM, torque: "50", stages: "20, 35, 50.4" }).stagesNm).toEqual([20, 35, 50]);
    expect(stagesError("50", "20, 35, 50.6")).toBe("The last stage must equal the final torque");
  });
  it("stages that do not rise are refused before the last one is compared", () => {
    expect(stagesError("150", "60, 60, 150")).toBe("Stages must rise, ending at the final torque");
  });
});

describe("the plan form's schema (what Conform parses with)", () => {
  // Conform hands the schema a blank field as missing: the same as typed blank
  const posted = (over: Record<string, string | undefined> = {}) => {
    const form: Record<string, string | undefined> = { ...FORM, ...over };
    for (const [k, v] of Object.entries(form)) if (v === "") delete form[k];
    return form;
  };
  const issues = (form: Record<string, unknown>, system: "metric" | "imperial" = "metric") => {
    const r = planFormSchema(system).safeParse(form);
    return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
  };

  it("gives the same SI plan as the plain function, blank fields left out", () => {
    const r = planFormSchema("metric").safeParse(
      posted({ torque: "156", stages: "54,5; 108; 156", wireLocation: "block", wireProjection: "0,1" }),
    );
    expect(r.success).toBe(true);
    expect(r.data).toEqual(ok({ ...FORM, torque: "156", stages: "54,5; 108; 156", wireLocation: "block", wireProjection: "0,1" }));
    expect(r.data!.stagesNm).toEqual([54.5, 108, 156]);
    expect(r.data!.sleeveProtrusionMm).toBeNull();
  });

  it("files each message under the field the builder sees, one per field, the cross-field rules too", () => {
    expect(
      issues(
        posted({
          name: "",
          gasketId: "",
          threadFriction: "0,9",
          torque: "150",
          stages: "60, 110, 140",
          wireLocation: "block",
          wireProjection: "0.1",
          receiverGrooveDepth: "0.15",
        }),
      ),
    ).toEqual([
      { path: "name", message: "Name the plan" },
      { path: "gasketId", message: "Pick a gasket" },
      { path: "threadFriction", message: "Thread friction must be at most 0.6" },
      { path: "stages", message: "The last stage must equal the final torque" },
      { path: "receiverGrooveDepth", message: "A receiver groove deeper than the wire stands proud leaves the wire unloaded" },
    ]);
  });

  it("speaks the imperial builder's units in its range messages", () => {
    const [torque] = issues(posted({ torque: "0.5", stages: "" }), "imperial");
    // 1 N·m = 0.74 lbf·ft (shown at a whole lbf·ft) and 5000 N·m = 3688 lbf·ft (NIST SP 811: 1 lbf·ft = 1.3558179 N·m)
    expect(torque).toEqual({ path: "torque", message: "Torque must be between 1 lbf·ft and 3,688 lbf·ft" });
    // 90 thou = 2.286 mm, over the 2 mm a wire may stand proud (78.7 thou)
    const [wire] = issues(posted({ wireLocation: "block", wireProjection: "90" }), "imperial");
    expect(wire).toEqual({ path: "wireProjection", message: "Wire projection must be between 0.0 thou and 78.7 thou" });
  });

  it("parsePlanForm is the schema's first message per field", () => {
    const form = { ...FORM, torque: "x", bearingFriction: "x" };
    const r = parsePlanForm(form, "metric");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors).toEqual(Object.fromEntries(issues(form).map((i) => [i.path, i.message])));
  });
});
