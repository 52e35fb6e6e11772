// convert-units carries factors within 1e-6 of NIST SP 811, hence the tolerances.
// The unit table's factors against exact definitions (NIST SP 811) and the trade's usual figures.
import { describe, expect, it } from "vitest";
import { unitBySpelling, unitDef, unitFor, unitsOf, UNIT_SYSTEMS } from "../../../../app/lib/units/table";
import { toDisplay, fromDisplay } from "../../../../app/lib/units";

describe("units table", () => {
  it("°F = °C × 9/5 + 32, both ways (offset and factor)", () => {
    expect(toDisplay("temperature", 100, "°F")).toBeCloseTo(212, 9);
    expect(toDisplay("temperature", 0, "°F")).toBeCloseTo(32, 9);
    expect(toDisplay("temperature", -40, "°F")).toBeCloseTo(-40, 9);
    expect(fromDisplay("temperature", 230, "°F")).toBeCloseTo(110, 9);
  });
  it("µin Ra: 1 µm = 39.37 µin (1 µin = 0.0254 µm)", () => {
    expect(toDisplay("roughness", 1, "µin Ra")).toBeCloseTo(1 / 0.0254, 4);
    expect(toDisplay("roughness", 0.8, "µin Ra")).toBeCloseTo(31.496, 3);
  });
  it("expansion: 11.7 µm/m·°C = 6.5 µin/in·°F (a °F is 5/9 of a °C)", () => {
    expect(toDisplay("expansion", 11.7, "µin/in·°F")).toBeCloseTo(6.5, 9);
  });
  it("modulus: 205 GPa steel = 29.7 Mpsi; stored as MPa", () => {
    expect(toDisplay("modulus", 205_000, "GPa")).toBeCloseTo(205, 9);
    expect(toDisplay("modulus", 205_000, "Mpsi")).toBeCloseTo(29.733, 3);
  });
  it("ksi: 1 ksi = 6.894757 MPa", () => {
    expect(fromDisplay("stress", 1, "ksi")).toBeCloseTo(6.894757, 5);
  });
  it("area: 1 in² = 645.16 mm²", () => {
    expect(fromDisplay("area", 1, "in²")).toBeCloseTo(645.16, 2);
  });
  it("every quantity has a choice for each system among its units", () => {
    for (const q of [
      "length",
      "smallLength",
      "area",
      "force",
      "torque",
      "pressure",
      "stress",
      "modulus",
      "expansion",
      "roughness",
      "temperature",
      "volume",
      "manifold",
    ] as const) {
      for (const s of UNIT_SYSTEMS) expect(unitsOf(q)).toContain(unitFor(q, s));
    }
  });
  it("spellings: ft-lb is lbf·ft, psig is gauge, an unknown spelling is undefined", () => {
    expect(unitBySpelling("torque", "ft-lb")?.label).toBe("lbf·ft");
    expect(unitBySpelling("manifold", "psig")?.gauge).toBe(true);
    expect(unitBySpelling("torque", "furlongs")).toBeUndefined();
    expect(() => unitDef("torque", "mm")).toThrow(/not a unit of torque/);
  });
});
