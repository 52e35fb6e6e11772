// Thread geometry (app/lib/clamp/thread.ts): the basic profile, the stress areas and the unified-size test.
import { describe, expect, it } from "vitest";
import { circleAreaMm2, looksUnified, threadGeometry, unifiedStressAreaIn2 } from "../../../../app/lib/clamp/thread";
import { IN_TO_MM, relErr } from "../nist";

describe("threadGeometry, ISO form", () => {
  it("M12×1.75: d2 = 10.8633, d3 = 9.8530 mm (ISO 68-1 basic profile, computed), As = 84.3 mm² (ISO 898-1 table), ±0.05 mm²", () => {
    const t = threadGeometry(12, 1.75);
    expect(t.pitchDiameterMm).toBeCloseTo(12 - 0.649519 * 1.75, 12);
    expect(t.pitchDiameterMm).toBeCloseTo(10.8633, 4);
    expect(t.minorDiameterMm).toBeCloseTo(9.853, 4);
    expect(Math.abs(t.stressAreaMm2 - 84.3)).toBeLessThan(0.05);
  });
  it("M12×1.5: As 88.1 mm² (ISO fine-thread table, from memory; docs/references.md §1 computes 88.13), ±0.05", () => {
    expect(Math.abs(threadGeometry(12, 1.5).stressAreaMm2 - 88.13)).toBeLessThan(0.05);
  });
  it("the stress diameter is the mean of d2 and d3, and the areas are the circles of d3 and d", () => {
    const t = threadGeometry(14, 1.5);
    expect(t.stressDiameterMm).toBeCloseTo((t.pitchDiameterMm + t.minorDiameterMm) / 2, 12);
    expect(t.minorAreaMm2).toBeCloseTo((Math.PI / 4) * t.minorDiameterMm ** 2, 9);
    expect(t.nominalAreaMm2).toBeCloseTo((Math.PI / 4) * 196, 9);
    expect(t.minorAreaMm2).toBeLessThan(t.stressAreaMm2);
    expect(t.stressAreaMm2).toBeLessThan(t.nominalAreaMm2);
  });
  it("a finer pitch on the same diameter gives a larger stress area (trend)", () => {
    const areas = [2, 1.75, 1.5, 1.25, 1].map((p) => threadGeometry(12, p).stressAreaMm2);
    for (let i = 1; i < areas.length; i++) expect(areas[i]!).toBeGreaterThan(areas[i - 1]!);
  });
});

describe("unified form", () => {
  it("1/2-13 UNC: At 0.1419 in², 1/2-20 UNF: 0.1599 in² (ASME B1.1 table), ±0.0002 in²", () => {
    expect(Math.abs(unifiedStressAreaIn2(0.5, 13) - 0.1419)).toBeLessThanOrEqual(0.0002);
    expect(Math.abs(unifiedStressAreaIn2(0.5, 20) - 0.1599)).toBeLessThanOrEqual(0.0002);
  });
  it("threadGeometry(…, 'unified') in mm agrees with the inch formula to 1e-4", () => {
    const t = threadGeometry(0.5 * IN_TO_MM, IN_TO_MM / 20, "unified");
    expect(relErr(t.stressAreaMm2, unifiedStressAreaIn2(0.5, 20) * IN_TO_MM ** 2)).toBeLessThan(1e-4);
    expect(t.stressDiameterMm).toBeCloseTo(0.5 * IN_TO_MM - (0.9743 * IN_TO_MM) / 20, 12);
  });
});

describe("looksUnified", () => {
  it("whole 64ths and whole threads per inch: 1/2-20, 7/16-14, 9/16-12 are unified", () => {
    expect(looksUnified(12.7, IN_TO_MM / 20)).toBe(true);
    expect(looksUnified((7 / 16) * IN_TO_MM, IN_TO_MM / 14)).toBe(true);
    expect(looksUnified((9 / 16) * IN_TO_MM, IN_TO_MM / 12)).toBe(true);
  });
  it("metric sizes are not: M12×1.5, M11×1.5, M14×2", () => {
    expect(looksUnified(12, 1.5)).toBe(false);
    expect(looksUnified(11, 1.5)).toBe(false);
    expect(looksUnified(14, 2)).toBe(false);
  });
  it("the diameter test allows 0.02 of a 64th: 12.7 + 0.007 mm passes, + 0.009 mm does not", () => {
    // 0.02/64 in = 0.0079 mm
    expect(looksUnified(12.707, IN_TO_MM / 20)).toBe(true);
    expect(looksUnified(12.709, IN_TO_MM / 20)).toBe(false);
  });
});

describe("circleAreaMm2", () => {
  it("π/4·d²: 10 mm → 78.54 mm², and four times the area at twice the diameter", () => {
    expect(circleAreaMm2(10)).toBeCloseTo(78.5398, 4);
    expect(circleAreaMm2(20) / circleAreaMm2(10)).toBeCloseTo(4, 12);
    expect(circleAreaMm2(0)).toBe(0);
  });
});
