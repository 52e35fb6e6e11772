// The records' forms (assembly, machining) as posted through Conform: the fields as typed, read by the
// record's own parse function, each message filed under the field the builder sees.
import { z } from "zod";

type Parsed<T> = { ok: true; value: T } | { ok: false; errors: Record<string, string> };

/** A schema for Conform whose fields are typed strings (a blank field reaches `parse` as missing). */
export function typedFormSchema<T>(parse: (form: Record<string, string>) => Parsed<T>) {
  return z.record(z.string(), z.unknown()).transform((raw, ctx) => {
    const form = Object.fromEntries(Object.entries(raw).filter((e): e is [string, string] => typeof e[1] === "string"));
    const parsed = parse(form);
    if (parsed.ok) return parsed.value;
    for (const [name, message] of Object.entries(parsed.errors)) ctx.addIssue({ code: "custom", path: [name], message });
    return z.NEVER;
  });
}
