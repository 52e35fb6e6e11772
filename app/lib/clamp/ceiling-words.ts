// The ceiling's causes in words, apart from the model so a page that only names them loads no model code.
export type CeilingCause = "stud-assembly" | "stud-working" | "bearing" | "thread-strip" | "crush";

/** The causes in words, for sentences and tables. */
export const CEILING_WORDS: Record<CeilingCause, string> = {
  "stud-assembly": "stud while tightened",
  "stud-working": "stud hot and fired",
  bearing: "washer bearing on the head",
  "thread-strip": "thread in the block",
  crush: "seal-line crush",
};
