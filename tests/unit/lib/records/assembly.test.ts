// The assembly record's form and the preload each measured stretch implies (app/lib/records/assembly.ts).
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { impliedPreloads, parseAssemblyForm, type AssemblyFormContext } from "../../../../app/lib/records/assembly";
import { LBF_FT_TO_NM, relErr } from "../nist";

const ctx: AssemblyFormContext = { planIds: [7, 9], stagesNm: [60, 110, 150], studLabels: ["A1", "A2"], units: "metric" };
const FORM = {
  planId: "7",
  assembledOn: "2026-11-30",
  assembledBy: "R. Builder",
  lubricant: "Moly paste",
  measuredProtrusionMm: "",
  gasketCompressedMm: "",
  notes: "",
  "stage-0-reached": "60",
  "stage-1-reached": "110",
  "stage-2-reached": "151",
};

describe("parseAssemblyForm", () => {
  it("takes the stages done, and the final torque is the last stage reached (not the plan's target)", () => {
    const r = parseAssemblyForm(FORM, ctx);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.stagesDone).toEqual([
      { targetNm: 60, reachedNm: 60, angleDeg: null },
      { targetNm: 110, reachedNm: 110, angleDeg: null },
      { targetNm: 150, reachedNm: 151, angleDeg: null },
    ]);
    expect(r.value.finalTorqueNm).toBe(151);
    expect(r.value.studStretch).toEqual([]);
  });
  it("a last stage by angle only leaves the final torque at the last one with a torque", () => {
    const r = parseAssemblyForm({ ...FORM, "stage-2-reached": "", "stage-2-angle": "90" }, ctx);
    expect(r.ok && r.value.finalTorqueNm).toBe(110);
    expect(r.ok && r.value.stagesDone[2]).toEqual({ targetNm: 150, reachedNm: null, angleDeg: 90 });
  });
  it("reads imperial torque and thou into N·m and mm (mathjs as the independent reference)", () => {
    const r = parseAssemblyForm(
      { ...FORM, "stage-2-reached": "110", "stretch-1": "6.5", measuredProtrusionMm: "3" },
      { ...ctx, units: "imperial" },
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(relErr(r.value.stagesDone[2]!.reachedNm!, 110 * LBF_FT_TO_NM)).toBeLessThan(1e-6);
    expect(r.value.studStretch).toHaveLength(1);
    expect(r.value.studStretch[0]!.label).toBe("A2");
    expect(r.value.studStretch[0]!.stretchMm).toBeCloseTo(unit(6.5, "mil").toNumber("mm"), 9);
    expect(r.value.measuredProtrusionMm).toBeCloseTo(unit(3, "mil").toNumber("mm"), 9);
  });
  it("with stages in the plan, at least one must be recorded as done", () => {
    const r = parseAssemblyForm({ ...FORM, "stage-0-reached": "", "stage-1-reached": "", "stage-2-reached": "" }, ctx);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors["stage-0-reached"]).toBe("Record at least one stage as done (torque reached or angle turned)");
  });
  it("refuses a plan of another engine, a date that does not exist, and no assembler", () => {
    const r = parseAssemblyForm({ ...FORM, planId: "8", assembledOn: "2026-02-30", assembledBy: " " }, ctx);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.planId).toBe("Pick one of this engine's seal plans");
    expect(r.errors.assembledOn).toBe("Date is not a real date");
    expect(r.errors.assembledBy).toBe("Say who assembled it");
  });
  it("stud stretch: 0.005 to 2 mm (beyond 2 mm is a typing slip), angle 1 to 720°", () => {
    expect(parseAssemblyForm({ ...FORM, "stretch-0": "2" }, ctx).ok).toBe(true);
    expect(parseAssemblyForm({ ...FORM, "stretch-0": "0.005" }, ctx).ok).toBe(true);
    const far = parseAssemblyForm({ ...FORM, "stretch-0": "2.1" }, ctx);
    expect(far.ok).toBe(false);
    if (!far.ok) expect(far.errors["stretch-0"]).toMatch(/^Stretch of stud A1/);
    expect(parseAssemblyForm({ ...FORM, "stage-1-angle": "720" }, ctx).ok).toBe(true);
    const over = parseAssemblyForm({ ...FORM, "stage-1-angle": "721" }, ctx);
    expect(over.ok).toBe(false);
    if (!over.ok) expect(over.errors["stage-1-angle"]).toMatch(/^Stage 2 angle/);
  });
});

describe("impliedPreloads", () => {
  it("F = k·δ: 0.3 mm on 178 kN/mm is 53.4 kN, 7.9 % under a predicted 58 kN", () => {
    const [s] = impliedPreloads([{ label: "A1", stretchMm: 0.3 }], 178_000, 58_000);
    expect(s!.impliedPreloadN).toBeCloseTo(53_400, 6);
    expect(s!.difference).toBeCloseTo(-0.07931, 4);
  });
  it("is linear in the stretch, and gives no difference without a prediction", () => {
    const r = impliedPreloads(
      [
        { label: "A1", stretchMm: 0.2 },
        { label: "A2", stretchMm: 0.4 },
      ],
      150_000,
      null,
    );
    expect(r[1]!.impliedPreloadN / r[0]!.impliedPreloadN).toBeCloseTo(2, 12);
    expect(r.map((x) => x.difference)).toEqual([null, null]);
    expect(impliedPreloads([{ label: "A1", stretchMm: 0.2 }], 150_000, 0)[0]!.difference).toBeNull();
  });
});
