// The display units against the NIST SP 811 factors (docs/references.md header).
import { describe, expect, it } from "vitest";
import { formatQuantity, fromDisplay, inputValue, parseQuantity, readQuantity, toDisplay, unitFor } from "../../../../app/lib/units";
import { IN_TO_MM, LBF_FT_TO_NM, LBF_TO_N, PSI_TO_PA, relErr } from "../nist";

// convert-units carries 4.44822 N/lbf, 1.355818 N·m/lbf·ft and 3.28084 ft/m: all within 1e-6 of NIST SP 811.
const TOL = 1e-6;

describe("units: NIST SP 811 factors", () => {
  it("1 in = 25.4 mm exactly (to 1e-6); 1 thou = 0.0254 mm", () => {
    expect(relErr(fromDisplay("length", 1, "in"), IN_TO_MM)).toBeLessThan(TOL);
    expect(relErr(fromDisplay("smallLength", 1, "thou"), IN_TO_MM / 1000)).toBeLessThan(TOL);
    expect(relErr(toDisplay("length", 25.4, "in"), 1)).toBeLessThan(TOL);
  });
  it("1 lbf = 4.4482216 N; 1 kN = 1000 N", () => {
    expect(relErr(fromDisplay("force", 1, "lbf"), LBF_TO_N)).toBeLessThan(TOL);
    expect(fromDisplay("force", 1, "kN")).toBeCloseTo(1000, 9);
  });
  it("1 lbf·ft = 1.3558179 N·m", () => {
    expect(relErr(fromDisplay("torque", 1, "lbf·ft"), LBF_FT_TO_NM)).toBeLessThan(TOL);
    expect(relErr(toDisplay("torque", LBF_FT_TO_NM * 150, "lbf·ft"), 150)).toBeLessThan(TOL);
  });
  it("1 psi = 6894.757 Pa; 1 bar = 0.1 MPa", () => {
    expect(relErr(fromDisplay("pressure", 1, "psi"), PSI_TO_PA / 1e6)).toBeLessThan(TOL);
    expect(fromDisplay("pressure", 1, "bar")).toBeCloseTo(0.1, 12);
  });
  it("round trip SI → display → SI", () => {
    for (const [q, u] of [
      ["length", "in"],
      ["force", "lbf"],
      ["torque", "lbf·ft"],
      ["stress", "psi"],
    ] as const) {
      expect(relErr(fromDisplay(q, toDisplay(q, 123.456, u), u), 123.456)).toBeLessThan(1e-12);
    }
  });
  it("refuses a unit of another quantity", () => {
    expect(() => toDisplay("torque", 1, "mm")).toThrow(/not a unit of torque/);
  });
});

describe("units: display", () => {
  it("per-person units", () => {
    expect(unitFor("torque", "imperial")).toBe("lbf·ft");
    expect(unitFor("smallLength", "imperial")).toBe("thou");
    expect(unitFor("force", "metric")).toBe("kN");
  });
  it("formats with sensible decimals", () => {
    expect(formatQuantity(0.1016, "smallLength", "imperial")).toBe("4.0 thou"); // 0.1016 mm / 0.0254 = 4
    expect(formatQuantity(12_345, "force", "metric")).toBe("12.3 kN");
    expect(formatQuantity(4448.2216, "force", "imperial")).toBe("1,000 lbf");
    expect(formatQuantity(135.58179, "torque", "imperial")).toBe("100 lbf·ft");
    expect(formatQuantity(1.5, "pressure", "metric")).toBe("15.0 bar");
    expect(formatQuantity(Number.NaN, "torque", "metric")).toBe("—");
    expect(formatQuantity(-0.00001, "length", "metric")).toBe("0.00 mm");
  });
  it("parses form input into SI", () => {
    const a = parseQuantity("100", "torque", "lbf·ft");
    expect(a.ok && relErr(a.valueSi, 135.58179)).toBeLessThan(TOL);
    const b = parseQuantity("4 thou", "smallLength", "mm");
    expect(b.ok && relErr(b.valueSi, 0.1016)).toBeLessThan(TOL);
    const c = parseQuantity("1,250", "force", "lbf");
    expect(c.ok && relErr(c.valueSi, 1250 * LBF_TO_N)).toBeLessThan(TOL);
    expect(parseQuantity("1,5", "length", "mm")).toEqual({ ok: true, valueSi: 1.5, unit: "mm" });
    expect(parseQuantity("0,45 in", "length", "mm")).toEqual({ ok: true, valueSi: expect.closeTo(0.45 * IN_TO_MM, 5), unit: "in" });
    expect(parseQuantity("1,2,3", "length", "mm").ok).toBe(false);
    expect(parseQuantity("", "length", "mm").ok).toBe(false);
    expect(parseQuantity("abc", "length", "mm").ok).toBe(false);
    const d = parseQuantity("12 psi", "torque", "N·m");
    expect(d.ok).toBe(false);
  });
});

describe("units: one choice per unit system", () => {
  it("165 MPa reads 23.9 ksi wherever it is a stress", () => {
    expect(formatQuantity(165, "stress", "imperial")).toBe("23.9 ksi");
    expect(formatQuantity(165, "stress", "metric")).toBe("165 MPa");
    expect(unitFor("stress", "imperial")).toBe("ksi");
  });
  it("small lengths in thou, lengths in inches", () => {
    expect(unitFor("smallLength", "imperial")).toBe("thou");
    expect(unitFor("length", "imperial")).toBe("in");
    expect(formatQuantity(86, "length", "imperial")).toBe("3.386 in");
  });
  it("a plain figure carries no unit; withUnit: false drops it", () => {
    expect(formatQuantity(0.125, "plain", "imperial")).toBe("0.125");
    expect(formatQuantity(108.5, "torque", "metric", { withUnit: false })).toBe("109");
  });
  it("no figure reads with runaway digits: 1,241 MPa yield is 180.0 ksi, not 180,006 psi", () => {
    expect(formatQuantity(1241, "stress", "imperial")).toBe("180.0 ksi");
    expect(formatQuantity(89.6318, "torque", "metric")).toBe("90 N·m");
  });
});

describe("units: input values and typed figures", () => {
  it("inputValue is two decimals finer than the display, no grouping", () => {
    expect(inputValue(86, "length", "imperial")).toBe("3.38583");
    expect(inputValue(4448.2216 * 3, "force", "imperial")).toBe("3000");
    expect(inputValue(1234567, "force", "metric")).toBe("1234.567");
    expect(inputValue(null, "length", "metric")).toBe("");
  });
  it("manifold: gauge adds the standard atmosphere", () => {
    expect(readQuantity("1 bar boost", "manifold", "metric")).toBeCloseTo(201.325, 9);
    expect(readQuantity("200", "manifold", "metric")).toBe(200);
    expect(readQuantity("29.0 psi abs", "manifold", "metric")).toBeCloseTo((29 * PSI_TO_PA) / 1000, 3);
  });
  it("an unknown unit is NaN for readQuantity", () => {
    expect(readQuantity("5 parsecs", "length", "metric")).toBeNaN();
  });
});
