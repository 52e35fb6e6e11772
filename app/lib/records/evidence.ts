// Evidence: the shop's runs held against the model. Pure. Each run's predicted margin is the clamp
// model's seal margin (bottom of the scatter band, hot and fired) at the pressure the run logged, for
// the plan on the engine that day — worked out by the caller through the clamp core, never rescaled here.
import { isSealFailure, type Outcome } from "./run";

export interface EvidencePoint {
  runId: number;
  engineId: number;
  engineName: string;
  ranOn: string;
  gasketType: string;
  gasketName: string;
  fastenerName: string;
  fuel: string;
  peakMpa: number;
  peakSource: "measured" | "estimated";
  outcome: Outcome;
  /** Predicted seal margin at the logged pressure (the verdict's basis). */
  margin: number;
  status: "holds" | "thin" | "short";
}

export interface CombinationRow {
  gasketType: string;
  fastenerName: string;
  runs: number;
  held: number;
  /** Highest peak pressure it held, MPa. */
  heldUpToMpa: number | null;
  failures: { peakMpa: number; outcome: Outcome; margin: number; ranOn: string; engineName: string }[];
}

export interface EvidenceSummary {
  points: number;
  sealFailures: number;
  /** Highest predicted margin at which the shop's own history shows a seal failure. */
  failedAtOrBelowMargin: number | null;
  /** Seal failures the model predicted below margin 1 (it warned), and above it (it did not). */
  failuresBelowOne: number;
  failuresAboveOne: number;
  /** Runs that held although the model put them under margin 1. */
  heldBelowOne: number;
  /** A sentence that says how much the few points can carry. */
  honesty: string;
}

export interface EvidenceFilter {
  gasketType?: string;
  fastenerName?: string;
  fuel?: string;
}

export function filterPoints(points: readonly EvidencePoint[], f: EvidenceFilter): EvidencePoint[] {
  return points.filter(
    (p) =>
      (!f.gasketType || p.gasketType === f.gasketType) &&
      (!f.fastenerName || p.fastenerName === f.fastenerName) &&
      (!f.fuel || p.fuel === f.fuel),
  );
}

export function combinations(points: readonly EvidencePoint[]): CombinationRow[] {
  const groups = new Map<string, EvidencePoint[]>();
  for (const p of points) {
    const key = `${p.gasketType}\u0000${p.fastenerName}`;
    groups.set(key, [...(groups.get(key) ?? []), p]);
  }
  return [...groups.values()]
    .map((ps) => {
      const held = ps.filter((p) => p.outcome === "held");
      return {
        gasketType: ps[0]!.gasketType,
        fastenerName: ps[0]!.fastenerName,
        runs: ps.length,
        held: held.length,
        heldUpToMpa: held.length ? Math.max(...held.map((p) => p.peakMpa)) : null,
        failures: ps
          .filter((p) => p.outcome !== "held")
          .map((p) => ({ peakMpa: p.peakMpa, outcome: p.outcome, margin: p.margin, ranOn: p.ranOn, engineName: p.engineName }))
          .sort((a, b) => a.peakMpa - b.peakMpa),
      };
    })
    .sort((a, b) => a.gasketType.localeCompare(b.gasketType) || a.fastenerName.localeCompare(b.fastenerName));
}

// ours: below this many runs, or with no failure, a threshold drawn from the history is not a trend
const FEW_POINTS = 10;

export function summarize(points: readonly EvidencePoint[]): EvidenceSummary {
  const failures = points.filter((p) => isSealFailure(p.outcome));
  const failedAtOrBelowMargin = failures.length ? Math.max(...failures.map((p) => p.margin)) : null;
  const failuresBelowOne = failures.filter((p) => p.margin < 1).length;
  const heldBelowOne = points.filter((p) => p.outcome === "held" && p.margin < 1).length;
  const n = points.length;
  const honesty =
    n === 0
      ? "No runs logged yet: nothing to compare the model with."
      : n < FEW_POINTS
        ? `Only ${n} run${n === 1 ? "" : "s"} and ${failures.length} seal failure${failures.length === 1 ? "" : "s"}: too few to read a trend; each point is one run, not a rule.`
        : failures.length < 3
          ? `${n} runs but only ${failures.length} seal failure${failures.length === 1 ? "" : "s"}: the failure line rests on very little.`
          : `${n} runs, ${failures.length} seal failures.`;
  return {
    points: n,
    sealFailures: failures.length,
    failedAtOrBelowMargin,
    failuresBelowOne,
    failuresAboveOne: failures.length - failuresBelowOne,
    heldBelowOne,
    honesty,
  };
}
