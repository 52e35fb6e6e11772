// The engine domain's public API (app/lib/engine/index.ts): schema, form and labels from one import.
import { describe, expect, it } from "vitest";
import * as engine from "../../../../app/lib/engine";
import * as form from "../../../../app/lib/engine/form";
import * as labels from "../../../../app/lib/engine/labels";
import * as schema from "../../../../app/lib/engine/schema";

describe("engine index", () => {
  it("every export of schema, form and labels is reachable from the index, the same object", () => {
    for (const m of [schema, form, labels])
      for (const [name, value] of Object.entries(m)) expect((engine as Record<string, unknown>)[name]).toBe(value);
  });
});
