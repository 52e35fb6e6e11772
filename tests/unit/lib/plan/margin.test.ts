// A seal margin against the plan's target (app/lib/plan/margin.ts) and the chance figure.
import { describe, expect, it } from "vitest";
import { chance, marginStatus } from "../../../../app/lib/plan/margin";

describe("marginStatus", () => {
  it("below 1 the seal opens (short); from 1 up to the target it is thin; at the target it holds", () => {
    expect(marginStatus(0.999, 1.5)).toBe("short");
    expect(marginStatus(1, 1.5)).toBe("thin");
    expect(marginStatus(1.499, 1.5)).toBe("thin");
    expect(marginStatus(1.5, 1.5)).toBe("holds");
    expect(marginStatus(3, 1.5)).toBe("holds");
  });
  it("a target of 1 leaves no thin band", () => {
    expect(marginStatus(1, 1)).toBe("holds");
    expect(marginStatus(0.99, 1)).toBe("short");
  });
});

describe("chance", () => {
  it("a probability in percent to one decimal", () => {
    expect(chance(0.0234)).toBe("2.3 %");
    expect(chance(0)).toBe("0.0 %");
    expect(chance(1)).toBe("100.0 %");
    expect(chance(0.00049)).toBe("0.0 %");
  });
});
