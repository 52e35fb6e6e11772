// Compression ratio, quench and a gasket-thickness what-if. Millimetres and cubic centimetres.

export interface ChamberVolumes {
  sweptCc: number;
  chamberCc: number;
  gasketCc: number;
  deckCc: number;
  /** Piston volume: + dish (adds to the clearance volume), − dome. */
  pistonCc: number;
}

export interface CompressionInput {
  boreMm: number;
  strokeMm: number;
  chamberCc: number;
  gasketBoreMm: number;
  gasketThicknessMm: number;
  /** Piston crown below the deck at TDC (+), above it (−). */
  deckClearanceMm: number;
  /** + dish or valve reliefs, − dome. */
  pistonVolumeCc: number;
}

export interface CompressionResult extends ChamberVolumes {
  clearanceCc: number;
  compressionRatio: number;
  /** Piston-to-head clearance at TDC over the flat of the piston (deck + gasket). */
  quenchMm: number;
  /** Inside 0.9–1.15 mm (0.035–0.045 in): common practice for steel rods. */
  quenchInUsualRange: boolean;
}

/** Volume of a cylinder of diameter d and height h, in cc. */
function cylinderCc(diameterMm: number, heightMm: number): number {
  // geometry: V = π/4·d²·h (mm³ → cc ÷ 1000)
  return ((Math.PI / 4) * diameterMm * diameterMm * heightMm) / 1000;
}

export function compressionRatioFromVolumes(v: ChamberVolumes): number {
  // docs/references.md §8: Vc = chamber + gasket + deck clearance ± piston dish/dome
  const clearance = v.chamberCc + v.gasketCc + v.deckCc + v.pistonCc;
  // docs/references.md §8: CR = (Vs + Vc)/Vc
  return (v.sweptCc + clearance) / clearance;
}

/** Quench (squish) clearance. */
export function quenchMm(deckClearanceMm: number, gasketThicknessMm: number): number {
  // geometry: piston-to-head gap at TDC = deck clearance + compressed gasket thickness
  return deckClearanceMm + gasketThicknessMm;
}

export function compressionRatio(a: CompressionInput): CompressionResult {
  const sweptCc = cylinderCc(a.boreMm, a.strokeMm);
  // docs/references.md §8: gasket volume = (π/4)·gasket bore²·compressed thickness
  const gasketCc = cylinderCc(a.gasketBoreMm, a.gasketThicknessMm);
  const deckCc = cylinderCc(a.boreMm, a.deckClearanceMm);
  const volumes = { sweptCc, chamberCc: a.chamberCc, gasketCc, deckCc, pistonCc: a.pistonVolumeCc };
  const clearanceCc = a.chamberCc + gasketCc + deckCc + a.pistonVolumeCc;
  const q = quenchMm(a.deckClearanceMm, a.gasketThicknessMm);
  return {
    ...volumes,
    clearanceCc,
    compressionRatio: compressionRatioFromVolumes(volumes),
    quenchMm: q,
    // docs/references.md §8, common practice: 0.035–0.045 in (0.9–1.15 mm) with steel rods
    quenchInUsualRange: q >= 0.889 && q <= 1.143,
  };
}

export interface ThicknessWhatIf {
  before: CompressionResult;
  after: CompressionResult;
  compressionRatioChange: number;
  quenchChangeMm: number;
}

/** The same chamber with another compressed gasket thickness. */
export function gasketThicknessWhatIf(a: CompressionInput, newThicknessMm: number): ThicknessWhatIf {
  const before = compressionRatio(a);
  const after = compressionRatio({ ...a, gasketThicknessMm: newThicknessMm });
  return {
    before,
    after,
    compressionRatioChange: after.compressionRatio - before.compressionRatio,
    quenchChangeMm: after.quenchMm - before.quenchMm,
  };
}

/** Clearance volume must stay positive for the ratio to mean anything; callers validate with this. */
export function chamberProblems(a: CompressionInput): string[] {
  const out: string[] = [];
  for (const [k, v] of Object.entries(a)) if (!Number.isFinite(v)) out.push(`${k} must be a finite number`);
  if (!(a.boreMm > 0)) out.push("Bore must be greater than zero");
  if (!(a.strokeMm > 0)) out.push("Stroke must be greater than zero");
  if (!(a.gasketBoreMm >= a.boreMm)) out.push("Gasket bore must be at least the cylinder bore");
  if (!(a.gasketThicknessMm > 0)) out.push("Gasket thickness must be greater than zero");
  if (
    out.length === 0 &&
    !(a.chamberCc + cylinderCc(a.gasketBoreMm, a.gasketThicknessMm) + cylinderCc(a.boreMm, a.deckClearanceMm) + a.pistonVolumeCc > 0)
  )
    out.push("The dome and deck leave no clearance volume: check the piston volume and deck clearance");
  return out;
}
