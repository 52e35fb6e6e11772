// The library records' schemas (app/lib/library/schemas.ts): bounds and the cross-field checks.
import { describe, expect, it } from "vitest";
import { FastenerSchema, GasketSchema } from "../../../../app/lib/library/schemas";
import {
  GASKET_TYPE_LABELS,
  isLibraryKind,
  LIBRARY_GASKET_TYPES,
  MATERIAL_KIND_LABELS,
  MATERIAL_KINDS,
} from "../../../../app/lib/library/labels";
import { GASKET_TYPES } from "../../../../app/lib/clamp/schema";

const fastener = {
  name: "M12 stud",
  threadSystem: "metric",
  diameterMm: 12,
  pitchMm: 1.5,
  reducedShankDiameterMm: null,
  reducedShankLengthMm: 0,
  freeThreadLengthMm: 15,
  engagementMm: 24,
  materialId: 1,
  washerOdMm: 24,
  washerHoleMm: 13,
  washerThicknessMm: 3,
  makerTorqueNm: null,
  makerLubricant: "",
  makerStages: "",
  makerStretchMm: null,
  threadFriction: 0.12,
  bearingFriction: 0.12,
};
const gasket = {
  name: "MLS 0.7",
  type: "mls",
  compressedThicknessMm: 0.7,
  boreMm: 87,
  sealDiameterMm: 90,
  ringWidthMm: 1.2,
  ringModulusMpa: 200_000,
  sealLineYieldMpa: 165,
  bodyModulusMpa: 2000,
  bodyAreaPerBoreMm2: 3000,
  expansionUmPerMC: 12,
  m: 5.5,
  yMpa: 124,
  relaxationPercent: 0,
  finishMinRaUm: 0.5,
  finishMaxRaUm: 1.2,
};
const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);

describe("one list each", () => {
  it("the library's gasket types are the clamp model's, each with a label; every material kind has a label", () => {
    expect(LIBRARY_GASKET_TYPES).toBe(GASKET_TYPES);
    expect(Object.keys(GASKET_TYPE_LABELS).sort()).toEqual([...GASKET_TYPES].sort());
    expect(Object.keys(MATERIAL_KIND_LABELS)).toEqual([...MATERIAL_KINDS]);
  });
  it("isLibraryKind", () => {
    expect(isLibraryKind("fasteners")).toBe(true);
    expect(isLibraryKind("heads")).toBe(false);
    expect(isLibraryKind(undefined)).toBe(false);
  });
});

describe("FastenerSchema", () => {
  it("takes a plain stud", () => {
    expect(issues(FastenerSchema.safeParse(fastener))).toEqual([]);
  });
  it("pitch: under the diameter, and no coarser than d/4 (the clamp model's limit): 3 mm on M12 passes, 3.1 does not", () => {
    expect(issues(FastenerSchema.safeParse({ ...fastener, pitchMm: 3 }))).toEqual([]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, pitchMm: 3.1 }))).toEqual([
      "pitchMm: A 3.1 mm pitch is too coarse for a 12 mm thread",
    ]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, diameterMm: 5, pitchMm: 5, washerHoleMm: 6 }))).toEqual([
      "pitchMm: Thread pitch must be smaller than the diameter",
    ]);
  });
  it("shank and washer that can exist", () => {
    expect(issues(FastenerSchema.safeParse({ ...fastener, reducedShankDiameterMm: 12, reducedShankLengthMm: 40 }))).toEqual([
      "reducedShankDiameterMm: Reduced shank must be narrower than the thread",
    ]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, reducedShankLengthMm: 40 }))).toEqual([
      "reducedShankDiameterMm: Give the reduced shank diameter, or set its length to zero",
    ]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, washerHoleMm: 11.9 }))).toEqual([
      "washerHoleMm: Washer hole must be at least the stud diameter",
    ]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, washerOdMm: 13 }))).toEqual([
      "washerOdMm: Washer outer diameter must be larger than its hole",
    ]);
  });
  it("friction 0.02 to 0.6, both ends included", () => {
    expect(issues(FastenerSchema.safeParse({ ...fastener, threadFriction: 0.02, bearingFriction: 0.6 }))).toEqual([]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, threadFriction: 0.019 }))).toEqual([
      "threadFriction: Thread friction is at least 0.02",
    ]);
    expect(issues(FastenerSchema.safeParse({ ...fastener, bearingFriction: 0.61 }))).toEqual([
      "bearingFriction: Bearing friction is at most 0.6",
    ]);
  });
  it("a refused field is not cross-checked again (one message per field)", () => {
    expect(issues(FastenerSchema.safeParse({ ...fastener, diameterMm: -1 }))).toEqual([
      "diameterMm: Thread diameter must be greater than zero",
    ]);
  });
});

describe("GasketSchema", () => {
  it("takes a plain gasket", () => {
    expect(issues(GasketSchema.safeParse(gasket))).toEqual([]);
  });
  it("the seal band (seal diameter less ring width) must sit outside the bore: 88.3 − 1.2 = 87.1 passes, 88.2 − 1.2 = 87 does not", () => {
    expect(issues(GasketSchema.safeParse({ ...gasket, sealDiameterMm: 88.3 }))).toEqual([]);
    expect(issues(GasketSchema.safeParse({ ...gasket, sealDiameterMm: 88.2 }))).toEqual([
      "sealDiameterMm: The seal band (seal diameter less ring width) must sit outside the gasket bore",
    ]);
  });
  it("the finish window, and the seating and service pressures in pairs", () => {
    expect(issues(GasketSchema.safeParse({ ...gasket, finishMinRaUm: 1.3 }))).toEqual([
      "finishMaxRaUm: The roughest finish must be at least the smoothest",
    ]);
    expect(issues(GasketSchema.safeParse({ ...gasket, seatingPressureMpa: 100 }))).toEqual([
      "minServicePressureMpa: Give both the seating pressure and the minimum service pressure, or neither",
    ]);
    expect(issues(GasketSchema.safeParse({ ...gasket, seatingPressureMpa: 100, minServicePressureMpa: 40, maxPressureMpa: 40 }))).toEqual([
      "maxPressureMpa: The maximum pressure must be above the minimum service pressure",
    ]);
  });
  it("relaxation 0 to 50 %", () => {
    expect(issues(GasketSchema.safeParse({ ...gasket, relaxationPercent: 50 }))).toEqual([]);
    expect(issues(GasketSchema.safeParse({ ...gasket, relaxationPercent: 50.1 }))).toEqual([
      "relaxationPercent: Relaxation is at most 50 %",
    ]);
  });
});
