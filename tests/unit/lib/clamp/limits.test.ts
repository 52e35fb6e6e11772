// The working state (VDI 2230 Part 1, hot and fired at the top of the band), the thread in the block,
// and the one verdict that carries the worst check. Hand arithmetic beside each figure.
import { describe, expect, it } from "vitest";
import { evaluatePlan, PlanInputSchema, prepare, TORSION_RELIEF, workingState, type PlanInput } from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { demoFourRaw, workedExample } from "./fixtures";

describe("working state (VDI 2230 Part 1)", () => {
  const p = prepare(PlanInputSchema.parse(demoFourRaw()));
  const w = workingState(p, 100_000);
  // one bore fires at a time: FA is the biggest single bore's share any stud sees
  const fa = Math.max(...p.studPeakFiringN);

  it("stud load hot and fired = FMmax + thermal gain + Φn·FA", () => {
    // VDI 2230: FSmax = FMmax + ΔFth + Φn·FA; the thermal gain counts only when positive (aluminium head)
    expect(p.thermalChangeN).toBeGreaterThan(0);
    expect(w.studLoadN).toBeCloseTo(100_000 + p.thermalChangeN + p.phi * fa, 6);
  });
  it("equivalent stress √(σ² + 3·(kτ·τ)²) with kτ = 0.5 (VDI 2230, from memory) on the smallest section", () => {
    expect(TORSION_RELIEF).toBe(0.5);
    // ½-20 with a 0.41 in reduced shank: A0 = π/4·10.414² = 85.178 mm² (the shank, smaller than As 103.195)
    expect(p.section.areaMm2).toBeCloseTo((Math.PI / 4) * 10.414 ** 2, 6);
    const sigma = w.studLoadN / p.section.areaMm2;
    const tau = 0.5 * p.stressPerN.torsion * 100_000;
    expect(w.axialMpa).toBeCloseTo(sigma, 9);
    expect(w.torsionMpa).toBeCloseTo(tau, 9);
    expect(w.equivalentMpa).toBeCloseTo(Math.sqrt(sigma * sigma + 3 * tau * tau), 9);
    expect(w.utilization).toBeCloseTo(w.equivalentMpa / 1379, 12);
  });
  it("fatigue: σa = Φn·FA/(2·As) against σASV = 0.85·(150/d + 45) (VDI 2230, rolled before heat treatment, from memory)", () => {
    expect(w.amplitudeMpa).toBeCloseTo((p.phi * fa) / (2 * p.thread.stressAreaMm2), 9);
    // d = 12.7 mm: 0.85·(150/12.7 + 45) = 0.85·56.811 = 48.289 MPa
    expect(w.enduranceMpa).toBeCloseTo(48.289, 3);
    // rolled after heat treatment: σASG = (2 − FS/F0.2)·σASV (VDI 2230, from memory), F0.2 = Rp0.2·A0
    const rolled = prepare(
      PlanInputSchema.parse({ ...demoFourRaw(), fastener: { ...demoFourRaw().fastener, rolledAfterHeatTreatment: true } }),
    );
    const wr = workingState(rolled, 100_000);
    const f02 = 1379 * rolled.section.areaMm2;
    expect(wr.enduranceMpa).toBeCloseTo((2 - wr.studLoadN / f02) * 48.289, 2);
  });
  it("thread in the block: shear area π·d·Le·(1/2 + 0.57735·(d − d2)/P) = 0.875·π·d·Le (FED-STD-H28/2 / ASME B1.1, from memory), τ = Rp/√3", () => {
    // ductile iron 65-45-12, yield 310 MPa (ASTM A536): τ = 310/√3 = 178.979 MPa
    expect(w.blockShearMpa).toBeCloseTo(310 / Math.sqrt(3), 9);
    // d = 12.7, Le = 28: 0.875·π·12.7·28 = 977.50 mm² → 174 953 N
    expect(relErr(w.stripCapacityN as number, 178.979 * 0.875 * Math.PI * 12.7 * 28)).toBeLessThan(1e-5);
    expect(relErr(w.stripCapacityN as number, 174_953)).toBeLessThan(1e-4);
    expect(w.minEngagementMm).toBeCloseTo((28 * w.studLoadN) / (w.stripCapacityN as number), 9);
    // a block without yield or shear strength (gray iron) is not checked, and never decides the verdict
    const iron = evaluatePlan(workedExample());
    const strip = iron.verdict.checks.find((c) => c.id === "thread-strip");
    expect(strip?.checked).toBe(false);
    expect(iron.verdict.limiting).not.toBe("thread-strip");
  });
});

describe("one verdict: the worst of every check", () => {
  // Every check passes comfortably in this plan: worked example at a low 3 MPa peak pressure, a 1.0 target,
  // and an iron-like 900 MPa bearing limit under the washer.
  const base = workedExample();
  const ok: PlanInput = {
    ...base,
    targetMargin: 1,
    firing: { mode: "entered", peakPressureMpa: 3 },
    head: { ...base.head, limitingSurfacePressureMpa: 900 },
  };
  const withYield = (yieldMpa: number): PlanInput => ({ ...ok, fastener: { ...ok.fastener, yieldMpa } });
  const u0 = evaluatePlan(ok).studStress.atMax.utilization;

  it("holds when every check passes, and says so", () => {
    const e = evaluatePlan(ok);
    expect(e.verdict.status).toBe("holds");
    expect(e.verdict.headline).toMatch(/^Every check passed; the weakest seal margin is \d\.\d\d in cylinder \d$/);
    for (const c of e.verdict.checks) if (c.checked) expect(c.status, c.id).toBe("holds");
  });
  it("the new-user trial's case: the same plan with its stud at 169 % of yield reads short, naming the stud", () => {
    const e = evaluatePlan(withYield((1379 * u0) / 1.69));
    expect(e.studStress.atMax.utilization).toBeCloseTo(1.69, 9);
    // the seal is as good as before, the verdict is not
    expect(e.verdict.checks.find((c) => c.id === "seal")?.status).toBe("holds");
    expect(e.verdict.status).toBe("short");
    // past yield both while tightened and hot and fired: whichever is further under its limit names it
    expect(["stud-assembly", "stud-working"]).toContain(e.verdict.limiting);
    expect(e.verdict.headline).toMatch(/^Stud past yield (at the top of the scatter band|hot and under firing)$/);
  });
  it("between the 90 % tightening limit (VDI 2230 ν = 0.9) and yield the plan reads thin", () => {
    const e = evaluatePlan(withYield((1379 * u0) / 0.95));
    expect(e.verdict.status).toBe("thin");
    expect(e.verdict.limiting).toBe("stud-assembly");
    expect(e.verdict.headline).toBe("Stud over the 90 % tightening limit at the top of the scatter band");
  });
  it("a stud fine at assembly but past yield hot and fired (head and block at 400 °C) reads short on the working state", () => {
    const e = evaluatePlan({ ...ok, temperatures: { ...ok.temperatures, headC: 400, blockC: 400 } });
    expect(e.studStress.atMax.utilization).toBeLessThan(0.9);
    expect(e.studStress.working.utilization).toBeGreaterThanOrEqual(1);
    expect(e.verdict.status).toBe("short");
    expect(e.verdict.limiting).toBe("stud-working");
    expect(e.verdict.headline).toBe("Stud past yield hot and under firing");
  });
  it("the seal check is taken at the bottom of the band: its margin is below the nominal one", () => {
    const e = evaluatePlan(workedExample());
    const seal = e.verdict.checks.find((c) => c.id === "seal");
    expect(seal?.ratio).toBe(e.weakestMargin);
    expect(e.weakestMargin).toBeLessThan(e.weakestMarginNominal);
    // the weakest bore at the bottom of the band is the one the verdict names
    expect(seal?.cylinder).toBe(e.weakestCylinder);
  });
  it("a weak seal under firing names the cylinder", () => {
    const e = evaluatePlan({ ...ok, firing: { mode: "entered", peakPressureMpa: 30 } });
    expect(e.verdict.status).toBe("short");
    expect(e.verdict.headline).toMatch(/^(Seal short under firing in cylinder \d|Gasket body short of seal in cylinder \d)/);
  });
});
