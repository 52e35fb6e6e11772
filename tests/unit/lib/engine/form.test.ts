import { describe, expect, it } from "vitest";
import { formToRaw } from "../../../../app/lib/engine";
import { readQuantity as readEngineQuantity } from "../../../../app/lib/units";
import { IN_TO_MM, PSI_TO_PA, relErr } from "../nist";

describe("units typed into engine fields win over the field's (docs/user-guide.md, Units)", () => {
  it("lengths", () => {
    expect(readEngineQuantity("3.386 in", "length", "metric")).toBeCloseTo(3.386 * IN_TO_MM, 5);
    expect(readEngineQuantity("86 mm", "length", "imperial")).toBeCloseTo(86, 9);
    expect(readEngineQuantity("4 thou", "smallLength", "metric")).toBeCloseTo(0.1016, 6);
    expect(readEngineQuantity("86,5", "length", "metric")).toBe(86.5);
    expect(readEngineQuantity("86 psi", "length", "metric")).toBeNaN();
  });
  it("manifold pressure: absolute as typed, gauge (boost) plus the standard atmosphere", () => {
    expect(readEngineQuantity("300", "manifold", "metric")).toBe(300);
    expect(readEngineQuantity("3 bar", "manifold", "metric")).toBe(300);
    expect(readEngineQuantity("2 bar boost", "manifold", "metric")).toBeCloseTo(301.325, 9);
    expect(readEngineQuantity("20 psig", "manifold", "metric")).toBeCloseTo((20 * PSI_TO_PA) / 1000 + 101.325, 3);
    expect(readEngineQuantity("43.5 psi abs", "manifold", "metric")).toBeCloseTo((43.5 * PSI_TO_PA) / 1000, 3);
  });
  it("temperature, volume and peak pressure", () => {
    expect(readEngineQuantity("230 °F", "temperature", "metric")).toBeCloseTo(110, 9);
    expect(readEngineQuantity("110 C", "temperature", "imperial")).toBe(110);
    expect(readEngineQuantity("45,5 cc", "volume", "metric")).toBe(45.5);
    // convert-units' psi is within 1e-6 of NIST SP 811's
    expect(relErr(readEngineQuantity("1800 psi", "pressure", "metric"), (1800 * PSI_TO_PA) / 1e6)).toBeLessThan(1e-6);
    expect(readEngineQuantity("12 furlongs", "temperature", "metric")).toBeNaN();
  });
  it("the engine form's raw input carries the SI figures", () => {
    const raw = formToRaw({ boreMm: "3.386 in", targetManifoldKpa: "2 bar boost", runningHeadC: "230 °F", cylinders: "4" }, [], "metric");
    expect(raw.boreMm).toBeCloseTo(86.0044, 4);
    expect(raw.targetManifoldKpa).toBeCloseTo(301.325, 9);
    expect(raw.runningHeadC).toBeCloseTo(110, 9);
    expect(raw.cylinders).toBe(4);
  });
});
