// Record ids in URLs and forms (app/utils/ids.ts): decimal digits only.
import { describe, expect, it } from "vitest";
import { idParamNames, parseId } from "../../../app/utils/ids";

describe("parseId", () => {
  it("takes a positive decimal integer", () => {
    expect(parseId("1")).toBe(1);
    expect(parseId("42")).toBe(42);
    expect(parseId("9007199254740991")).toBe(9_007_199_254_740_991);
  });
  it("refuses what Number() would read as 1: hex, exponent, spaces, a sign, a fraction, a leading zero", () => {
    for (const raw of ["0x1", "1e0", " 1", "1 ", "+1", "1.0", "01", "0", "-1", ""]) expect(parseId(raw)).toBeNull();
  });
  it("refuses past the safe integers and anything not a string", () => {
    expect(parseId("9007199254740993")).toBeNull();
    expect(parseId("12345678901234567")).toBeNull();
    expect(parseId(1)).toBeNull();
    expect(parseId(undefined)).toBeNull();
  });
});

describe("idParamNames", () => {
  it("the params that end in Id", () => {
    expect(idParamNames({ engineId: "1", planId: "2", slug: "x", id: "3" })).toEqual(["engineId", "planId"]);
  });
});
