// The run log's API shapes (app/lib/api/run-schemas.ts).
import { describe, expect, it } from "vitest";
import { RUN_KINDS, RUN_OUTCOMES, RunCreateSchema, RunListQuerySchema } from "../../../../app/lib/api/run-schemas";
import { OUTCOMES, RUN_KINDS as RECORD_RUN_KINDS } from "../../../../app/lib/records/run";

const run = { engineId: 3, ranOn: "2026-12-01", kind: "dyno", outcome: "held" };
const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => i.message);

describe("RunCreateSchema", () => {
  it("the kinds and outcomes are the run log's own lists", () => {
    expect(RUN_KINDS).toBe(RECORD_RUN_KINDS);
    expect(RUN_OUTCOMES).toBe(OUTCOMES);
  });
  it("fills the defaults: no pressures, estimated source, no cylinders, empty texts", () => {
    expect(RunCreateSchema.parse(run)).toEqual({
      ...run,
      manifoldPressureKpa: null,
      fuel: "",
      peakCylinderPressureMpa: null,
      peakPressureSource: "estimated",
      cylindersAffected: [],
      notes: "",
      teardownFindings: "",
    });
  });
  it("bounds: manifold above 0 to 1000 kPa absolute, peak above 0 to 60 MPa", () => {
    expect(RunCreateSchema.safeParse({ ...run, manifoldPressureKpa: 1000, peakCylinderPressureMpa: 60 }).success).toBe(true);
    expect(messages(RunCreateSchema.safeParse({ ...run, manifoldPressureKpa: 0 }))).toEqual([
      "manifoldPressureKpa is absolute and above zero",
    ]);
    expect(messages(RunCreateSchema.safeParse({ ...run, manifoldPressureKpa: 1000.1 }))).toEqual(["manifoldPressureKpa is at most 1000"]);
    expect(messages(RunCreateSchema.safeParse({ ...run, peakCylinderPressureMpa: 60.5 }))).toEqual([
      "peakCylinderPressureMpa is at most 60",
    ]);
  });
  it("cylinders 1 to 16, each once; a real date; no unknown fields", () => {
    expect(messages(RunCreateSchema.safeParse({ ...run, cylindersAffected: [2, 2] }))).toEqual(["each cylinder once"]);
    expect(messages(RunCreateSchema.safeParse({ ...run, cylindersAffected: [0] }))).toEqual(["cylinders start at 1"]);
    expect(messages(RunCreateSchema.safeParse({ ...run, cylindersAffected: [17] }))).toEqual(["at most cylinder 16"]);
    expect(messages(RunCreateSchema.safeParse({ ...run, ranOn: "2026-02-30" }))).toEqual(["ranOn is a date like 2026-12-01"]);
    expect(RunCreateSchema.safeParse({ ...run, extra: 1 }).success).toBe(false);
  });
});

describe("RunListQuerySchema", () => {
  it("25 by default, at most 100; the cursor is a decimal id", () => {
    expect(RunListQuerySchema.parse({}).limit).toBe(25);
    expect(RunListQuerySchema.parse({ limit: "100", cursor: "42", engineId: "7" })).toEqual({ limit: 100, cursor: "42", engineId: 7 });
    expect(RunListQuerySchema.safeParse({ limit: "101" }).success).toBe(false);
    expect(messages(RunListQuerySchema.safeParse({ cursor: "0x2a" }))).toEqual(["cursor is the nextCursor of the last page"]);
  });
});
