// The handbook library every shop starts with (app/lib/library/seed-data.ts): the materials against
// docs/references.md §7 (the sources named there), and the demo rows' geometry against the thread standards.
import { describe, expect, it } from "vitest";
import { DEMO_FASTENERS, DEMO_GASKETS, HANDBOOK_MATERIAL_ROWS } from "../../../../app/lib/library/seed-data";
import { looksUnified } from "../../../../app/lib/clamp/thread";
import { FastenerSchema, GasketSchema, MaterialSchema } from "../../../../app/lib/library/schemas";
import { PSI_TO_MPA, relErr } from "../nist";

const byName = (n: string) => HANDBOOK_MATERIAL_ROWS.find((m) => m.name.startsWith(n))!;

describe("handbook materials (docs/references.md §7)", () => {
  it.each([
    // name prefix, E MPa, yield MPa, expansion µm/m·°C, source of the row in §7
    ["A356.0-T6", 72_400, 165, 21.4], // Aluminum Association data via MatWeb
    ["6061-T6", 68_900, 276, 23.6], // MatWeb
    ["7075-T6", 71_700, 503, 23.4], // MatWeb
    ["Gray cast iron", 100_000, null, 10.8], // ASTM A48; Shigley table A-5
    ["Ductile iron 65-45-12", 169_000, 310, 11.5], // ASTM A536
    ["4340 steel", 205_000, 1379, 12.3], // MatWeb
    ["300-series stainless", 193_000, 207, 17.3], // MatWeb
    ["C11000 copper", 115_000, 70, 17.0], // copper producer data sheet
  ] as const)("%s: E %d MPa, yield %s MPa, α %d µm/m·°C", (name, e, y, a) => {
    const m = byName(name);
    expect(m.modulus_mpa).toBe(e);
    expect(m.yield_mpa).toBe(y);
    expect(m.expansion_um_per_m_c).toBe(a);
  });
  it("washer limits (VDI 2230, 2003, as quoted by a fastener catalogue): AlSi7Mg 380, AlMgSi1 260, GJL-250 and GJS-500 900 MPa", () => {
    expect(byName("A356.0-T6").limiting_surface_pressure_mpa).toBe(380);
    expect(byName("6061-T6").limiting_surface_pressure_mpa).toBe(260);
    expect(byName("Gray cast iron").limiting_surface_pressure_mpa).toBe(900);
    expect(byName("Ductile iron").limiting_surface_pressure_mpa).toBe(900);
  });
  it("stud classes: ISO 898-1 12.9 proof 970 MPa; SAE J429 grade 8 yield 130 ksi = 896.3 MPa (NIST SP 811), ±0.05 MPa", () => {
    expect(byName("Alloy steel stud, ISO 898-1 class 12.9").yield_mpa).toBe(970);
    expect(Math.abs(byName("Alloy steel stud, SAE J429 grade 8").yield_mpa! - 130_000 * PSI_TO_MPA)).toBeLessThan(0.05);
  });
  it("every row names its source and passes the library's own schema", () => {
    for (const m of HANDBOOK_MATERIAL_ROWS) {
      expect(m.source.length).toBeGreaterThan(5);
      const r = MaterialSchema.safeParse({
        name: m.name,
        kind: m.kind,
        modulusMpa: m.modulus_mpa,
        yieldMpa: m.yield_mpa,
        expansionUmPerMC: m.expansion_um_per_m_c,
        limitingSurfacePressureMpa: m.limiting_surface_pressure_mpa,
        shearStrengthMpa: "shear_strength_mpa" in m ? m.shear_strength_mpa : null,
      });
      expect(r.success).toBe(true);
    }
  });
});

describe("demo fasteners and gaskets", () => {
  it("every demo row says its maker figures are invented", () => {
    for (const row of [...DEMO_FASTENERS, ...DEMO_GASKETS]) expect(row.source).toContain("demo data (invented)");
  });
  it("unified demo studs are real unified sizes (ASME B1.1); their material is a handbook row", () => {
    for (const f of DEMO_FASTENERS) {
      if (f.thread_system === "unified") expect(looksUnified(f.diameter_mm, f.pitch_mm)).toBe(true);
      expect(HANDBOOK_MATERIAL_ROWS.some((m) => m.name === f.material)).toBe(true);
    }
  });
  it("each demo fastener and gasket passes the library schema", () => {
    for (const f of DEMO_FASTENERS) {
      const r = FastenerSchema.safeParse({
        name: f.name,
        threadSystem: f.thread_system,
        diameterMm: f.diameter_mm,
        pitchMm: f.pitch_mm,
        reducedShankDiameterMm: f.reduced_shank_diameter_mm,
        reducedShankLengthMm: f.reduced_shank_length_mm,
        freeThreadLengthMm: f.free_thread_length_mm,
        engagementMm: f.engagement_mm,
        materialId: 1,
        washerOdMm: f.washer_od_mm,
        washerHoleMm: f.washer_hole_mm,
        washerThicknessMm: f.washer_thickness_mm,
        makerTorqueNm: f.maker_torque_nm,
        makerLubricant: f.maker_lubricant,
        makerStages: f.maker_stages,
        makerStretchMm: f.maker_stretch_mm,
        threadFriction: f.thread_friction,
        bearingFriction: f.bearing_friction,
      });
      expect(r.error?.issues ?? []).toEqual([]);
    }
    for (const g of DEMO_GASKETS) {
      const r = GasketSchema.safeParse({
        name: g.name,
        type: g.type,
        compressedThicknessMm: g.compressed_thickness_mm,
        boreMm: g.bore_mm,
        sealDiameterMm: g.seal_diameter_mm,
        ringWidthMm: g.ring_width_mm,
        ringModulusMpa: g.ring_modulus_mpa,
        sealLineYieldMpa: g.seal_line_yield_mpa,
        bodyModulusMpa: g.body_modulus_mpa,
        bodyAreaPerBoreMm2: g.body_area_per_bore_mm2,
        expansionUmPerMC: g.expansion_um_per_m_c,
        m: g.m,
        yMpa: g.y_mpa,
        relaxationPercent: g.relaxation_percent,
        finishMinRaUm: g.finish_min_ra_um,
        finishMaxRaUm: g.finish_max_ra_um,
      });
      expect(r.error?.issues ?? []).toEqual([]);
    }
  });
  it("copper demo gaskets use ASME VIII-1 Table 2-5.1's solid flat copper: m 4.75, y 13,000 psi", () => {
    for (const g of DEMO_GASKETS.filter((x) => x.type === "solid-copper")) {
      expect(g.m).toBe(4.75);
      expect(relErr(g.y_mpa, 13_000 * PSI_TO_MPA)).toBeLessThan(1e-6);
    }
  });
});
