// The stud-share rule, one copy for the engine record and the clamp model's plan input: a stud's
// shares of the cylinders it serves add up to 1, within a rounding tolerance (thirds typed as 0.333).

/** Tolerance on a stud's shares adding up to 1. */
export const SHARE_TOLERANCE = 0.005;

export function shareSum(stud: { serves: readonly { share: number }[] }): number {
  return stud.serves.reduce((sum, s) => sum + s.share, 0);
}

/** The message when a stud's shares do not add up to 1, or null. */
export function shareProblem(stud: { serves: readonly { share: number }[] }, name: string): string | null {
  const sum = shareSum(stud);
  return Math.abs(sum - 1) > SHARE_TOLERANCE
    ? `Stud shares for ${name} add up to ${String(Math.round(sum * 1000) / 1000)}; they must add up to 1`
    : null;
}
