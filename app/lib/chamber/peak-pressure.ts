// A labelled estimate of peak cylinder pressure from manifold pressure (never a measurement).

export interface PeakPressureInput {
  /** Manifold absolute pressure at the intake valve closing, kPa. */
  manifoldAbsKpa: number;
  compressionRatio: number;
  /** Polytropic exponent of compression; 1.3 is the usual round figure. */
  exponent?: number;
  /** Combustion pressure rise over the end-of-compression pressure (≥ 1); the builder's figure. */
  pressureRiseFactor: number;
}

export interface PeakPressureEstimate {
  /** End-of-compression pressure p2 = p1·CR^n, MPa. */
  compressionEndMpa: number;
  /** p2 × pressure-rise factor, MPa. */
  peakMpa: number;
  isEstimate: true;
  note: string;
}

export function estimatePeakPressure(a: PeakPressureInput): PeakPressureEstimate {
  const n = a.exponent ?? 1.3;
  // Polytropic compression (Wikipedia "Compression ratio"): p2 = p1·CR^n, n ≈ 1.3
  const compressionEndMpa = (a.manifoldAbsKpa / 1000) * Math.pow(a.compressionRatio, n);
  // common practice: combustion multiplies the compression pressure by a rise factor the builder supplies
  const peakMpa = compressionEndMpa * a.pressureRiseFactor;
  return {
    compressionEndMpa,
    peakMpa,
    isEstimate: true,
    note:
      `Estimate: ${round(a.manifoldAbsKpa)} kPa manifold × ${round(a.compressionRatio)}^${n} compression × ` +
      `${round(a.pressureRiseFactor)} combustion rise. Measured peak pressure, when you have it, is better.`,
  };
}

const round = (x: number) => String(Math.round(x * 100) / 100);
