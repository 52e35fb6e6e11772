// Record ids in URLs and forms: decimal digits only. Number() alone reads "0x1", "1e0", " 1" and "1.0"
// as 1, so one record answered at many addresses (and a filter keyed on the text saw another id).
const DECIMAL_ID = /^[1-9][0-9]{0,15}$/;

/** A positive decimal integer id, or null for anything else (hex, exponents, signs, spaces, fractions). */
export function parseId(raw: unknown): number | null {
  if (typeof raw !== "string" || !DECIMAL_ID.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}

/** Route params that name a record ("engineId", "planId", "itemId", …). */
export function idParamNames(params: Record<string, string | undefined>): string[] {
  return Object.keys(params).filter((name) => /Id$/.test(name));
}
