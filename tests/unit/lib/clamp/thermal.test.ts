// Thermal preload change and the losses, by hand (Bickford eqs. 11.12–11.13; VDI 2230 form).
import { describe, expect, it } from "vitest";
import { embeddingLossN, thermalPreloadChangeN } from "../../../../app/lib/clamp/thermal";

const base = {
  members: [{ thicknessMm: 100, expansionUmPerMC: 23, temperatureC: 120 }],
  studLengthMm: 100,
  studExpansionUmPerMC: 12,
  studTemperatureC: 120,
  assemblyTemperatureC: 20,
  studComplianceMmPerN: 2e-6,
  memberComplianceMmPerN: 1e-6,
};

describe("thermalPreloadChangeN", () => {
  it("an aluminium stack on a steel stud gains preload: (0.23 − 0.12 mm)/(3e-6 mm/N) = 36 667 N", () => {
    expect(thermalPreloadChangeN(base)).toBeCloseTo((100 * 23e-6 * 100 - 100 * 12e-6 * 100) / 3e-6, 6);
    expect(thermalPreloadChangeN(base)).toBeCloseTo(36_666.67, 1);
  });
  it("a cooler stud than the members grows less, so the gain is larger; the stud's temperature counts", () => {
    const cooler = thermalPreloadChangeN({ ...base, studTemperatureC: 70 });
    expect(cooler).toBeCloseTo((0.23 - 100 * 12e-6 * 50) / 3e-6, 4);
    expect(cooler).toBeGreaterThan(thermalPreloadChangeN(base));
  });
  it("no temperature change, no preload change", () => {
    expect(thermalPreloadChangeN({ ...base, members: [{ ...base.members[0]!, temperatureC: 20 }], studTemperatureC: 20 })).toBe(0);
  });
});

describe("embeddingLossN", () => {
  it("embedding over the joint's compliance", () => {
    expect(embeddingLossN(0.006, 2e-6, 1e-6)).toBeCloseTo(2000, 9);
  });
});
