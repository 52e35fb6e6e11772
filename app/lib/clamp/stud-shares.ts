// The stud-share rule, one copy for the engine record and the clamp model's plan input: a stud's
// shares of the cylinders it serves add up to 1, within a rounding tolerance (thirds typed as 0.333).

/** Tolerance on a stud's shares adding up to 1. */
export const SHARE_TOLERANCE = 0.005;

export function shareSum(stud: { serves: readonly { share: number }[] }): number {
  return stud.serves.reduce((sum, s) => sum + s.share, 0);
}

/** True when a stud's shares add up to 1 within SHARE_TOLERANCE. */
export function sharesAddUp(stud: { serves: readonly { share: number }[] }): boolean {
  return Math.abs(shareSum(stud) - 1) <= SHARE_TOLERANCE;
}

/** The message when a stud's shares do not add up to 1, or null. */
export function shareProblem(stud: { serves: readonly { share: number }[] }, name: string): string | null {
  const sum = shareSum(stud);
  return !sharesAddUp(stud) ? `Stud shares for ${name} add up to ${String(Math.round(sum * 1000) / 1000)}; they must add up to 1` : null;
}

export interface PatternIssue {
  path: (string | number)[];
  message: string;
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** How a message names a stud: by its label, else by its place in the list. */
export function studName(stud: { label?: string }, index: number): string {
  return stud.label ? `stud ${stud.label}` : `stud ${index + 1}`;
}

/**
 * The stud pattern rule, one copy for the engine record and the plan input: each stud's cylinders exist
 * and are listed once, its shares add up to 1 ± SHARE_TOLERANCE, and every cylinder is served by some stud.
 * Paths are relative to the record holding `studs`. Loops only over a whole cylinder count of 1 to 16 and
 * studs whose `serves` is a list of at most 16 (the callers' own checks word anything else).
 */
export function studPatternIssues(
  studs: readonly { label?: string; serves: readonly { cylinder: number; share: number }[] }[],
  cylinders: number,
): PatternIssue[] {
  const out: PatternIssue[] = [];
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > 16 || !Array.isArray(studs as unknown)) return out;
  const served = new Set<number>();
  studs.forEach((stud, i) => {
    if (!Array.isArray(stud?.serves as unknown) || stud.serves.length > 16) return;
    const name = studName(stud, i);
    const seen = new Set<number>();
    stud.serves.forEach((s, j) => {
      if (s.cylinder > cylinders)
        out.push({
          path: ["studs", i, "serves", j, "cylinder"],
          message: `${cap(name)} serves cylinder ${s.cylinder}, but the engine has ${cylinders} cylinders`,
        });
      if (seen.has(s.cylinder))
        out.push({ path: ["studs", i, "serves", j, "cylinder"], message: `${cap(name)} lists cylinder ${s.cylinder} twice` });
      seen.add(s.cylinder);
      served.add(s.cylinder);
    });
    const shares = shareProblem(stud, name);
    if (shares) out.push({ path: ["studs", i, "serves"], message: shares });
  });
  const missing: number[] = [];
  for (let c = 1; c <= cylinders; c++) if (!served.has(c)) missing.push(c);
  if (missing.length > 0)
    out.push({ path: ["studs"], message: `No stud serves cylinder${missing.length > 1 ? "s" : ""} ${missing.join(", ")}` });
  return out;
}
