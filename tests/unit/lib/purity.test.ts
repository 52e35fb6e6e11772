// The pure core stays pure: no framework, database or Node API under app/lib, and no unit
// library on the calculation's path (only app/lib/units may use convert-units).
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = join(__dirname, "../../../app/lib");
const NODE_BUILTINS = [
  "assert",
  "buffer",
  "child_process",
  "crypto",
  "dns",
  "events",
  "fs",
  "http",
  "https",
  "net",
  "os",
  "path",
  "process",
  "stream",
  "tls",
  "url",
  "util",
  "worker_threads",
  "zlib",
  "perf_hooks",
  "v8",
  "vm",
];
const FORBIDDEN = [
  /^react($|\/)/,
  /^react-dom($|\/)/,
  /^react-router($|\/)/,
  /^@react-router\//,
  /^knex($|\/)/,
  /^better-sqlite3($|\/)/,
  /^node:/,
  new RegExp(`^(${NODE_BUILTINS.join("|")})($|/)`),
];

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : /\.(ts|tsx|js|mjs)$/.test(n) ? [p] : [];
  });
}

/** Every module specifier: static import/export, dynamic import(), require(). */
export function specifiers(src: string): string[] {
  const out: string[] = [];
  const re =
    /(?:import|export)\s[^'"]*?from\s*["']([^"']+)["']|import\s*["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)|require\(\s*["']([^"']+)["']\s*\)/g;
  for (const m of src.matchAll(re)) out.push(m[1] ?? m[2] ?? m[3] ?? m[4]);
  return out;
}

export function problems(path: string, src: string): string[] {
  const out: string[] = [];
  for (const s of specifiers(src)) {
    if (FORBIDDEN.some((r) => r.test(s))) out.push(`${path} imports ${s}`);
    if (s.startsWith("convert-units") && !path.startsWith("units/")) out.push(`${path} imports ${s} (only app/lib/units may)`);
  }
  if (/\bprocess\s*\.\s*env\b/.test(src)) out.push(`${path} reads process.env`);
  if (/\b(globalThis\s*\.\s*)?process\s*\./.test(src.replace(/\/\/.*$/gm, ""))) out.push(`${path} uses process`);
  if (/\b__dirname\b|\bBuffer\s*\./.test(src)) out.push(`${path} uses a Node global`);
  return out;
}

describe("purity of app/lib", () => {
  it("imports no framework, database, Node API or (outside units) unit library", () => {
    const all = files(ROOT).flatMap((f) => problems(relative(ROOT, f).replace(/\\/g, "/"), readFileSync(f, "utf8")));
    expect(all).toEqual([]);
  });
  it("the check itself catches what it should (so it cannot pass vacuously)", () => {
    expect(files(ROOT).length).toBeGreaterThan(10);
    expect(problems("clamp/x.ts", 'import { useState } from "react";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import type { Route } from "react-router";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import { data } from "@react-router/node";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import knex from "knex";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import Database from "better-sqlite3";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import { readFileSync } from "node:fs";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'import path from "path";')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'const c = require("crypto");')).toHaveLength(1);
    expect(problems("clamp/x.ts", 'const m = await import("fs/promises");')).toHaveLength(1);
    expect(problems("clamp/x.ts", "const k = process.env.KEY;").length).toBeGreaterThan(0);
    expect(problems("chamber/x.ts", 'import c from "convert-units";')).toHaveLength(1);
    expect(problems("units/x.ts", 'import c from "convert-units";')).toHaveLength(0);
    expect(problems("clamp/x.ts", 'import { z } from "zod";')).toHaveLength(0);
    expect(problems("clamp/x.ts", 'import { a } from "./thread";')).toHaveLength(0);
  });
});
