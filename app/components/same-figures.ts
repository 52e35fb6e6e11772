// Comparisons for React.memo on the estimate panel's sections: a section re-renders only when the
// figures it shows changed, not whenever a new estimate object arrives with the same numbers (the
// server's answer after the browser's own evaluation, a keystroke that moved nothing it shows).

/** The same plain value (number, string, boolean, null), NaN equal to NaN. */
const same = (a: unknown, b: unknown) => Object.is(a, b);

/** Two records equal on the named fields. */
export function sameFields<T extends object>(a: T, b: T, fields: readonly (keyof T)[]): boolean {
  if (a === b) return true;
  for (const f of fields) if (!same(a[f], b[f])) return false;
  return true;
}

/** Two lists of records of the same length, equal row by row on the named fields. */
export function sameRows<T extends object>(a: readonly T[], b: readonly T[], fields: readonly (keyof T)[]): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!sameFields(a[i]!, b[i]!, fields)) return false;
  return true;
}

/** Two lists of plain values equal item by item (warnings, assumptions). */
export function sameList(a: readonly unknown[], b: readonly unknown[]): boolean {
  if (a === b) return true;
  return a.length === b.length && a.every((x, i) => same(x, b[i]));
}
