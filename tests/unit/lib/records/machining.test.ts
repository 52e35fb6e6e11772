import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { figureUses, parseMachiningForm, protrusionRuns } from "~/lib/records/machining";

const form = { planId: "7", measuredOn: "2026-11-20", measuredBy: "Teo", notes: "" };
const ctx = { planIds: [7], cylinders: 4, units: "metric" as const };

describe("machining form", () => {
  it("reads metric figures, a unit typed after a number, and per-bore protrusion with gaps", () => {
    const r = parseMachiningForm(
      { ...form, headFlatnessMm: "0,02", deckRemovedMm: "2 thou", "protrusion-0": "0.11", "protrusion-2": "-0.03" },
      ctx,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.headFlatnessMm).toBe(0.02);
    expect(r.value.deckRemovedMm).toBeCloseTo(unit(2, "mil").toNumber("mm"), 12);
    expect(r.value.sleeveProtrusionMm).toEqual([0.11, null, -0.03, null]);
    expect(r.value.gasketCompressedMm).toBeNull();
  });

  it("reads imperial figures in thou and µin Ra into mm and µm", () => {
    const r = parseMachiningForm({ ...form, wireProjectionMm: "4.5", deckFinishUm: "40" }, { ...ctx, units: "imperial" });
    expect(r.ok && r.value.wireProjectionMm).toBeCloseTo(unit(4.5, "mil").toNumber("mm"), 12);
    expect(r.ok && r.value.deckFinishUm).toBeCloseTo(unit(40e-6, "inch").toNumber("um"), 12);
  });

  it.each([
    [{ measuredBy: " " }, "measuredBy", "Say who measured it"],
    [{ planId: "8" }, "planId", "Pick one of this engine's seal plans"],
    [{ headFlatnessMm: "0.6" }, "headFlatnessMm", "Head flatness must be between 0.00 mm and 0.50 mm"],
    [{ "protrusion-3": "1.2" }, "protrusion-3", "Protrusion of bore 4 must be between -0.50 mm and 1.00 mm"],
    [{ headFinishUm: "3 mm" }, "headFinishUm", "Head surface finish: mm is not a unit for this field (use µm Ra, µin Ra)"],
    [{ deckFlatnessMm: "" }, "headFlatnessMm", "Record at least one measurement"],
  ])("refuses %j on %s", (change, field, message) => {
    const r = parseMachiningForm({ ...form, deckFlatnessMm: "0.01", ...change }, ctx);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors[field]).toBe(message);
  });
});

describe("which figures enter the re-run", () => {
  it("groups the bores by measured protrusion, the unmeasured ones on the plan's own", () => {
    expect(protrusionRuns({ sleeveProtrusionMm: [0.1, null, 0.1, -0.02] }, 4, true)).toEqual({
      values: [0.1, null, -0.02],
      runOfBore: [0, 1, 0, 2],
    });
    // without sleeves the model takes no protrusion: one run at the plan's
    expect(protrusionRuns({ sleeveProtrusionMm: [0.1, 0.2, 0.1, 0.3] }, 4, false)).toEqual({ values: [null], runOfBore: [0, 0, 0, 0] });
  });

  it("says the protrusion and the wire enter only with sleeves and a wire", () => {
    const uses = (s: boolean, w: boolean) => Object.fromEntries(figureUses(s, w).map((u) => [u.name, u.enters]));
    expect(uses(false, false)).toMatchObject({
      sleeveProtrusionMm: false,
      wireProjectionMm: false,
      gasketCompressedMm: true,
      headFlatnessMm: false,
    });
    expect(uses(true, true)).toMatchObject({ sleeveProtrusionMm: true, wireProjectionMm: true, receiverGrooveDepthMm: true });
  });
});
