import { describe, expect, it } from "vitest";
import { decimalPoint, splitList } from "../../../../app/lib/units/decimal-comma";

describe("decimal commas (docs/user-guide.md, Typing numbers)", () => {
  it("a single comma between digits is a decimal comma", () => {
    expect(decimalPoint("0,45")).toBe("0.45");
    expect(decimalPoint("1,5 in")).toBe("1.5 in");
    expect(decimalPoint("-0,125")).toBe("-0.125");
  });
  it("three digits after a first group of 1–3 digits are thousands", () => {
    expect(decimalPoint("1,250")).toBe("1,250");
    expect(decimalPoint("0,250")).toBe("0.250");
  });
  it("with points and commas the last is the decimal mark", () => {
    expect(decimalPoint("1.250,5")).toBe("1250.5");
    expect(decimalPoint("1,250.5")).toBe("1,250.5");
  });
  it("lists split on semicolons when there are any, else on commas", () => {
    expect(splitList("54,2; 108,5; 156")).toEqual(["54,2", "108,5", "156"]);
    expect(splitList("54, 108, 156")).toEqual(["54", "108", "156"]);
  });
});
