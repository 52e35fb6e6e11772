import { describe, expect, it } from "vitest";
import { impliedPreloads } from "~/lib/records/assembly";
import { filterPoints, summarize, type EvidencePoint } from "~/lib/records/evidence";
import { runSchema, selectRuns, type RunRecord } from "~/lib/records/run";

const ok = {
  ranOn: "2026-07-12",
  kind: "dyno",
  manifoldPressureKpa: "300",
  fuel: "E85",
  peakCylinderPressureMpa: "",
  outcome: "held",
  cylindersAffected: "",
  notes: "",
  teardownFindings: "",
};

describe("run schema", () => {
  it("takes a plain run and a failure with its cylinders", () => {
    expect(runSchema(6, "metric").parse(ok).manifoldPressureKpa).toBe(300);
    expect(runSchema(6, "metric").parse({ ...ok, outcome: "blown-gasket", cylindersAffected: "6, 5 5" }).cylindersAffected).toEqual([5, 6]);
  });
  it.each([
    [{ ranOn: "2026-02-30" }, "ranOn"],
    [{ kind: "drag" }, "kind"],
    [{ manifoldPressureKpa: "", peakCylinderPressureMpa: "" }, "manifoldPressureKpa"],
    [{ peakCylinderPressureMpa: "5000" }, "peakCylinderPressureMpa"],
    [{ outcome: "blown-gasket" }, "cylindersAffected"],
    [{ outcome: "seeping", cylindersAffected: "7" }, "cylindersAffected"],
  ])("refuses %j with a message on %s", (change, field) => {
    const r = runSchema(6, "metric").safeParse({ ...ok, ...change });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join("."))).toContain(field);
  });
});

const run = (id: number, ranOn: string, outcome: RunRecord["outcome"], peak: number | null): RunRecord => ({
  id,
  engineId: 1,
  planId: 1,
  ranOn,
  kind: "dyno",
  manifoldPressureKpa: 200,
  fuel: "E85",
  peakCylinderPressureMpa: peak,
  peakPressureSource: "measured",
  outcome,
  cylindersAffected: [],
  notes: "",
  teardownFindings: "",
  createdAt: "",
});

describe("run table", () => {
  const runs = [run(1, "2026-01-01", "held", 9), run(2, "2026-03-01", "blown-gasket", 12), run(3, "2026-02-01", "held", null)];
  it("sorts by date, newest first by default, and pressure with the missing last", () => {
    expect(selectRuns(runs, {}).map((r) => r.id)).toEqual([2, 3, 1]);
    expect(selectRuns(runs, {}, "peakCylinderPressureMpa", "asc").map((r) => r.id)).toEqual([1, 2, 3]);
  });
  it("filters the failures", () => {
    expect(selectRuns(runs, { outcome: "failed" }).map((r) => r.id)).toEqual([2]);
  });
});

describe("implied preload", () => {
  it("is k·δ with the stiffness given", () => {
    const [s] = impliedPreloads([{ label: "A1", stretchMm: 0.3 }], 178_000, 58_000);
    expect(s!.impliedPreloadN).toBeCloseTo(53_400, 6);
    expect(s!.difference).toBeCloseTo(53_400 / 58_000 - 1, 12);
  });
});

const point = (margin: number, outcome: EvidencePoint["outcome"], fuel = "E85"): EvidencePoint => ({
  runId: 1,
  engineId: 1,
  engineName: "x",
  ranOn: "2026-01-01",
  gasketType: "mls",
  gasketName: "g",
  fastenerName: "f",
  fuel,
  peakMpa: 10,
  peakSource: "measured",
  outcome,
  margin,
  status: "holds",
});

describe("evidence summary", () => {
  it("puts the failure line at the highest margin that failed and says how few the points are", () => {
    const s = summarize([point(1.6, "held"), point(0.82, "blown-gasket"), point(1.1, "seeping"), point(0.9, "held")]);
    expect(s.failedAtOrBelowMargin).toBe(1.1);
    expect(s.failuresBelowOne).toBe(1);
    expect(s.failuresAboveOne).toBe(1);
    expect(s.heldBelowOne).toBe(1);
    expect(s.honesty).toMatch(/Only 4 runs and 2 seal failures/);
  });
  it("a stud failure is not a seal failure, and no failure means no line", () => {
    const s = summarize([point(1.6, "held"), point(0.5, "stud-failure")]);
    expect(s.sealFailures).toBe(0);
    expect(s.failedAtOrBelowMargin).toBeNull();
  });
  it("filters by fuel", () => {
    expect(filterPoints([point(1, "held", "E85"), point(1, "held", "Pump")], { fuel: "Pump" })).toHaveLength(1);
  });
});
