// The order the checks are shown in, apart from the model so a page that only lists checks loads no model code.
import type { LimitCheck, Status } from "./limits";

const SEVERITY: Record<Status, number> = { holds: 0, thin: 1, short: 2 };

/**
 * Checks worst first: failing before thin before passing; among failing ones the furthest under its
 * limit, among thin ones the furthest into its comfort band; unchecked ones last.
 */
export function rankChecks(checks: readonly LimitCheck[]): LimitCheck[] {
  return [...checks].sort(byRank);
}

// one comparator for every call (no closures or key arrays on the evaluation's hot path)
function byRank(a: LimitCheck, b: LimitCheck): number {
  const sa = a.checked ? SEVERITY[a.status] : -1;
  const sb = b.checked ? SEVERITY[b.status] : -1;
  if (sa !== sb) return sb - sa;
  const da = a.status === "short" ? a.ratio : a.ratio / a.thinBelow;
  const db = b.status === "short" ? b.ratio : b.ratio / b.thinBelow;
  if (da === db) return 0;
  return da < db ? -1 : 1;
}
