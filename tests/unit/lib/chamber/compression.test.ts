// docs/references.md §8: compression ratio, polytropic compression, quench.
import { describe, expect, it } from "vitest";
import {
  chamberProblems,
  compressionRatio,
  compressionRatioFromVolumes,
  estimatePeakPressure,
  gasketThicknessWhatIf,
} from "../../../../app/lib/chamber";
import { IN_TO_MM, relErr } from "../nist";

const CC_PER_IN3 = IN_TO_MM ** 3 / 1000; // 16.387064 exactly (NIST SP 811: 1 in = 25.4 mm)

describe("§8 chamber", () => {
  it("published worked example (circletrack): swept 43.731, chamber 3.906, gasket 0.41469, deck 0.251328, dish 0.305 in³ → CR 9.97, ±0.005", () => {
    // Vc = 3.906 + 0.41469 + 0.251328 + 0.305 = 4.877018; CR = (43.731 + 4.877018)/4.877018 = 9.9668
    const cr = compressionRatioFromVolumes({
      sweptCc: 43.731 * CC_PER_IN3,
      chamberCc: 3.906 * CC_PER_IN3,
      gasketCc: 0.41469 * CC_PER_IN3,
      deckCc: 0.251328 * CC_PER_IN3,
      pistonCc: 0.305 * CC_PER_IN3,
    });
    expect(Math.abs(cr - 9.97)).toBeLessThan(0.005);
  });
  it("compressionRatio from geometry: gasket volume = π/4·bore²·thickness (docs/references.md §8), hand arithmetic ±0.01 %", () => {
    // bore 100, stroke 90: Vs = π/4·100²·90/1000 = 706.858 cc; gasket π/4·102²·1.0/1000 = 8.1713 cc
    // deck 0.2 mm: π/4·100²·0.2/1000 = 1.5708 cc; chamber 60, dish +5 → Vc = 74.7421; CR = 781.600/74.7421 = 10.4573
    const r = compressionRatio({
      boreMm: 100,
      strokeMm: 90,
      chamberCc: 60,
      gasketBoreMm: 102,
      gasketThicknessMm: 1.0,
      deckClearanceMm: 0.2,
      pistonVolumeCc: 5,
    });
    expect(relErr(r.sweptCc, 706.858)).toBeLessThan(1e-4);
    expect(relErr(r.gasketCc, 8.1713)).toBeLessThan(1e-4);
    expect(relErr(r.compressionRatio, 10.4573)).toBeLessThan(1e-4);
    // a dome (negative piston volume) raises the ratio
    const dome = compressionRatio({
      boreMm: 100,
      strokeMm: 90,
      chamberCc: 60,
      gasketBoreMm: 102,
      gasketThicknessMm: 1.0,
      deckClearanceMm: 0.2,
      pistonVolumeCc: -5,
    });
    expect(dome.compressionRatio).toBeGreaterThan(r.compressionRatio);
  });
  it("quench = deck clearance + gasket thickness; 0.9–1.15 mm is the usual range (common practice)", () => {
    const base = {
      boreMm: 100,
      strokeMm: 90,
      chamberCc: 60,
      gasketBoreMm: 102,
      gasketThicknessMm: 1.0,
      deckClearanceMm: 0.0,
      pistonVolumeCc: 5,
    };
    expect(compressionRatio(base).quenchMm).toBeCloseTo(1.0, 12);
    expect(compressionRatio(base).quenchInUsualRange).toBe(true);
    const w = gasketThicknessWhatIf(base, 1.5);
    expect(w.quenchChangeMm).toBeCloseTo(0.5, 12);
    expect(w.after.quenchInUsualRange).toBe(false);
    // thicker gasket adds π/4·102²·0.5/1000 = 4.0856 cc: CR falls
    expect(w.after.gasketCc - w.before.gasketCc).toBeCloseTo(4.0856, 3);
    expect(w.compressionRatioChange).toBeLessThan(0);
  });
  it("p2 = p1·CR^n (Wikipedia 'Compression ratio'): 7.5^1.3 × 1 bar = 13.7 bar, ±0.05", () => {
    // The article writes 1 atm and 13.7 bar, i.e. it takes 1 atm ≈ 1 bar; with 101.325 kPa it would be 13.91 bar.
    const e = estimatePeakPressure({ manifoldAbsKpa: 100, compressionRatio: 7.5, pressureRiseFactor: 1 });
    expect(Math.abs(e.compressionEndMpa * 10 - 13.7)).toBeLessThan(0.05);
    expect(e.isEstimate).toBe(true);
    const f = estimatePeakPressure({ manifoldAbsKpa: 250, compressionRatio: 9, exponent: 1.3, pressureRiseFactor: 3 });
    // 0.25·9^1.3 = 0.25·17.399 = 4.3498 MPa; ×3 = 13.049 MPa
    expect(f.peakMpa).toBeCloseTo(13.049, 2);
    expect(f.note).toMatch(/Estimate/);
  });
  it("says what is wrong with impossible chambers", () => {
    expect(
      chamberProblems({
        boreMm: 100,
        strokeMm: 90,
        chamberCc: 2,
        gasketBoreMm: 102,
        gasketThicknessMm: 0.5,
        deckClearanceMm: 0,
        pistonVolumeCc: -10,
      }),
    ).toEqual(["The dome and deck leave no clearance volume: check the piston volume and deck clearance"]);
    expect(
      chamberProblems({
        boreMm: 100,
        strokeMm: 90,
        chamberCc: 60,
        gasketBoreMm: 98,
        gasketThicknessMm: 1,
        deckClearanceMm: 0,
        pistonVolumeCc: 0,
      }),
    ).toContain("Gasket bore must be at least the cylinder bore");
  });
});
