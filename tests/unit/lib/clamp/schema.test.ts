// The plan schema refuses what a builder could mistype, in words a builder understands.
import { describe, expect, it } from "vitest";
import { defaultStudPattern, parsePlan, PlanInputSchema } from "../../../../app/lib/clamp";
import { MAX_PLAN_ISSUES } from "../../../../app/lib/clamp/schema";
import { workedExampleRaw } from "./fixtures";

type Raw = ReturnType<typeof workedExampleRaw>;
function messages(edit: (r: Raw) => void): string[] {
  const r = structuredClone(workedExampleRaw());
  edit(r);
  const p = parsePlan(r);
  return p.ok ? [] : p.errors.map((e) => e.message);
}

describe("PlanInputSchema", () => {
  it("accepts the worked example and fills defaults", () => {
    const p = PlanInputSchema.parse(workedExampleRaw());
    expect(p.model).toEqual({ squeezeGainThreshold: 0.1, indentationFactor: 3, studLimitFraction: 0.9, headStrainLimit: 0.002 });
    expect(p.fastener.reducedShankLengthMm).toBe(0);
    expect(p.fastener.washerTurns).toBe(false);
    expect(p.fastener.rolledAfterHeatTreatment).toBe(false);
    expect(p.targetMargin).toBe(1.5);
    expect(p.sleeve).toEqual({ kind: "none" });
  });
  it.each([
    ["thread pitch ≥ diameter", (r: Raw) => (r.fastener.pitchMm = 14), "Thread pitch must be smaller than the diameter"],
    [
      "reduced shank wider than the thread",
      (r: Raw) => ((r.fastener.reducedShankDiameterMm = 14.5), (r.fastener.reducedShankLengthMm = 10)),
      "Reduced shank must be narrower than the thread",
    ],
    [
      "reduced shank length without diameter",
      (r: Raw) => (r.fastener.reducedShankLengthMm = 10),
      "Give the reduced shank diameter, or set its length to zero",
    ],
    ["negative bore", (r: Raw) => (r.engine.boreMm = -96), "Bore must be greater than zero"],
    ["zero gasket thickness", (r: Raw) => (r.gasket.compressedThicknessMm = 0), "Gasket compressed thickness must be greater than zero"],
    ["NaN torque", (r: Raw) => (r.tightening.target = { mode: "torque", torqueNm: Number.NaN }), "Torque must be a finite number"],
    ["Infinity modulus", (r: Raw) => (r.head.modulusMpa = Number.POSITIVE_INFINITY), "Head modulus must be a finite number"],
    ["washer hole smaller than the stud", (r: Raw) => (r.fastener.washerHoleMm = 13), "Washer hole must be at least the stud diameter"],
    ["washer OD not above its hole", (r: Raw) => (r.fastener.washerOdMm = 15), "Washer outer diameter must be larger than its hole"],
    [
      "seal band inside the bore",
      (r: Raw) => (r.gasket.sealDiameterMm = 96.5),
      "The seal band (diameter 96.5 mm, width 1.5 mm) must sit outside the 96 mm bore",
    ],
    [
      "free thread longer than the stack",
      (r: Raw) => (r.fastener.freeThreadLengthMm = 100),
      "Reduced shank and free thread add up to 100 mm, longer than the clamped stack (91.3 mm)",
    ],
    [
      "odd V",
      (r: Raw) => ((r.engine.layout = "V"), (r.engine.cylinders = 5), (r.studs = defaultStudPattern("inline", 5))),
      "A V engine needs an even number of cylinders",
    ],
    ["friction out of range", (r: Raw) => (r.tightening.threadFriction = 0.9), "Thread friction must be at most 0.6"],
  ])("rejects %s", (_name, edit, message) => {
    expect(messages(edit)).toContain(message);
  });
  it("stud shares must add up to 1, with the stud named", () => {
    const m = messages((r) => {
      r.studs[2].serves = [
        { cylinder: 2, share: 0.5 },
        { cylinder: 3, share: 0.3 },
      ];
    });
    expect(m).toContain("Stud shares for stud A3 add up to 0.8; they must add up to 1");
    const unlabeled = messages((r) => {
      r.studs = r.studs.map((s) => ({ serves: s.serves }));
      r.studs[2].serves = [
        { cylinder: 2, share: 0.5 },
        { cylinder: 3, share: 0.3 },
      ];
    });
    expect(unlabeled).toContain("Stud shares for stud 3 add up to 0.8; they must add up to 1");
  });
  it("stud pointing at a cylinder the engine does not have, duplicates, and unserved cylinders", () => {
    expect(messages((r) => (r.studs[0].serves = [{ cylinder: 9, share: 1 }]))).toContain(
      "Stud A1 serves cylinder 9, but the engine has 4 cylinders",
    );
    expect(
      messages(
        (r) =>
          (r.studs[1].serves = [
            { cylinder: 1, share: 0.5 },
            { cylinder: 1, share: 0.5 },
          ]),
      ),
    ).toContain("Stud A2 lists cylinder 1 twice");
    expect(messages((r) => (r.engine.cylinders = 5))).toContain("No stud serves cylinder 5");
  });
  it("errors carry the field path for the form", () => {
    const r = structuredClone(workedExampleRaw());
    r.fastener.pitchMm = 20;
    const p = parsePlan(r);
    expect(p.ok).toBe(false);
    if (!p.ok) expect(p.errors.find((e) => e.path === "fastener.pitchMm")).toBeTruthy();
  });
});

describe("defaultStudPattern", () => {
  it("inline four: 5 studs a side; end studs serve one bore, the rest two at ½", () => {
    const s = defaultStudPattern("inline", 4);
    expect(s).toHaveLength(10);
    expect(s[0].serves).toEqual([{ cylinder: 1, share: 1 }]);
    expect(s[1].serves).toEqual([
      { cylinder: 1, share: 0.5 },
      { cylinder: 2, share: 0.5 },
    ]);
    expect(s[4].serves).toEqual([{ cylinder: 4, share: 1 }]);
    // every stud's shares add to 1, and per bore: ends 1 + ½ on each side = 3, middles 4 × ½ = 2
    const per = [0, 0, 0, 0];
    for (const st of s) {
      expect(st.serves.reduce((a, x) => a + x.share, 0)).toBeCloseTo(1, 12);
      for (const x of st.serves) per[x.cylinder - 1] += x.share;
    }
    expect(per).toEqual([3, 2, 2, 3]);
  });
  it("V8: per bank, bank B numbered 5–8, no stud crosses banks", () => {
    const s = defaultStudPattern("V", 8);
    expect(s).toHaveLength(20);
    for (const st of s) {
      const cyl = st.serves.map((x) => x.cylinder);
      expect(cyl.every((c) => c <= 4) || cyl.every((c) => c >= 5)).toBe(true);
    }
    expect(PlanInputSchema.shape.studs.safeParse(s).success).toBe(true);
  });
  it("denser pattern: a stud beside a single bore serves only it", () => {
    const s = defaultStudPattern("inline", 2, 5); // positions 0, .5, 1, 1.5, 2 bore pitches
    expect(s.slice(0, 5).map((x) => x.serves.map((v) => v.cylinder))).toEqual([[1], [1], [1, 2], [2], [2]]);
  });
  it("refuses an odd V", () => {
    expect(() => defaultStudPattern("V", 7)).toThrow(/even number/);
  });
});

describe("parsePlan on garbage", () => {
  it("never throws; says what is missing", () => {
    for (const raw of [null, undefined, "x", 42, {}, { engine: {} }]) {
      const p = parsePlan(raw);
      expect(p.ok).toBe(false);
    }
    const r = structuredClone(workedExampleRaw()) as Record<string, unknown>;
    delete r.fastener;
    const p = parsePlan(r);
    expect(!p.ok && p.errors.some((e) => e.path === "fastener")).toBe(true);
  });
});

describe("parsePlan on runaway sizes (fuzz)", () => {
  // The schema must not build one issue per cylinder or per stud: an API client can send anything.
  // No timing assert (machines differ); a short error list is what keeps the answer quick.
  const parse = (edit: (r: Raw) => void) => {
    const r = structuredClone(workedExampleRaw());
    edit(r);
    const p = parsePlan(r);
    expect(p.ok).toBe(false);
    return p.ok ? [] : p.errors;
  };
  it.each([1e9, 1e7])("engine.cylinders = %d: one short list that names the 16-cylinder limit", (n) => {
    const errors = parse((r) => (r.engine.cylinders = n));
    expect(errors.length).toBeLessThanOrEqual(50);
    expect(errors.some((e) => e.path === "engine.cylinders" && /16/.test(e.message))).toBe(true);
    expect(errors.some((e) => /No stud serves cylinder/.test(e.message))).toBe(false);
  });
  it("10,000 studs: a short list that names the 80-stud limit", () => {
    const errors = parse((r) => (r.studs = Array.from({ length: 10_000 }, () => ({ serves: [{ cylinder: 1, share: 1 }] }))));
    expect(errors.length).toBeLessThanOrEqual(50);
    expect(errors.some((e) => e.path === "studs" && /80/.test(e.message))).toBe(true);
  });
  it("a stud serving 10,000 cylinders: a short list that names the 16-bore limit", () => {
    const errors = parse((r) => (r.studs[0].serves = Array.from({ length: 10_000 }, (_, i) => ({ cylinder: i + 1, share: 0.0001 }))));
    expect(errors.length).toBeLessThanOrEqual(50);
    expect(errors.some((e) => e.path === "studs.0.serves" && /16/.test(e.message))).toBe(true);
  });
  it("everything at once: 1e9 cylinders and 10,000 studs of 10,000 serves each stays short", () => {
    const serves = Array.from({ length: 10_000 }, (_, i) => ({ cylinder: i + 1, share: 2 }));
    const errors = parse((r) => {
      r.engine.cylinders = 1e9;
      r.studs = Array.from({ length: 10_000 }, () => ({ serves }));
    });
    expect(errors.length).toBeLessThanOrEqual(50);
    expect(errors.some((e) => e.path === "engine.cylinders")).toBe(true);
  });
  it("within every size limit, 80 studs × 16 bad serves: the cross-field messages stop at the cap", () => {
    // 80 × 16 wrong cylinder numbers would be 1280 messages (plus duplicates and share sums) without the cap
    const errors = parse(
      (r) => (r.studs = Array.from({ length: 80 }, () => ({ serves: Array.from({ length: 16 }, () => ({ cylinder: 99, share: 0.5 })) }))),
    );
    expect(MAX_PLAN_ISSUES).toBe(50);
    expect(errors.length).toBeLessThanOrEqual(50);
    expect(errors[0].message).toBe("Stud 1 serves cylinder 99, but the engine has 4 cylinders");
  });
});
