// Stud and member stiffness and the joint's load split (app/lib/clamp/stiffness.ts).
import { describe, expect, it } from "vitest";
import {
  frustumStiffness,
  jointConstant,
  jointUnderLoad,
  loadFactorAtInnerPlane,
  memberStiffness,
  seriesCompliance,
  shigleyBoltStiffness,
  studStiffness,
  wilemanMemberStiffness,
} from "../../../../app/lib/clamp/stiffness";
import { threadGeometry } from "../../../../app/lib/clamp/thread";
import { IN_TO_MM, LBF_PER_IN_TO_N_PER_MM, PSI_TO_MPA, relErr } from "../nist";

describe("published stiffness checks (docs/references.md §3–4)", () => {
  it("Shigley 8th ed. problem 8-20: Ad 113, At 84.3 mm², E 207 GPa, lt 15, ld 30 mm → kb = 466.8 MN/m, ±0.1 %", () => {
    const kb = shigleyBoltStiffness({ shankAreaMm2: 113, stressAreaMm2: 84.3, modulusMpa: 207_000, threadLengthMm: 15, shankLengthMm: 30 });
    expect(relErr(kb, 466_800)).toBeLessThan(1e-3);
  });
  it("frustum, E 207 GPa, t 20, D 15, d 10 mm → 3503 MN/m (Shigley eq. 8-20, computed in docs/references.md §4), ±0.1 %", () => {
    expect(relErr(frustumStiffness(207_000, 20, 15, 10), 3_503_000)).toBeLessThan(1e-3);
  });
  it("Wileman fit, Shigley 8th ed. problem 8-19: d 0.625 in, l 1.5 in: cast iron 14.5 Mpsi → 9.12e6 lbf/in, steel 30 Mpsi → 19.18e6, ±0.5 %", () => {
    const d = 0.625 * IN_TO_MM;
    const l = 1.5 * IN_TO_MM;
    const iron = wilemanMemberStiffness(14.5e6 * PSI_TO_MPA, d, l, "gray-cast-iron");
    const steel = wilemanMemberStiffness(30e6 * PSI_TO_MPA, d, l, "steel");
    expect(relErr(iron, 9.12e6 * LBF_PER_IN_TO_N_PER_MM)).toBeLessThan(5e-3);
    expect(relErr(steel, 19.18e6 * LBF_PER_IN_TO_N_PER_MM)).toBeLessThan(5e-3);
  });
});

describe("seriesCompliance", () => {
  it("Σ l/(E·A): two sections add, an empty list is 0", () => {
    const a = { lengthMm: 50, areaMm2: 100, modulusMpa: 200_000 };
    expect(seriesCompliance([a])).toBeCloseTo(50 / 2e7, 15);
    expect(seriesCompliance([a, a])).toBeCloseTo(2 * seriesCompliance([a]), 15);
    expect(seriesCompliance([])).toBe(0);
  });
});

describe("studStiffness", () => {
  const thread = threadGeometry(14, 1.5);
  const base = { thread, modulusMpa: 205_000, gripMm: 100, reducedShankLengthMm: 0, freeThreadLengthMm: 20, blockModulusMpa: 100_000 };
  it("the full shank is the grip less the free thread and the reduced shank, and the end allowances are VDI 2230's (from memory)", () => {
    const s = studStiffness(base);
    expect(s.fullShankLengthMm).toBe(80);
    // shank, free thread, then 0.5·d, 0.4·d, 0.5·d (minor, nominal, minor) and 0.33·d into the block
    const lengths = [80, 20, 7, 5.6, 7, 4.62];
    expect(s.sections).toHaveLength(lengths.length);
    s.sections.forEach((x, i) => expect(x.lengthMm).toBeCloseTo(lengths[i]!, 12));
    expect(s.sections[5]!.modulusMpa).toBe(100_000);
    expect(s.stiffnessNPerMm).toBeCloseTo(1 / s.complianceMmPerN, 9);
  });
  it("a reduced shank makes the stud softer (the reason race studs have one), a longer grip too", () => {
    const plain = studStiffness(base).stiffnessNPerMm;
    const reduced = studStiffness({ ...base, reducedShankDiameterMm: 11, reducedShankLengthMm: 50 }).stiffnessNPerMm;
    expect(reduced).toBeLessThan(plain);
    expect(studStiffness({ ...base, gripMm: 130 }).stiffnessNPerMm).toBeLessThan(plain);
  });
  it("a grip shorter than the free thread leaves no full shank (never negative)", () => {
    expect(studStiffness({ ...base, gripMm: 15 }).fullShankLengthMm).toBe(0);
  });
});

describe("memberStiffness", () => {
  it("one steel layer, cones from both faces: twice the compliance of one frustum of half the grip", () => {
    const m = memberStiffness([{ name: "plate", thicknessMm: 40, modulusMpa: 207_000 }], 10, 15, 15);
    expect(relErr(m.complianceMmPerN, 2 / frustumStiffness(207_000, 20, 15, 10))).toBeLessThan(1e-9);
    expect(m.gripMm).toBe(40);
  });
  it("splitting a layer in two of the same material changes nothing; a softer layer softens the member", () => {
    const one = memberStiffness([{ name: "a", thicknessMm: 40, modulusMpa: 207_000 }], 10, 15, 15);
    const two = memberStiffness(
      [
        { name: "a", thicknessMm: 15, modulusMpa: 207_000 },
        { name: "b", thicknessMm: 25, modulusMpa: 207_000 },
      ],
      10,
      15,
      15,
    );
    expect(relErr(two.complianceMmPerN, one.complianceMmPerN)).toBeLessThan(1e-9);
    expect(two.layerCompliance.reduce((a, b) => a + b, 0)).toBeCloseTo(two.complianceMmPerN, 15);
    const soft = memberStiffness(
      [
        { name: "a", thicknessMm: 15, modulusMpa: 72_000 },
        { name: "b", thicknessMm: 25, modulusMpa: 207_000 },
      ],
      10,
      15,
      15,
    );
    expect(soft.stiffnessNPerMm).toBeLessThan(one.stiffnessNPerMm);
  });
  it("a limiting diameter caps the cone: the member can only be softer than the free cones", () => {
    const layers = [{ name: "a", thicknessMm: 80, modulusMpa: 207_000 }];
    const free = memberStiffness(layers, 10, 15, 15);
    const capped = memberStiffness(layers, 10, 15, 15, 30);
    expect(capped.stiffnessNPerMm).toBeLessThan(free.stiffnessNPerMm);
  });
});

describe("the joint (Shigley §8-7, VDI 2230 Part 1)", () => {
  it("C = kb/(kb + km): 1 and 4 → 0.2", () => {
    expect(jointConstant(1, 4)).toBeCloseTo(0.2, 15);
  });
  it("50 kN preload, 10 kN external, Φ 0.2: stud 52 kN, members 42 kN, opening at 62.5 kN", () => {
    const j = jointUnderLoad(50_000, 10_000, 0.2);
    expect(j.studLoadN).toBeCloseTo(52_000, 9);
    expect(j.memberLoadN).toBeCloseTo(42_000, 9);
    expect(j.separationLoadN).toBeCloseTo(62_500, 9);
    // at the opening load the members carry nothing (continuity of the diagram)
    expect(jointUnderLoad(50_000, j.separationLoadN, 0.2).memberLoadN).toBeCloseTo(0, 6);
  });
  it("Φn = δ_below/(δS + δP); with everything below the plane it is Shigley's C", () => {
    expect(loadFactorAtInnerPlane(1, 3, 1.5)).toBeCloseTo(0.375, 15);
    const dS = 1 / 500_000;
    const dP = 1 / 2_000_000;
    expect(loadFactorAtInnerPlane(dS, dP, dP)).toBeCloseTo(jointConstant(500_000, 2_000_000), 12);
  });
});
