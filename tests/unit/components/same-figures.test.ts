import { describe, expect, it } from "vitest";
import { sameFields, sameList, sameRows } from "~/components/same-figures";
import { CYLINDER_FIELDS } from "~/components/estimate-tables";

const row = (clampN: number, sealMargin = 1.31) => ({
  cylinder: 1,
  clampN,
  heatAndSettlingN: -2100.5,
  clampReliefN: 18000,
  remainingSealLineHotSettledN: 42000,
  bodyFiredN: 9000,
  requiredOperatingN: 30000,
  requiredSeatingN: 28000,
  sealMargin,
  sealMarginNominal: 1.52,
  liftMm: 0.004, // not shown by the table, so not compared
});

describe("same-figures (the estimate panel's memo comparisons)", () => {
  it("sees equal figures in new objects as the same, and any shown figure that moved as a change", () => {
    expect(sameRows([row(61000)], [row(61000)], CYLINDER_FIELDS)).toBe(true);
    expect(sameRows([row(61000)], [row(61000.001)], CYLINDER_FIELDS)).toBe(false);
    expect(sameRows([row(61000, 1.31)], [row(61000, 1.3)], CYLINDER_FIELDS)).toBe(false);
  });

  it("ignores the fields a section does not show", () => {
    expect(sameRows([row(61000)], [{ ...row(61000), liftMm: 0.9 }], CYLINDER_FIELDS)).toBe(true);
  });

  it("treats a different number of rows as a change, and NaN as equal to NaN", () => {
    expect(sameRows([row(1)], [row(1), row(1)], CYLINDER_FIELDS)).toBe(false);
    expect(sameRows([], [], CYLINDER_FIELDS)).toBe(true);
    expect(sameFields({ a: NaN, b: null }, { a: NaN, b: null }, ["a", "b"])).toBe(true);
    expect(sameFields({ a: 0 }, { a: -0 }, ["a"])).toBe(false);
  });

  it("compares lists of words item by item", () => {
    expect(sameList(["Heat loosens it."], ["Heat loosens it."])).toBe(true);
    expect(sameList(["Heat loosens it."], ["Heat loosens it"])).toBe(false);
    expect(sameList(["a", "b"], ["b", "a"])).toBe(false);
  });
});
