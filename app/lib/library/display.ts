// How library rows read in tables: thread names, provenance lines.

const MM_PER_IN = 25.4;

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** "M12×1.5" for metric; "1/2-20" (diameter in inch fractions to 1/64, threads per inch) for unified. */
export function threadLabel(threadSystem: string, diameterMm: number, pitchMm: number): string {
  const round = (x: number, digits: number) => String(Number(x.toFixed(digits)));
  if (threadSystem !== "unified") return `M${round(diameterMm, 2)}×${round(pitchMm, 2)}`;
  const tpi = round(MM_PER_IN / pitchMm, 1);
  const sixtyFourths = Math.round((diameterMm / MM_PER_IN) * 64);
  const whole = Math.floor(sixtyFourths / 64);
  const rest = sixtyFourths % 64;
  const g = rest === 0 ? 64 : gcd(rest, 64);
  const frac = rest === 0 ? "" : `${rest / g}/${64 / g}`;
  const inches = whole > 0 ? (frac ? `${whole} ${frac}` : String(whole)) : frac || "0";
  return `${inches}-${tpi} UN`;
}

/** The Source cell: the handbook source for seeded rows, "entered by <person>" for the shop's own. */
export function sourceLine(row: { source: string | null; enteredByName: string | null; enteredById: number | null }): string {
  if (row.source) return row.enteredById ? `${row.source} · edited by ${row.enteredByName ?? "a former member"}` : row.source;
  return `entered by ${row.enteredByName ?? "a former member"}`;
}
