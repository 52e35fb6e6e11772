// The shop's runs held against the model (app/lib/records/evidence.ts): filters, combinations, the summary.
import { describe, expect, it } from "vitest";
import { combinations, filterPoints, summarize, type EvidencePoint } from "../../../../app/lib/records/evidence";

let id = 0;
const point = (margin: number, outcome: EvidencePoint["outcome"], over: Partial<EvidencePoint> = {}): EvidencePoint => ({
  runId: ++id,
  engineId: 1,
  engineName: "Shop four",
  ranOn: "2026-01-01",
  gasketType: "mls",
  gasketName: "g",
  fastenerName: "Stud A",
  fuel: "E85",
  peakMpa: 10,
  peakSource: "measured",
  outcome,
  margin,
  status: "holds",
  ...over,
});

describe("summarize", () => {
  it("the failure line is the highest margin at which a seal failed; failures split at margin 1", () => {
    const s = summarize([point(1.6, "held"), point(0.82, "blown-gasket"), point(1.1, "seeping"), point(0.9, "held")]);
    expect(s).toMatchObject({
      points: 4,
      sealFailures: 2,
      failedAtOrBelowMargin: 1.1,
      failuresBelowOne: 1,
      failuresAboveOne: 1,
      heldBelowOne: 1,
    });
  });
  it("margin exactly 1 counts above the line (below means < 1)", () => {
    const s = summarize([point(1, "combustion-leak"), point(1, "held")]);
    expect(s.failuresBelowOne).toBe(0);
    expect(s.failuresAboveOne).toBe(1);
    expect(s.heldBelowOne).toBe(0);
  });
  it("a stud failure and 'other' are not seal failures", () => {
    const s = summarize([point(0.5, "stud-failure"), point(0.6, "other")]);
    expect(s.sealFailures).toBe(0);
    expect(s.failedAtOrBelowMargin).toBeNull();
  });
  it("the honesty sentence: none, under ten runs, ten or more with under three failures, and enough", () => {
    expect(summarize([]).honesty).toBe("No runs logged yet: nothing to compare the model with.");
    expect(summarize([point(1.2, "held")]).honesty).toBe(
      "Only 1 run and 0 seal failures: too few to read a trend; each point is one run, not a rule.",
    );
    const nine = [...Array.from({ length: 8 }, () => point(1.5, "held")), point(0.9, "seeping")];
    expect(summarize(nine).honesty).toMatch(/^Only 9 runs and 1 seal failure: too few/);
    const ten = [...nine, point(1.4, "held")];
    expect(summarize(ten).honesty).toBe("10 runs but only 1 seal failure: the failure line rests on very little.");
    const enough = [...ten, point(0.8, "blown-gasket"), point(0.7, "lifted-head")];
    expect(summarize(enough).honesty).toBe("12 runs, 3 seal failures.");
  });
});

describe("filterPoints", () => {
  const ps = [
    point(1, "held", { fuel: "Pump" }),
    point(1, "held", { gasketType: "solid-copper" }),
    point(1, "held", { fastenerName: "Stud B" }),
  ];
  it("each filter narrows; an empty filter keeps everything", () => {
    expect(filterPoints(ps, {})).toHaveLength(3);
    expect(filterPoints(ps, { fuel: "Pump" })).toHaveLength(1);
    expect(filterPoints(ps, { gasketType: "mls" })).toHaveLength(2);
    expect(filterPoints(ps, { gasketType: "mls", fastenerName: "Stud A" })).toHaveLength(1);
  });
});

describe("combinations", () => {
  it("one row per gasket type and fastener, sorted by both; held up to the highest pressure held; failures by pressure", () => {
    const rows = combinations([
      point(1.4, "held", { peakMpa: 14 }),
      point(1.2, "held", { peakMpa: 16 }),
      point(0.9, "blown-gasket", { peakMpa: 19, ranOn: "2026-03-01" }),
      point(1.0, "seeping", { peakMpa: 17 }),
      point(1.3, "held", { gasketType: "solid-copper", peakMpa: 20 }),
      point(0.8, "lifted-head", { fastenerName: "Stud B", peakMpa: 18 }),
    ]);
    expect(rows.map((r) => [r.gasketType, r.fastenerName, r.runs, r.held, r.heldUpToMpa])).toEqual([
      ["mls", "Stud A", 4, 2, 16],
      ["mls", "Stud B", 1, 0, null],
      ["solid-copper", "Stud A", 1, 1, 20],
    ]);
    expect(rows[0]!.failures.map((f) => [f.peakMpa, f.outcome])).toEqual([
      [17, "seeping"],
      [19, "blown-gasket"],
    ]);
  });
});
