import { describe, expect, it } from "vitest";
import { evaluatePlan, parsePlan, threadGeometry } from "../../../../app/lib/clamp";
import { stretchLine, stretchLineFor, studStiffnessFor, withStretchTarget } from "../../../../app/lib/plan/stretch";
import { workedExampleRaw } from "../clamp/fixtures";

describe("stretch ⇄ preload through the stud's stiffness", () => {
  const raw = workedExampleRaw();
  const k = studStiffnessFor(raw)!;

  it("the stud stiffness lies between a bar of minor area and one of nominal area over the grip (Shigley §8-4 bounds)", () => {
    const t = threadGeometry(14, 1.5);
    const gripMm = 90 + 1.3; // head at the stud + gasket; no washer, no block depth in the worked example
    const E = 205_000;
    // the engaged-thread allowances add about 1.7·d of length at the ends (VDI 2230)
    expect(k).toBeLessThan((E * t.nominalAreaMm2) / gripMm);
    expect(k).toBeGreaterThan((E * t.minorAreaMm2) / (gripMm + 2 * 14));
  });

  it("a target stretch becomes that stretch × k of preload, and the estimate follows it", () => {
    const stretched = withStretchTarget(raw, 0.2);
    expect(stretched.tightening.target).toEqual({ mode: "preload", preloadN: 0.2 * k });
    const parsed = parsePlan(stretched);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const e = evaluatePlan(parsed.plan);
    expect(e.tightening.preload.nominalN).toBeCloseTo(0.2 * k, 6);
    const line = stretchLineFor(stretched)!;
    expect(line.mode).toBe("stretch");
    expect(line.stretchMm).toBeCloseTo(0.2, 12);
    expect(line.torqueNm).toBeCloseTo(e.tightening.torqueNm, 9);
  });

  it("by torque, the line gives the stretch that torque's preload makes, and back again", () => {
    const line = stretchLineFor(raw)!;
    expect(line.mode).toBe("torque");
    expect(line.torqueNm).toBe(180);
    expect(line.stretchMm * k).toBeCloseTo(line.preloadN, 6);
    // that stretch as a target gives back the same torque
    expect(stretchLineFor(withStretchTarget(raw, line.stretchMm))!.torqueNm).toBeCloseTo(180, 6);
  });

  it("says nothing for an input that is not valid yet", () => {
    const broken = { ...raw, fastener: { ...raw.fastener, diameterMm: -1 } };
    expect(studStiffnessFor(broken)).toBeNull();
    expect(withStretchTarget(broken, 0.2)).toBe(broken);
    expect(stretchLine("torque", 1000, 100, null)).toBeNull();
  });
});
