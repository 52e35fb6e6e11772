// NIST SP 811 (2008), Appendix B conversion factors, as listed in docs/references.md.
export const IN_TO_MM = 25.4; // exact
export const LBF_TO_N = 4.4482216;
export const LBF_FT_TO_NM = 1.3558179;
export const PSI_TO_PA = 6894.757;
export const PSI_TO_MPA = PSI_TO_PA / 1e6;
/** lbf/in → N/mm */
export const LBF_PER_IN_TO_N_PER_MM = LBF_TO_N / IN_TO_MM;

/** Relative closeness: |a − b| ≤ tol·|b|. */
export function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}
