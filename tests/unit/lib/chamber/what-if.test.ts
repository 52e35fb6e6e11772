import { describe, expect, it } from "vitest";
import { readWhatIfThickness } from "../../../../app/lib/chamber/what-if";

describe("the chamber what-if thickness as typed", () => {
  it("blank is no what-if", () => {
    expect(readWhatIfThickness("  ", "metric")).toEqual({ thicknessMm: null, error: null });
  });
  it("reads the person's unit, and a typed unit wins (1 thou = 0.0254 mm exactly, NIST SP 811)", () => {
    expect(readWhatIfThickness("1.3", "metric").thicknessMm).toBeCloseTo(1.3, 9);
    expect(readWhatIfThickness("40", "imperial").thicknessMm).toBeCloseTo(1.016, 9);
    expect(readWhatIfThickness("1.3 mm", "imperial").thicknessMm).toBeCloseTo(1.3, 9);
  });
  it("refuses zero, ten millimetres and words", () => {
    expect(readWhatIfThickness("0", "metric").error).toBe("Give a compressed thickness between 0 and 10 mm");
    expect(readWhatIfThickness("10", "metric").error).toBe("Give a compressed thickness between 0 and 10 mm");
    expect(readWhatIfThickness("9.99", "metric").error).toBeNull();
    expect(readWhatIfThickness("thick", "metric").thicknessMm).toBeNull();
    expect(readWhatIfThickness("thick", "metric").error).toBeTruthy();
  });
});
