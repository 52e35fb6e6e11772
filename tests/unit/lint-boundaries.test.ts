// The layer rule in eslint.config.js is real: a core module reaching up, or a component reaching
// for a server module, is refused by `npm run lint`.
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

const eslint = new ESLint({ cwd: process.cwd() });
async function refusals(code: string, filePath: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return (result?.messages ?? []).filter((m) => m.ruleId === "no-restricted-imports").map((m) => m.message);
}

// Loading typescript-eslint takes seconds on a busy machine: a generous timeout, not a speed target.
describe("import boundaries", { timeout: 60_000 }, () => {
  it("app/lib imports nothing from models, utils, routes or components, and no React, Knex or node:*", async () => {
    const code = [
      'import { db } from "~/utils/db.server";',
      'import { useState } from "react";',
      'import knex from "knex";',
      'import { readFileSync } from "node:fs";',
      'import { Caution } from "~/components/caution";',
      "export const x = [db, useState, knex, readFileSync, Caution];",
    ].join("\n");
    expect(await refusals(code, "app/lib/clamp/probe.ts")).toHaveLength(5);
  });
  it("components import no server module or model types", async () => {
    const code =
      'import type { PlanRow } from "~/models/plan.server";\nimport { db } from "~/utils/db.server";\nexport const x: PlanRow | null = null; export const y = db;';
    expect(await refusals(code, "app/components/probe.tsx")).toHaveLength(2);
  });
  it("a core module importing its own kind passes", async () => {
    expect(await refusals('import { unitFor } from "../units";\nexport const x = unitFor;', "app/lib/plan/probe.ts")).toEqual([]);
  });
});
