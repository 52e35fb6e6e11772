// The order the checks are shown in, apart from the model so a page that only lists checks loads no model code.
import type { LimitCheck, Status } from "./limits";

const SEVERITY: Record<Status, number> = { holds: 0, thin: 1, short: 2 };

/**
 * Checks worst first: failing before thin before passing; among failing ones the furthest under its
 * limit, among thin ones the furthest into its comfort band; unchecked ones last.
 */
export function rankChecks(checks: readonly LimitCheck[]): LimitCheck[] {
  const depth = (x: LimitCheck) => (x.status === "short" ? x.ratio : x.ratio / x.thinBelow);
  const key = (x: LimitCheck): [number, number] => [x.checked ? SEVERITY[x.status] : -1, depth(x)];
  return [...checks].sort((a, b) => {
    const [sa, da] = key(a);
    const [sb, db] = key(b);
    if (sa !== sb) return sb - sa;
    if (da === db) return 0;
    return da < db ? -1 : 1;
  });
}
