import { parseWithZod } from "@conform-to/zod/v4";
import type { ZodType } from "zod";

/** A post read through Conform, flattened for assertions: the value on success, the field errors otherwise. */
export function readSubmission<S extends ZodType>(formData: FormData, options: { schema: S }) {
  const s = parseWithZod(formData, options);
  return {
    status: s.status,
    value: s.status === "success" ? s.value : undefined,
    error: s.status === "success" ? undefined : s.error,
  };
}
