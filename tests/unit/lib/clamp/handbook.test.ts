// docs/references.md §7 materials and §6 gasket factors as carried in app/lib/clamp/handbook.ts.
// These are transcription checks (a wrong digit fails) plus the one conversion in the table.
import { describe, expect, it } from "vitest";
import {
  ANNEALED_COPPER_HARDNESS_MPA,
  ASME_GASKET_FACTORS,
  FASTENER_CLASSES,
  HANDBOOK_MATERIALS,
  LIMITING_SURFACE_PRESSURE_MPA,
  TYPICAL_GASKETS,
} from "../../../../app/lib/clamp";
import { HANDBOOK_MATERIAL_ROWS } from "../../../../app/lib/library/seed-data";
import { PSI_TO_MPA, relErr } from "../nist";

describe("§7 materials (typical or minimum, as docs/references.md notes)", () => {
  it.each([
    ["a356-t6", 72_400, 165, 21.4, 380, /Aluminum Association data via MatWeb/],
    ["6061-t6", 68_900, 276, 23.6, 260, /MatWeb/],
    ["7075-t6", 71_700, 503, 23.4, null, /MatWeb/],
    ["gray-iron-30-40", 100_000, null, 10.8, 900, /ASTM A48; Shigley table A-5/],
    ["ductile-65-45-12", 169_000, 310, 11.5, 900, /ASTM A536/],
    ["4340-qt", 205_000, 1379, 12.3, null, /MatWeb/],
    ["stainless-300-wire", 193_000, 207, 17.3, null, /MatWeb/],
    ["c11000-annealed", 115_000, 70, 17.0, null, /copper producer data sheet/i],
    ["stud-iso-12.9", 205_000, 970, 12, null, /ISO 898-1/],
    ["stud-sae-grade-8", 205_000, 896.3, 12, null, /SAE J429/],
  ] as const)("%s: E %d MPa, yield %s MPa, α %d µm/m·°C, limiting pressure %s MPa (%s)", (key, E, y, a, p, source) => {
    const m = HANDBOOK_MATERIALS[key];
    expect(m.modulusMpa).toBe(E);
    expect(m.yieldMpa).toBe(y);
    expect(m.expansionUmPerMC).toBe(a);
    expect(m.limitingSurfacePressureMpa).toBe(p);
    expect(m.source).toMatch(source);
  });
  it("gray iron: Shigley table A-24 class 30 torsional shear strength 40 kpsi = 276 MPa (NIST SP 811)", () => {
    const g = HANDBOOK_MATERIALS["gray-iron-30-40"];
    expect(relErr(g.shearStrengthMpa, 40_000 * PSI_TO_MPA)).toBeLessThan(1e-3);
  });
  it("the shop's starting library is seeded from this one table, every figure and source as here", () => {
    const entries = Object.values(HANDBOOK_MATERIALS);
    expect(HANDBOOK_MATERIAL_ROWS).toHaveLength(entries.length);
    HANDBOOK_MATERIAL_ROWS.forEach((row, i) => {
      const m = entries[i];
      expect(row.name).toBe(m.name);
      expect(row.modulus_mpa).toBe(m.modulusMpa);
      expect(row.yield_mpa).toBe(m.yieldMpa);
      expect(row.expansion_um_per_m_c).toBe(m.expansionUmPerMC);
      expect(row.limiting_surface_pressure_mpa).toBe(m.limitingSurfacePressureMpa);
      expect(row.source).toBe(m.source);
    });
  });
  it("fastener classes: ISO 898-1 10.9 proof 830, 12.9 proof 970; SAE J429 grade 8 130 ksi yield = 896.3 MPa (NIST SP 811)", () => {
    expect(FASTENER_CLASSES["iso-10.9"].proofMpa).toBe(830);
    expect(FASTENER_CLASSES["iso-12.9"].proofMpa).toBe(970);
    // 130 000 psi × 0.006894757 MPa/psi = 896.318 MPa, ±0.01 %
    expect(relErr(FASTENER_CLASSES["sae-grade-8"].yieldMpa, 130_000 * PSI_TO_MPA)).toBeLessThan(1e-4);
    expect(FASTENER_CLASSES["sae-grade-8"].yieldMpa).toBeCloseTo(896.318, 2);
    expect(FASTENER_CLASSES["sae-grade-8"].tensileMpa).toBeCloseTo(1034.21, 1);
  });
  it("limiting surface pressures (VDI 2230 2003 via a catalogue)", () => {
    expect(LIMITING_SURFACE_PRESSURE_MPA).toEqual({
      "AlSi7Mg heat-treated (cast)": 380,
      "AlSi9Cu3 die cast": 290,
      AlMgSi1: 260,
      "GJL-250 gray iron": 900,
      "GJS-500 ductile iron": 900,
    });
  });
  it("§6 ASME Table 2-5.1 m / y (flange design values)", () => {
    expect(ASME_GASKET_FACTORS["solid flat copper"]).toEqual({ m: 4.75, yPsi: 13_000 });
    expect(ASME_GASKET_FACTORS["solid flat soft steel"]).toEqual({ m: 5.5, yPsi: 18_000 });
    expect(ASME_GASKET_FACTORS["solid flat stainless"]).toEqual({ m: 6.5, yPsi: 26_000 });
    expect(ASME_GASKET_FACTORS["solid flat aluminium"]).toEqual({ m: 4.0, yPsi: 8_800 });
    expect(ASME_GASKET_FACTORS["corrugated metal, copper"]).toEqual({ m: 3.0, yPsi: 4_500 });
    expect(ASME_GASKET_FACTORS["ring joint, soft steel"]).toEqual({ m: 5.5, yPsi: 18_000 });
    expect(ASME_GASKET_FACTORS["spiral-wound stainless"]).toEqual({ m: 3.0, yPsi: 10_000 });
  });
  it("§5 statement: an aluminium head on steel studs gains preload when hot (handbook expansions)", () => {
    expect(HANDBOOK_MATERIALS["a356-t6"].expansionUmPerMC).toBeGreaterThan(HANDBOOK_MATERIALS["4340-qt"].expansionUmPerMC);
  });
});

describe("typical gasket families (gasket-families.ts): the published figures they carry", () => {
  it("ASME VIII-1 Table 2-5.1 stand-ins: solid copper 4.75 / 13 000 psi, the steel families soft steel 5.50 / 18 000 psi", () => {
    const copper = ASME_GASKET_FACTORS["solid flat copper"];
    const steel = ASME_GASKET_FACTORS["solid flat soft steel"];
    expect(TYPICAL_GASKETS["solid-copper"].m).toBe(copper.m);
    expect(TYPICAL_GASKETS["solid-copper"].yMpa).toBeCloseTo(copper.yPsi * PSI_TO_MPA, 9);
    for (const f of ["mls", "mls-with-ring", "fire-ring"] as const) {
      expect(TYPICAL_GASKETS[f].m, f).toBe(steel.m);
      expect(TYPICAL_GASKETS[f].yMpa, f).toBeCloseTo(steel.yPsi * PSI_TO_MPA, 9);
    }
  });
  it("solid copper: the wire bites into annealed copper at its published hardness (40 HV, Copper Development Association UK), copper yield and modulus from §7", () => {
    const c = TYPICAL_GASKETS["solid-copper"];
    expect(c.sealLineHardnessMpa).toBe(ANNEALED_COPPER_HARDNESS_MPA);
    expect(c.sealLineYieldMpa).toBe(HANDBOOK_MATERIALS["c11000-annealed"].yieldMpa);
    expect(c.bodyModulusMpa).toBe(HANDBOOK_MATERIALS["c11000-annealed"].modulusMpa);
    expect(c.ringModulusMpa).toBe(HANDBOOK_MATERIALS["stainless-300-wire"].modulusMpa);
  });
  it("every family says its figures are typical and names what is assumed", () => {
    for (const [k, g] of Object.entries(TYPICAL_GASKETS)) expect(g.notes, k).toMatch(/assumption|ours|typical/i);
  });
});
