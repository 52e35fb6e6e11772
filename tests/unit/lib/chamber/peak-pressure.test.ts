// The peak-pressure estimate (app/lib/chamber/peak-pressure.ts): p2 = p1·CR^n, then the builder's rise factor.
import { describe, expect, it } from "vitest";
import { estimatePeakPressure } from "../../../../app/lib/chamber/peak-pressure";

describe("estimatePeakPressure", () => {
  it("7.5^1.3 × 1 bar = 13.7 bar (Wikipedia 'Compression ratio'), ±0.05 bar", () => {
    const e = estimatePeakPressure({ manifoldAbsKpa: 100, compressionRatio: 7.5, pressureRiseFactor: 1 });
    expect(Math.abs(e.compressionEndMpa * 10 - 13.7)).toBeLessThan(0.05);
    expect(e.peakMpa).toBe(e.compressionEndMpa);
  });
  it("the rise factor multiplies the end-of-compression pressure; 200 kPa, CR 10, n 1.3, ×3.5 → 13.97 MPa by hand", () => {
    const e = estimatePeakPressure({ manifoldAbsKpa: 200, compressionRatio: 10, pressureRiseFactor: 3.5 });
    expect(e.compressionEndMpa).toBeCloseTo(0.2 * 10 ** 1.3, 12);
    expect(e.peakMpa).toBeCloseTo(0.2 * 10 ** 1.3 * 3.5, 12);
    expect(e.peakMpa).toBeCloseTo(13.967, 3);
  });
  it("n defaults to 1.3 and an explicit exponent is used", () => {
    const base = { manifoldAbsKpa: 100, compressionRatio: 9, pressureRiseFactor: 3 };
    expect(estimatePeakPressure(base).peakMpa).toBeCloseTo(estimatePeakPressure({ ...base, exponent: 1.3 }).peakMpa, 12);
    expect(estimatePeakPressure({ ...base, exponent: 1.35 }).compressionEndMpa).toBeCloseTo(0.1 * 9 ** 1.35, 12);
  });
  it("rises with boost and with compression ratio (trend), and is linear in manifold pressure", () => {
    const at = (kpa: number, cr: number) =>
      estimatePeakPressure({ manifoldAbsKpa: kpa, compressionRatio: cr, pressureRiseFactor: 3 }).peakMpa;
    expect(at(250, 9)).toBeGreaterThan(at(100, 9));
    expect(at(100, 11)).toBeGreaterThan(at(100, 9));
    expect(at(200, 9) / at(100, 9)).toBeCloseTo(2, 12);
  });
  it("is labelled an estimate and its note gives the figures it used", () => {
    const e = estimatePeakPressure({ manifoldAbsKpa: 180, compressionRatio: 9.456, pressureRiseFactor: 3.2 });
    expect(e.isEstimate).toBe(true);
    expect(e.note).toBe(
      "Estimate: 180 kPa manifold × 9.46^1.3 compression × 3.2 combustion rise. Measured peak pressure, when you have it, is better.",
    );
  });
});
