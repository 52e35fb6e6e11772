// The run table's query string (app/lib/records/run-query.ts): known values kept, the rest ignored.
import { describe, expect, it } from "vitest";
import { runQuery } from "../../../../app/lib/records/run-query";

const q = (s: string) => runQuery(new URLSearchParams(s));

describe("runQuery", () => {
  it("nothing asked: no filter, newest first", () => {
    expect(q("")).toEqual({ filter: {}, sort: "ranOn", dir: "desc" });
  });
  it("keeps a known kind, outcome (or 'failed'), fuel, sort and ascending order", () => {
    expect(q("kind=dyno&outcome=failed&fuel=E85&sort=fuel&dir=asc")).toEqual({
      filter: { kind: "dyno", outcome: "failed", fuel: "E85" },
      sort: "fuel",
      dir: "asc",
    });
    expect(q("outcome=blown-gasket").filter).toEqual({ outcome: "blown-gasket" });
  });
  it("ignores an unknown kind, outcome, sort or direction", () => {
    expect(q("kind=drag&outcome=exploded&sort=drop&dir=up")).toEqual({ filter: {}, sort: "ranOn", dir: "desc" });
  });
  it("cuts the fuel filter at 60 characters", () => {
    expect(q(`fuel=${"x".repeat(80)}`).filter.fuel).toHaveLength(60);
  });
});
