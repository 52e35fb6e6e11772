// The fastener checks across fields, one copy for the library's fastener record and the clamp model's
// plan input: a thread, shank and washer that can exist.

export interface FastenerIssue {
  field: "pitchMm" | "reducedShankDiameterMm" | "washerHoleMm" | "washerOdMm";
  message: string;
}

const round3 = (x: number) => String(Math.round(x * 1000) / 1000);

/** The checks across a fastener's fields; a reduced shank diameter of null or undefined means none. */
export function fastenerIssues(f: {
  diameterMm: number;
  pitchMm: number;
  reducedShankDiameterMm?: number | null;
  reducedShankLengthMm: number;
  washerOdMm: number;
  washerHoleMm: number;
}): FastenerIssue[] {
  const out: FastenerIssue[] = [];
  const shank = f.reducedShankDiameterMm ?? null;
  if (f.pitchMm >= f.diameterMm) out.push({ field: "pitchMm", message: "Thread pitch must be smaller than the diameter" });
  // the thread formulas (ISO 68-1, ASME B1.1) are not meant for pitches coarser than d/4
  else if (f.pitchMm > f.diameterMm / 4)
    out.push({ field: "pitchMm", message: `A ${round3(f.pitchMm)} mm pitch is too coarse for a ${round3(f.diameterMm)} mm thread` });
  if (shank !== null && shank >= f.diameterMm)
    out.push({ field: "reducedShankDiameterMm", message: "Reduced shank must be narrower than the thread" });
  if (f.reducedShankLengthMm > 0 && shank === null)
    out.push({ field: "reducedShankDiameterMm", message: "Give the reduced shank diameter, or set its length to zero" });
  if (f.washerHoleMm < f.diameterMm) out.push({ field: "washerHoleMm", message: "Washer hole must be at least the stud diameter" });
  if (f.washerOdMm <= f.washerHoleMm) out.push({ field: "washerOdMm", message: "Washer outer diameter must be larger than its hole" });
  return out;
}
