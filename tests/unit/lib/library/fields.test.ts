// The library forms (app/lib/library/fields.ts): typed in the person's units, stored in SI.
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { formValues, NUMBER_FIELDS, parseLibraryForm } from "../../../../app/lib/library/fields";
import { IN_TO_MM, relErr } from "../nist";

const material = {
  name: "A356",
  kind: "aluminium",
  modulusMpa: "72.4",
  yieldMpa: "165",
  expansionUmPerMC: "21.4",
  limitingSurfacePressureMpa: "",
  shearStrengthMpa: "",
};

describe("parseLibraryForm, materials", () => {
  it("metric: GPa typed, MPa stored; empty optional figures are null", () => {
    const r = parseLibraryForm("materials", material, "metric");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.modulusMpa).toBeCloseTo(72_400, 9);
    expect(r.value.limitingSurfacePressureMpa).toBeNull();
    expect(r.value.shearStrengthMpa).toBeNull();
  });
  it("imperial: Mpsi, ksi and µin/in·°F into SI (mathjs as the independent reference)", () => {
    const r = parseLibraryForm("materials", { ...material, modulusMpa: "10.5", yieldMpa: "24", expansionUmPerMC: "11.9" }, "imperial");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(relErr(r.value.modulusMpa, unit(10.5e6, "psi").toNumber("MPa"))).toBeLessThan(1e-6);
    expect(relErr(r.value.yieldMpa!, unit(24_000, "psi").toNumber("MPa"))).toBeLessThan(1e-6);
    // a per-°F figure is 9/5 as large per °C
    expect(r.value.expansionUmPerMC).toBeCloseTo(11.9 * 1.8, 6);
  });
  it("an empty required figure is reported, not guessed; a word is not a number", () => {
    const r = parseLibraryForm("materials", { ...material, modulusMpa: "", expansionUmPerMC: "lots" }, "metric");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.modulusMpa).toBe("Enter the modulus (Young's)");
    expect(r.errors.expansionUmPerMC).toBe("Expansion coefficient must be a number");
  });
});

describe("parseLibraryForm, fasteners: the pitch", () => {
  const base: Record<string, string> = {
    name: "½-20 stud",
    threadSystem: "unified",
    materialId: "1",
    diameterMm: "0.5",
    pitchMm: "20",
    reducedShankDiameterMm: "",
    reducedShankLengthMm: "",
    freeThreadLengthMm: "0.8",
    engagementMm: "1.1",
    washerOdMm: "0.95",
    washerHoleMm: "0.53",
    washerThicknessMm: "",
    threadFriction: "0.12",
    bearingFriction: "0.12",
    makerLubricant: "",
    makerStages: "",
  };
  it("unified: threads per inch typed, 25.4/n mm stored; inch lengths into mm", () => {
    const r = parseLibraryForm("fasteners", base, "imperial");
    expect(r.ok ? null : r.errors).toBeNull();
    if (!r.ok) return;
    expect(r.value.pitchMm).toBeCloseTo(IN_TO_MM / 20, 12);
    expect(r.value.diameterMm).toBeCloseTo(12.7, 9);
    // empty lengths that may be zero are zero
    expect(r.value.reducedShankLengthMm).toBe(0);
    expect(r.value.washerThicknessMm).toBe(0);
  });
  it("metric: the pitch in mm, with a decimal comma", () => {
    const r = parseLibraryForm(
      "fasteners",
      {
        ...base,
        threadSystem: "metric",
        diameterMm: "12",
        pitchMm: "1,5",
        freeThreadLengthMm: "15",
        engagementMm: "24",
        washerOdMm: "24",
        washerHoleMm: "13",
      },
      "metric",
    );
    expect(r.ok && r.value.pitchMm).toBe(1.5);
  });
  it("a pitch of zero is refused in words", () => {
    const r = parseLibraryForm("fasteners", { ...base, pitchMm: "0" }, "imperial");
    expect(!r.ok && r.errors.pitchMm).toBe("Thread pitch must be greater than zero");
  });
});

describe("formValues", () => {
  it("shows a stored record in the person's units and reads back to the same SI figures", () => {
    const stored = {
      name: "A356",
      kind: "aluminium",
      modulusMpa: 72_400,
      yieldMpa: 165,
      expansionUmPerMC: 21.4,
      limitingSurfacePressureMpa: 380,
      shearStrengthMpa: null,
    };
    for (const units of ["metric", "imperial"] as const) {
      const shown = formValues("materials", stored, units);
      expect(shown.shearStrengthMpa).toBe("");
      const back = parseLibraryForm("materials", shown, units);
      expect(back.ok).toBe(true);
      if (!back.ok) continue;
      expect(relErr(back.value.modulusMpa, 72_400)).toBeLessThan(1e-5);
      expect(relErr(back.value.limitingSurfacePressureMpa!, 380)).toBeLessThan(1e-5);
    }
    expect(formValues("materials", stored, "metric").modulusMpa).toBe("72.4");
  });
  it("a unified pitch shows as threads per inch", () => {
    expect(formValues("fasteners", { threadSystem: "unified", pitchMm: IN_TO_MM / 13 }, "imperial").pitchMm).toBe("13");
  });
  it("every kind has number fields, each named once", () => {
    for (const fields of Object.values(NUMBER_FIELDS)) expect(new Set(fields.map((f) => f.name)).size).toBe(fields.length);
  });
});
