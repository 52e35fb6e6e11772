// Typical figures per gasket family (app/lib/clamp/gasket-families.ts).
import { describe, expect, it } from "vitest";
import { ANNEALED_COPPER_HARDNESS_MPA, TYPICAL_GASKETS } from "../../../../app/lib/clamp/gasket-families";
import { GASKET_TYPES } from "../../../../app/lib/clamp/schema";
import { PSI_TO_MPA, relErr } from "../nist";

describe("TYPICAL_GASKETS", () => {
  it("has one entry for each gasket type of the schema", () => {
    expect(Object.keys(TYPICAL_GASKETS).sort()).toEqual([...GASKET_TYPES].sort());
  });
  it("flange stand-ins are ASME BPVC VIII-1 Appendix 2, Table 2-5.1: copper m 4.75, y 13,000 psi; soft steel 5.50, 18,000 psi", () => {
    expect(TYPICAL_GASKETS["solid-copper"].m).toBe(4.75);
    expect(relErr(TYPICAL_GASKETS["solid-copper"].yMpa, 13_000 * PSI_TO_MPA)).toBeLessThan(1e-9);
    expect(TYPICAL_GASKETS.mls.m).toBe(5.5);
    expect(relErr(TYPICAL_GASKETS.mls.yMpa, 18_000 * PSI_TO_MPA)).toBeLessThan(1e-9);
    expect(TYPICAL_GASKETS.mls.yMpa).toBeCloseTo(124.1, 1);
  });
  it("annealed copper: 40 HV (the low end of 40–65 HV for temper H040, copper industry data) = 392.28 MPa", () => {
    expect(ANNEALED_COPPER_HARDNESS_MPA).toBeCloseTo(392.28, 2);
    expect(TYPICAL_GASKETS["solid-copper"].sealLineHardnessMpa).toBe(ANNEALED_COPPER_HARDNESS_MPA);
  });
  it("every figure is positive and finite, relaxation a percentage, and each family says where its figures come from", () => {
    for (const g of Object.values(TYPICAL_GASKETS)) {
      for (const x of [g.ringModulusMpa, g.sealLineHardnessMpa, g.sealLineYieldMpa, g.bodyModulusMpa, g.m, g.yMpa, g.bodySealPressureMpa]) {
        expect(Number.isFinite(x) && x > 0).toBe(true);
      }
      expect(g.relaxationPercent).toBeGreaterThanOrEqual(0);
      expect(g.relaxationPercent).toBeLessThan(100);
      expect(g.notes.length).toBeGreaterThan(20);
    }
  });
  it("the ring moduli are steel's (≈ 193–200 GPa, docs/references.md §7: 300-series wire 193 GPa)", () => {
    for (const g of Object.values(TYPICAL_GASKETS)) {
      expect(g.ringModulusMpa).toBeGreaterThanOrEqual(193_000);
      expect(g.ringModulusMpa).toBeLessThanOrEqual(200_000);
    }
  });
});
