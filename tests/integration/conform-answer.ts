// Reading a refused form's answer: Conform's `submission.reply()` (docs/decisions/0017-forms.md),
// which the action returns as `result`.
type Answer = { result: { error?: Record<string, string[] | null>; initialValue?: Record<string, unknown> | null } };

/** The first message the answer files under a field ("" is the form's own). */
export const answerError = (body: unknown, name: string): string | undefined => (body as Answer).result.error?.[name]?.[0];

/** The fields the answer marks, in name order (the form's own message left out). */
export const answerFields = (body: unknown): string[] =>
  Object.entries((body as Answer).result.error ?? {})
    .filter(([name, list]) => name !== "" && list?.length)
    .map(([name]) => name)
    .sort();

/** What the answer sends back as typed. */
export const answerValues = (body: unknown): Record<string, unknown> => (body as Answer).result.initialValue ?? {};
