// The model's sentences in the person's units (app/lib/plan/wording.ts).
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { displayWording } from "../../../../app/lib/plan/wording";
import { formatQuantity } from "../../../../app/lib/units";

describe("displayWording", () => {
  it("metric reads each figure as formatQuantity does", () => {
    const w = displayWording("metric");
    expect(w.torque(156)).toBe(formatQuantity(156, "torque", "metric"));
    expect(w.force(50_000)).toBe(formatQuantity(50_000, "force", "metric"));
    expect(w.length(0.1)).toBe(formatQuantity(0.1, "smallLength", "metric"));
    expect(w.pressure(16)).toBe(formatQuantity(16, "pressure", "metric"));
  });
  it("imperial: 165 MPa reads in ksi, 0.1 mm in thou, 16 MPa in psi (mathjs as the independent reference)", () => {
    const w = displayWording("imperial");
    expect(w.stress(165)).toBe(formatQuantity(165, "stress", "imperial"));
    expect(w.stress(165)).toMatch(/ksi$/);
    const ksi = Number(w.stress(165).replace(/[^\d.]/g, ""));
    // shown to one decimal: within 0.05 ksi
    expect(Math.abs(ksi - unit(165, "MPa").toNumber("psi") / 1000)).toBeLessThanOrEqual(0.05);
    expect(w.length(0.1)).toMatch(/thou$/);
    const thou = Number(w.length(0.1).replace(/[^\d.]/g, ""));
    expect(Math.abs(thou - unit(0.1, "mm").toNumber("mil"))).toBeLessThan(0.05);
    expect(w.pressure(16)).toMatch(/psi/);
    expect(w.torque(156)).toMatch(/lbf·ft$/);
  });
});
