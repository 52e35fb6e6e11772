// The one form path on the server (docs/decisions/0017-forms.md): Conform's parseWithZod, with a post
// whose control words are malformed answered 400 with a message instead of thrown as a 500.
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import type { z } from "zod";

/** Conform's hidden field for its list and update intents. */
const CONFORM_INTENT = "__intent__";
const CONFORM_INTENT_TYPES = ["validate", "update", "reset", "insert", "remove", "reorder"];

/** A 400 answer the route's error boundary shows: what was wrong with the post, nothing written. */
export function badRequest(message: string) {
  return data(message, { status: 400 });
}

const BAD_INTENT = "That form button is not one this page knows; reload the page and try again.";

function checkConformIntent(formData: FormData): void {
  const raw = formData.getAll(CONFORM_INTENT);
  if (raw.length === 0) return;
  if (raw.length > 1 || typeof raw[0] !== "string") throw badRequest(BAD_INTENT);
  let intent: unknown;
  try {
    intent = JSON.parse(raw[0]);
  } catch {
    throw badRequest(BAD_INTENT);
  }
  const ok =
    typeof intent === "object" &&
    intent !== null &&
    CONFORM_INTENT_TYPES.includes(String((intent as { type?: unknown }).type)) &&
    typeof (intent as { payload?: unknown }).payload === "object" &&
    (intent as { payload?: unknown }).payload !== null;
  if (!ok) throw badRequest(BAD_INTENT);
}

/**
 * Parse a post with the form's schema through Conform. A malformed or unknown `__intent__` (or one
 * that names a field that is not a list) throws a 400 answer.
 */
export function parseSubmission<Schema extends z.ZodType>(formData: FormData, schema: Schema) {
  checkConformIntent(formData);
  try {
    return parseWithZod(formData, { schema });
  } catch (error) {
    // Conform applies a list intent before the schema runs; one aimed at a plain field throws
    if (formData.has(CONFORM_INTENT)) throw badRequest(BAD_INTENT);
    throw error;
  }
}

/**
 * The route's own button word (`intent`): one of `allowed`, `fallback` when no button was named
 * (Enter in a field), anything else a 400.
 */
export function readIntent<T extends string>(
  formData: FormData | Record<string, FormDataEntryValue | undefined>,
  allowed: readonly T[],
  fallback: T,
): T {
  const all = formData instanceof FormData ? formData.getAll("intent") : formData.intent === undefined ? [] : [formData.intent];
  if (all.length === 0) return fallback;
  const word = all[0];
  if (all.length > 1 || typeof word !== "string" || !(allowed as readonly string[]).includes(word)) throw badRequest(BAD_INTENT);
  return word as T;
}
