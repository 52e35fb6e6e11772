// Every check in docs/references.md §1–§7, each with its source and a stated tolerance, and the
// published checks of the model's load-introduction factor, unified threads and copper hardness.
// §8 (chamber) lives in tests/unit/lib/chamber/compression.test.ts; the plate formula in plate.test.ts.
import { describe, expect, it } from "vitest";
import {
  ANNEALED_COPPER_HARDNESS_MPA,
  asmeRequirement,
  bearingDiameterMm,
  loadBore,
  loadFactorAtInnerPlane,
  looksUnified,
  PlanInputSchema,
  prepare,
  embeddingMm,
  equivalentNutFactor,
  frustumStiffness,
  jointConstant,
  jointUnderLoad,
  preloadBand,
  preloadFromTorque,
  seriesCompliance,
  shigleyBoltStiffness,
  threadGeometry,
  thermalPreloadChangeN,
  TIGHTENING_FACTOR,
  tighteningStressPerN,
  torqueForPreload,
  torquePerPreloadMm,
  unifiedStressAreaIn2,
  wilemanMemberStiffness,
} from "../../../../app/lib/clamp";
import { IN_TO_MM, LBF_PER_IN_TO_N_PER_MM, LBF_TO_N, PSI_TO_MPA, relErr } from "../nist";
import { v8Raw, workedExample } from "./fixtures";

describe("§1 thread geometry", () => {
  it("M12×1.5 stress area 88.13 mm² (computed from ISO 898-1; ISO fine-thread table 88.1, from memory)", () => {
    // ISO 68-1: d2 = 12 − 0.649519·1.5 = 11.025722; d3 = 12 − 1.226869·1.5 = 10.159697
    const t = threadGeometry(12, 1.5);
    expect(t.pitchDiameterMm).toBeCloseTo(11.025722, 5);
    expect(t.minorDiameterMm).toBeCloseTo(10.159697, 5);
    expect(t.stressAreaMm2).toBeCloseTo(88.13, 2); // computed, ±0.005
    expect(Math.abs(t.stressAreaMm2 - 88.1)).toBeLessThan(0.05); // table value (from memory), ±0.05
  });
  it("M10×1.25 stress area 61.20 mm² (computed, ISO 898-1)", () => {
    expect(threadGeometry(10, 1.25).stressAreaMm2).toBeCloseTo(61.2, 2); // ±0.005
  });
  it("M12×1.75 stress area 84.27 mm² (computed; ISO 898-1 table 84.3)", () => {
    const a = threadGeometry(12, 1.75).stressAreaMm2;
    expect(a).toBeCloseTo(84.27, 2); // ±0.005
    expect(Math.abs(a - 84.3)).toBeLessThan(0.05); // table, ±0.05
  });
  it("1/2-20 UNF 0.1599 in² tabulated, formula 0.1600 (ASME B1.1), allow ±0.0002", () => {
    const a = unifiedStressAreaIn2(0.5, 20);
    expect(Math.abs(a - 0.1599)).toBeLessThanOrEqual(0.0002);
    expect(a).toBeCloseTo(0.16, 4); // the formula's own value, ±0.00005
  });
  it("1/2-13 UNC 0.1419 in² (ASME B1.1), ±0.0001", () => {
    expect(Math.abs(unifiedStressAreaIn2(0.5, 13) - 0.1419)).toBeLessThanOrEqual(0.0001);
  });
});
describe("§1 unified threads through the model (ASME B1.1)", () => {
  // ASME B1.1 tensile stress areas, in² (from memory of the B1.1 table); ±0.0002 in² covers the table's
  // rounding to four places and the formula-vs-table difference docs/references.md notes for 1/2-20 (0.1600 vs 0.1599).
  const IN2 = IN_TO_MM * IN_TO_MM;
  it.each([
    { size: "1/2-13 UNC", dIn: 0.5, tpi: 13, tableIn2: 0.1419 },
    { size: "1/2-20 UNF", dIn: 0.5, tpi: 20, tableIn2: 0.1599 },
    { size: "7/16-14 UNC", dIn: 0.4375, tpi: 14, tableIn2: 0.1063 },
    { size: "7/16-20 UNF", dIn: 0.4375, tpi: 20, tableIn2: 0.1187 },
    { size: "3/8-16 UNC", dIn: 0.375, tpi: 16, tableIn2: 0.0775 },
  ])(
    '$size: threadGeometry(d, P, "unified") gives the B1.1 table\'s $tableIn2 in² (from memory), ±0.0002 in²',
    ({ dIn, tpi, tableIn2 }) => {
      const d = dIn * IN_TO_MM;
      const P = IN_TO_MM / tpi;
      const t = threadGeometry(d, P, "unified");
      expect(Math.abs(t.stressAreaMm2 / IN2 - tableIn2)).toBeLessThanOrEqual(0.0002);
      // and the size is recognised as unified, so a plan without a thread form gets B1.1's area
      expect(looksUnified(d, P)).toBe(true);
      // the ISO form (d2 + d3)/2 = d − 0.9382·P would give 0.6–1 % more area for the same size: the switch matters
      expect(threadGeometry(d, P, "iso").stressAreaMm2 / t.stressAreaMm2).toBeGreaterThan(1.005);
    },
  );
  it("metric sizes are not taken for unified ones: M12×1.5, M12×1.25, M14×1.5, M10×1.25, M16×1.5", () => {
    for (const [d, P] of [
      [12, 1.5],
      [12, 1.25],
      [14, 1.5],
      [10, 1.25],
      [16, 1.5],
    ])
      expect(looksUnified(d, P), `M${d}×${P}`).toBe(false);
  });
  it("a plan with 1/2-20 studs and no thread form is evaluated with the B1.1 area (0.1599 in², ±0.0002)", () => {
    const p = prepare(PlanInputSchema.parse(v8Raw()));
    expect(p.threadForm).toBe("unified");
    expect(Math.abs(p.thread.stressAreaMm2 / IN2 - 0.1599)).toBeLessThanOrEqual(0.0002);
    expect(prepare(workedExample()).threadForm).toBe("iso"); // M14×1.5
  });
});

describe("§2 torque to preload", () => {
  // 1/2-20, μG = μK = 0.12, dw = 0.75 in, dh = 0.53 in → T/F = 0.07875 in, K 0.1575 (computed, ISO 16047 form)
  const P = IN_TO_MM / 20;
  const d = 0.5 * IN_TO_MM;
  const g = { pitchMm: P, pitchDiameterMm: d - 0.649519 * P, bearingDiameterMm: ((0.75 + 0.53) / 2) * IN_TO_MM };
  const mu = { thread: 0.12, bearing: 0.12 };

  it("T/F = 0.07875 in and K = 0.1575 (computed from ISO 16047), ±0.1 %", () => {
    expect(relErr(torquePerPreloadMm(g, mu) / IN_TO_MM, 0.07875)).toBeLessThan(1e-3);
    expect(relErr(equivalentNutFactor(g, mu, d), 0.1575)).toBeLessThan(1e-3);
  });
  it("VDI's rounded form MA = F·(0.16·P + 0.58·d2·μG + μK·DKm/2) agrees within 0.5 %", () => {
    const vdi = 0.16 * g.pitchMm + 0.58 * g.pitchDiameterMm * 0.12 + (0.12 * g.bearingDiameterMm) / 2;
    expect(relErr(torquePerPreloadMm(g, mu), vdi)).toBeLessThan(5e-3);
  });
  it("torque and preload are inverses; 10,000 lbf needs 787.5 lbf·in", () => {
    const F = 10_000 * LBF_TO_N;
    const T = torqueForPreload(F, g, mu); // N·m
    // 10,000 lbf × 0.07875 in = 787.5 lbf·in = 88.98 N·m (NIST factors)
    expect(relErr(T, (787.5 * LBF_TO_N * IN_TO_MM) / 1000)).toBeLessThan(1e-3);
    expect(relErr(preloadFromTorque(T, g, mu), F)).toBeLessThan(1e-12);
  });
  it("the short-form nut factors (Shigley §8-8) bracket the long form: dry friction near 0.2, lubricated near 0.12–0.18", () => {
    // Shigley & Mischke table: zinc 0.20, lubricated 0.18, anti-seize 0.12. A long-form K at μ = 0.15 sits
    // between 0.18 and 0.20 for 1/2-20 (K ≈ 0.19), and μ = 0.08 gives close to the anti-seize 0.12.
    const k15 = equivalentNutFactor(g, { thread: 0.15, bearing: 0.15 }, d);
    const k08 = equivalentNutFactor(g, { thread: 0.08, bearing: 0.08 }, d);
    expect(k15).toBeGreaterThan(0.18);
    expect(k15).toBeLessThan(0.2);
    expect(Math.abs(k08 - 0.12)).toBeLessThan(0.01);
  });
  it("scatter band: Fmin = 2F/(1+αA), Fmax = αA·Fmin (VDI 2230); αA 1.6 → ±23.1 %", () => {
    const b = preloadBand(100_000, 1.6);
    // 2·100000/2.6 = 76 923.08; × 1.6 = 123 076.92
    expect(b.minN).toBeCloseTo(76_923.08, 1);
    expect(b.maxN).toBeCloseTo(123_076.92, 1);
    expect(b.maxN / b.minN).toBeCloseTo(1.6, 12);
  });
  it("each method's αA lies inside the published ±% range (VDI 2230 via a supplier's table)", () => {
    const half = (a: number) => (a - 1) / (a + 1);
    const ranges: Record<string, [number, number]> = {
      "torque-estimated-friction": [0.23, 0.28],
      "torque-tested-friction": [0.17, 0.23],
      "angle-or-yield": [0.05, 0.12],
      "stretch-measured": [0.09, 0.23],
    };
    for (const [m, [lo, hi]] of Object.entries(ranges)) {
      const h = half(TIGHTENING_FACTOR[m as keyof typeof TIGHTENING_FACTOR]);
      expect(h, m).toBeGreaterThanOrEqual(lo);
      expect(h, m).toBeLessThanOrEqual(hi);
    }
    // docs/references.md §2: torque wrench with estimated friction αA ≈ 1.6–1.8
    expect(TIGHTENING_FACTOR["torque-estimated-friction"]).toBeGreaterThanOrEqual(1.6);
    expect(TIGHTENING_FACTOR["torque-estimated-friction"]).toBeLessThanOrEqual(1.8);
  });
  it("stud stress while tightening (VDI 2230), M12×1.5, μG 0.12, F = 50 kN — hand arithmetic, ±0.1 %", () => {
    const t = threadGeometry(12, 1.5);
    const s = tighteningStressPerN(t, { areaMm2: t.stressAreaMm2, diameterMm: t.stressDiameterMm }, 0.12);
    // σ = 50000/88.1263 = 567.37 MPa
    // MG = 50000·(11.025722/2)·(1.5/(π·11.025722) + 1.155·0.12) = 50000·5.512861·(0.043305 + 0.1386) = 50 140 N·mm
    // Wp = π·10.592709³/16 = 233.36 mm³ → τ = 214.86 MPa (elastic); VDI's FMzul form takes ¾ of it
    // (torsion on π·d0³/12): σred = √(567.37² + 3·161.145²) = 632.31 MPa
    expect(relErr(s.axial * 50_000, 567.37)).toBeLessThan(1e-3);
    expect(relErr(s.torsion * 50_000, 214.86)).toBeLessThan(1e-3);
    expect(relErr(s.equivalent * 50_000, 632.31)).toBeLessThan(1e-3);
  });
});
describe("§2 VDI 2230 tightening table: metric fine threads, hex-head screws, μG = μK = 0.12, ν = 0.9", () => {
  // Source: a fastener supplier's table quoting VDI 2230 Part 1 (2001/2003 edition), assembly preload FM
  // and tightening torque MA at 90 % use of the minimum Rp0.2, for μG = μK = 0.12.
  // Rp0.2 minimum (ISO 898-1, from memory): 10.9 → 940 MPa, 12.9 → 1100 MPa; 8.8 → 640 MPa for d ≤ 16 mm
  // (660 MPa is the figure for d > 16 mm; with 660 the M14×1.5 8.8 row comes out 3.3 % high, with 640 it
  // matches to 0.2 %, so the table was computed with 640).
  // Bearing: hex-head dw,min (ISO 4014/4017, from memory) M12 16.6, M14 19.6, M16 22.5 mm; medium
  // clearance holes ISO 273 (from memory) 13.5 / 15.5 / 17.5 mm; DKm = (dw + dh)/2.
  const rows = [
    { size: "M12×1.25", cls: "10.9", d: 12, P: 1.25, rp: 940, fmKn: 70.5, maNm: 133, dw: 16.6, dh: 13.5 },
    { size: "M14×1.5", cls: "10.9", d: 14, P: 1.5, rp: 940, fmKn: 95.2, maNm: 209, dw: 19.6, dh: 15.5 },
    { size: "M14×1.5", cls: "12.9", d: 14, P: 1.5, rp: 1100, fmKn: 111.4, maNm: 244, dw: 19.6, dh: 15.5 },
    { size: "M16×1.5", cls: "10.9", d: 16, P: 1.5, rp: 940, fmKn: 128.7, maNm: 320, dw: 22.5, dh: 17.5 },
    { size: "M14×1.5", cls: "8.8", d: 14, P: 1.5, rp: 640, fmKn: 64.8, maNm: 142, dw: 19.6, dh: 15.5 },
  ];
  const mu = { thread: 0.12, bearing: 0.12 };

  // Tolerance 1.5 %: the table rounds FM to 0.1 kN (≤ 0.15 %) and works from the minimum Rp0.2; the rest
  // is room for the table's rounded constants. A different stress formula shows as several per cent:
  // with the elastic Wp = π·d0³/16 the model put FM 6.0–6.3 % under every row; it now takes the
  // torsion on π·d0³/12 as VDI's FMzul does (the next test shows the formula the table follows).
  it.each(rows)("$size $cls: FM = 0.9·Rp0.2 / σred per newton (the model's tightening stress) gives $fmKn kN, ±1.5 %", (r) => {
    const t = threadGeometry(r.d, r.P);
    const perN = tighteningStressPerN(t, { areaMm2: t.stressAreaMm2, diameterMm: t.stressDiameterMm }, mu.thread);
    const fm = (0.9 * r.rp) / perN.equivalent;
    expect(relErr(fm / 1000, r.fmKn)).toBeLessThan(0.015);
  });

  it.each(rows)(
    "$size $cls: the table itself follows VDI's FMzul = As·ν·Rp0.2/√(1 + 3·[3/2·(d2/d0)·(P/(π·d2) + 1.155·μG)]²), ±0.5 %",
    (r) => {
      // VDI 2230 Part 1 FMzul with the plastic torsion modulus π·d0³/12, hence 3/2 where the elastic π·d0³/16
      // gives 2 (from memory). This checks the transcription of the table and names the formula it follows.
      const t = threadGeometry(r.d, r.P);
      const k = 1.5 * (t.pitchDiameterMm / t.stressDiameterMm) * (r.P / (Math.PI * t.pitchDiameterMm) + 1.155 * mu.thread);
      const fm = (t.stressAreaMm2 * 0.9 * r.rp) / Math.sqrt(1 + 3 * k * k);
      expect(relErr(fm / 1000, r.fmKn)).toBeLessThan(0.005);
    },
  );

  // Tolerance 3 %: dw,min and the ISO 273 holes are recalled, not read; the table rounds MA to 1 N·m and
  // uses VDI's rounded 0.16·P and 0.58·d2 (0.5 % apart from the exact long form, see above).
  it.each(rows)("$size $cls: MA = FM × long form (ISO 16047) with DKm = (dw + dh)/2 gives $maNm N·m, ±3 %", (r) => {
    const t = threadGeometry(r.d, r.P);
    const g = { pitchMm: r.P, pitchDiameterMm: t.pitchDiameterMm, bearingDiameterMm: bearingDiameterMm(r.dw, r.dh) };
    expect(relErr(torqueForPreload(r.fmKn * 1000, g, mu), r.maNm)).toBeLessThan(0.03);
  });
});

describe("§3 stud stiffness", () => {
  it("Shigley 8th ed. problem 8-20: Ad 113, At 84.3, E 207 GPa, lt 15, ld 30 → 466.8 MN/m, ±0.05 %", () => {
    const k = shigleyBoltStiffness({ shankAreaMm2: 113, stressAreaMm2: 84.3, modulusMpa: 207_000, threadLengthMm: 15, shankLengthMm: 30 });
    expect(relErr(k, 466_800)).toBeLessThan(5e-4); // N/mm = kN/m; 466.8 MN/m = 466 800 N/mm
  });
  it("sections in series give the same as eq. 8-17 for the same two sections (Shigley §8-4)", () => {
    const c = seriesCompliance([
      { lengthMm: 30, areaMm2: 113, modulusMpa: 207_000 },
      { lengthMm: 15, areaMm2: 84.3, modulusMpa: 207_000 },
    ]);
    expect(relErr(1 / c, 466_800)).toBeLessThan(5e-4);
  });
});

describe("§4 member stiffness and the joint", () => {
  it("Shigley 8th ed. problem 8-19, Wileman fit: d 0.625 in, l 1.5 in, cast iron 14.5 Mpsi → 9.12×10⁶ lbf/in, ±0.1 %", () => {
    const k = wilemanMemberStiffness(14.5e6 * PSI_TO_MPA, 0.625 * IN_TO_MM, 1.5 * IN_TO_MM, "gray-cast-iron");
    expect(relErr(k / LBF_PER_IN_TO_N_PER_MM, 9.12e6)).toBeLessThan(1e-3);
  });
  it("Shigley 8th ed. problem 8-19, Wileman fit: steel 30 Mpsi → 19.18×10⁶ lbf/in, ±0.1 %", () => {
    const k = wilemanMemberStiffness(30e6 * PSI_TO_MPA, 0.625 * IN_TO_MM, 1.5 * IN_TO_MM, "steel");
    expect(relErr(k / LBF_PER_IN_TO_N_PER_MM, 19.18e6)).toBeLessThan(1e-3);
  });
  it("Shigley eq. 8-20 frustum: E 207 GPa, t 20, D 15, d 10 → 3503 MN/m, ±0.05 %", () => {
    expect(relErr(frustumStiffness(207_000, 20, 15, 10), 3_503_000)).toBeLessThan(5e-4);
  });
  it("joint (Shigley §8-7): C = kb/(kb+km); Fb = Fi + C·P; Fm = Fi − (1−C)·P; P0 = Fi/(1−C)", () => {
    // kb 466.8, km 3503 MN/m → C = 466.8/3969.8 = 0.117588; Fi 40 kN, P 10 kN
    const C = jointConstant(466_800, 3_503_000);
    expect(C).toBeCloseTo(0.117588, 6);
    const j = jointUnderLoad(40_000, 10_000, C);
    expect(j.studLoadN).toBeCloseTo(41_175.88, 1);
    expect(j.memberLoadN).toBeCloseTo(31_175.88, 1);
    expect(j.separationLoadN).toBeCloseTo(45_330.29, 1); // 40000/0.8824123
  });
});
describe("§4 load introduced inside the joint (VDI 2230 Φn; Shigley's joint diagram with the load plane moved)", () => {
  it("n = 1 (all of the members below the load plane): Φn = C and the joint gives Shigley §8-7's numbers", () => {
    // Shigley 8th ed. problem values (docs/references.md §3–§4): kb 466.8, km 3503 MN/m, Fi 40 kN, P 10 kN
    const dS = 1 / 466_800;
    const dP = 1 / 3_503_000;
    const phi = loadFactorAtInnerPlane(dS, dP, dP);
    expect(phi).toBeCloseTo(jointConstant(466_800, 3_503_000), 12);
    const j = jointUnderLoad(40_000, 10_000, phi);
    // Fb = Fi + C·P = 40 000 + 0.117588·10 000; Fm = Fb − P; P0 = Fi/(1 − C)
    expect(j.studLoadN).toBeCloseTo(41_175.88, 1);
    expect(j.memberLoadN).toBeCloseTo(31_175.88, 1);
    expect(j.separationLoadN).toBeCloseTo(45_330.29, 1);
  });

  it("load at an inner plane: the compatibility conditions, solved by hand, give a gasket loss of (1 − Φn)·P > (1 − C)·P", () => {
    // Stated case (ours): stud δS = 2e-6 mm/N; head (above the load plane) δA = 1e-6; gasket + block
    // (below) δB = 0.5e-6; preload 40 kN; gas load P = 10 kN on the head at the gasket plane.
    const dS = 2e-6;
    const dA = 1e-6;
    const dB = 0.5e-6;
    const P = 10_000;
    // The head carries the stud force (nut on top), so ΔFA = ΔFS; head equilibrium: ΔFS = ΔFB + P.
    // Compatibility (stud stretch change = −(change of compression above + below)):
    //   δS·ΔFS + δA·ΔFA + δB·ΔFB = 0  →  (δS + δA)·ΔFS + δB·ΔFB = 0
    //   ΔFS − ΔFB = P
    // Cramer's rule on [[δS + δA, δB], [1, −1]]·[ΔFS, ΔFB] = [0, P]:
    const det = -(dS + dA) - dB;
    const dFS = (0 * -1 - dB * P) / det;
    const dFB = ((dS + dA) * P - 0) / det;
    // by hand: det = −3.5e-6; ΔFS = −0.5e-6·10 000/−3.5e-6 = 1428.571 N; ΔFB = 3e-6·10 000/−3.5e-6 = −8571.429 N
    expect(dFS).toBeCloseTo(1428.571, 3);
    expect(dFB).toBeCloseTo(-8571.429, 3);
    // the model's Φn = δB/(δS + δP) = 0.5/3.5 = 0.142857: the stud gains Φn·P, the gasket loses (1 − Φn)·P
    const phi = loadFactorAtInnerPlane(dS, dA + dB, dB);
    expect(phi).toBeCloseTo(0.142857, 6);
    const j = jointUnderLoad(40_000, P, phi);
    expect(j.studLoadN - 40_000).toBeCloseTo(dFS, 6);
    expect(j.memberLoadN - 40_000).toBeCloseTo(dFB, 6);
    // Shigley's C = δP/(δS + δP) = 1.5/3.5 = 0.428571 would have the gasket lose only 5714.29 N
    const C = jointConstant(1 / dS, 1 / (dA + dB));
    expect(C).toBeCloseTo(0.428571, 6);
    expect((1 - C) * P).toBeCloseTo(5714.286, 3);
    expect(-dFB).toBeGreaterThan((1 - C) * P);
  });

  it("the model takes Φn from the layers under the gasket plane and relieves each bore by (1 − Φn)·H (worked example)", () => {
    const p = prepare(workedExample());
    const below = p.layers.reduce((s, l, i) => s + (l.name === "gasket" || l.name === "block" ? p.member.layerCompliance[i] : 0), 0);
    expect(below).toBeGreaterThan(0);
    expect(p.phi).toBeCloseTo(below / (p.stud.complianceMmPerN + p.member.complianceMmPerN), 12);
    expect(p.reliefPerBoreN).toBeCloseTo((1 - p.phi) * p.requirement.pressureForceN, 6);
    // the head is on the stud's side: Φn < C, so the gasket loses more than Shigley's (1 − C)·H
    expect(p.phi).toBeLessThan(p.C);
    expect(p.reliefPerBoreN).toBeGreaterThan((1 - p.C) * p.requirement.pressureForceN);
  });
});

describe("§5 settling and heat", () => {
  it("embedding amounts (VDI 2230 table, from memory): Rz 10–40, 2 threads + 1 bearing + 2 inner = 13 µm", () => {
    // from memory: 3 per thread, 3 per bearing, 2 per inner interface → 2·3 + 3 + 2·2 = 13 µm
    expect(embeddingMm("rz-10-40", { threads: 2, bearings: 1, innerInterfaces: 2 })).toBeCloseTo(0.013, 9);
    // Rz < 10: 2·3 + 2.5 + 2·1.5 = 11.5 µm; Rz 40–160: 2·3 + 4 + 2·3 = 16 µm (from memory)
    expect(embeddingMm("rz-under-10", { threads: 2, bearings: 1, innerInterfaces: 2 })).toBeCloseTo(0.0115, 9);
    expect(embeddingMm("rz-40-160", { threads: 2, bearings: 1, innerInterfaces: 2 })).toBeCloseTo(0.016, 9);
  });
  it("heat (VDI 2230 form, from memory; Bickford eqs. 11.12–11.13): aluminium on steel gains preload", () => {
    // 80 mm A356 (21.4 µm/m°C) on a steel stud (12.3), both +70 °C; δS = 4e-6, δP = 1e-6 mm/N
    // ΔF = 80·(21.4 − 12.3)e-6·70 / 5e-6 = 0.05096 mm / 5e-6 = 10 192 N
    const dF = thermalPreloadChangeN({
      members: [{ thicknessMm: 80, expansionUmPerMC: 21.4, temperatureC: 90 }],
      studLengthMm: 80,
      studExpansionUmPerMC: 12.3,
      studTemperatureC: 90,
      assemblyTemperatureC: 20,
      studComplianceMmPerN: 4e-6,
      memberComplianceMmPerN: 1e-6,
    });
    expect(dF).toBeCloseTo(10_192, 6);
    expect(dF).toBeGreaterThan(0);
  });
});

describe("§6 gasket seal (ASME BPVC VIII-1 App. 2)", () => {
  // copper band OD 4.280 in, width 0.125 in: b0 = b = 0.0625 in, G = 4.155 in, P = 2000 psi, m 4.75, y 13 000 psi
  const r = asmeRequirement(4.155 * IN_TO_MM, 0.125 * IN_TO_MM, 2000 * PSI_TO_MPA, 4.75, 13_000 * PSI_TO_MPA);
  const toLbf = (n: number) => n / LBF_TO_N;
  it("b0 = b = 0.0625 in, G = 4.155 in", () => {
    expect(r.basicWidthMm / IN_TO_MM).toBeCloseTo(0.0625, 9);
    expect(r.effectiveWidthMm / IN_TO_MM).toBeCloseTo(0.0625, 9);
    expect(r.reactionDiameterMm / IN_TO_MM).toBeCloseTo(4.155, 9);
  });
  it("Wm1 = 42,597 lbf and Wm2 = 10,600 lbf (computed in docs/references.md with π ≈ 3.14), ±0.1 %", () => {
    // With π exact: H = π/4·4.155²·2000 = 27 118.4; Hp = 2·0.0625·π·4.155·4.75·2000 = 15 500.8 → Wm1 = 42 619.1;
    // Wm2 = π·0.0625·4.155·13000 = 10 605.8. docs/references.md's figures match π = 3.14 (42 597.4 / 10 600.4); both within 0.1 %.
    expect(relErr(toLbf(r.operatingBoltLoadN), 42_597)).toBeLessThan(1e-3);
    expect(relErr(toLbf(r.seatingLoadN), 10_600)).toBeLessThan(1e-3);
    expect(relErr(toLbf(r.operatingBoltLoadN), 42_619.1)).toBeLessThan(2e-5);
    expect(relErr(toLbf(r.seatingLoadN), 10_605.8)).toBeLessThan(2e-5);
  });
  it("wide band: b = 2.5·√b0 (mm) once b0 > 6 mm", () => {
    const w = asmeRequirement(200, 16, 1, 3, 10); // b0 = 8 mm → b = 2.5·√8 = 7.0711; G = OD − 2b = 216 − 14.142 = 201.858
    expect(w.effectiveWidthMm).toBeCloseTo(7.0711, 4);
    expect(w.reactionDiameterMm).toBeCloseTo(201.858, 3);
  });
});

describe("annealed copper's hardness as the wire's indentation limit", () => {
  // Copper Development Association (UK) temper data: annealed copper H040 is 40–65 HV; the model takes the
  // lower bound. 1 HV = 1 kgf/mm² = 9.80665 MPa (standard gravity, NIST SP 811); the code's 9.807 is within 0.01 %.
  it("40 HV → 392.3 MPa, ±0.05 MPa", () => {
    expect(Math.abs(ANNEALED_COPPER_HARDNESS_MPA - 40 * 9.80665)).toBeLessThan(0.05);
    expect(ANNEALED_COPPER_HARDNESS_MPA).toBeCloseTo(392.3, 1);
  });
  it("a solid-copper plan without its own hardness figure limits the seal line at that hardness × π·G·w", () => {
    // v8 fixture: G = 108 mm, w = 1.0 mm → 392.28 × π × 108 × 1.0 = 133 097 N (computed)
    const p = prepare(PlanInputSchema.parse(v8Raw()));
    expect(p.plan.gasket.sealLineHardnessMpa).toBeUndefined();
    expect(p.lineLimitN).toBeCloseTo(ANNEALED_COPPER_HARDNESS_MPA * Math.PI * 108 * 1.0, 6);
    expect(relErr(p.lineLimitN, 133_097)).toBeLessThan(1e-4);
    // and the seal line carries no more than that however hard it is clamped
    expect(loadBore(p.paths, 5 * p.lineLimitN).lineN).toBeCloseTo(p.lineLimitN, 6);
  });
});
