// The model's SI wording and the peak-pressure note (app/lib/clamp/wording.ts).
import { describe, expect, it } from "vitest";
import { peakPressureNote, SI_WORDING, type Wording } from "../../../../app/lib/clamp/wording";

describe("SI_WORDING", () => {
  it("torque whole N·m, force kN to one decimal, stress whole MPa, length to the micron, pressure to 0.1 MPa", () => {
    expect(SI_WORDING.torque(156.4)).toBe("156 N·m");
    expect(SI_WORDING.force(133_049)).toBe("133.0 kN");
    expect(SI_WORDING.force(49_960)).toBe("50.0 kN");
    expect(SI_WORDING.stress(392.28)).toBe("392 MPa");
    expect(SI_WORDING.length(0.0254)).toBe("0.025 mm");
    expect(SI_WORDING.pressure(16)).toBe("16.0 MPa");
  });
});

describe("peakPressureNote", () => {
  it("an entered pressure says so", () => {
    expect(peakPressureNote({ mode: "entered", peakPressureMpa: 16 })).toBe("Peak cylinder pressure as entered.");
  });
  it("an estimate gives its manifold pressure in the wording's unit, the ratio to 0.01 and the exponent", () => {
    const firing = { mode: "estimated" as const, manifoldAbsKpa: 250, compressionRatio: 9.456, exponent: 1.3, pressureRiseFactor: 3.25 };
    expect(peakPressureNote(firing)).toBe(
      "Estimate: 0.3 MPa manifold × 9.46^1.3 compression × 3.25 combustion rise. Measured peak pressure, when you have it, is better.",
    );
    const psi: Wording = { ...SI_WORDING, pressure: (mpa) => `${((mpa * 1e6) / 6894.757).toFixed(1)} psi` };
    expect(peakPressureNote(firing, psi)).toContain("Estimate: 36.3 psi manifold");
  });
});
