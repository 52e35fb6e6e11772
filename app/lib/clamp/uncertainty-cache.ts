// The scatter run is deterministic (fixed seed), so one validated input always gives the same result:
// keep the last few in a small least-recently-used table keyed by the input's canonical text.
import type { PlanInput } from "./schema";
import { uncertaintyPrepared, type UncertaintyOptions, type UncertaintyResult } from "./uncertainty";
import type { Prepared } from "./model";
import { LruCache } from "../lru-cache";

/** Canonical JSON: keys sorted at every level, so two equal inputs give the same text whatever their key order. */
export function canonicalJson(x: unknown): string {
  if (x === null || typeof x !== "object") return JSON.stringify(x) ?? "null";
  if (Array.isArray(x)) return `[${x.map(canonicalJson).join(",")}]`;
  const o = x as Record<string, unknown>;
  const keys = Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(o[k])}`).join(",")}}`;
}

/** 256 runs of a few hundred bytes each: the plans a shop works on in a day. */
export const UNCERTAINTY_CACHE = new LruCache<UncertaintyResult>(256);

/** The scatter run for a validated input, from the cache when this input and these options ran before. */
export function cachedUncertainty(input: PlanInput, prepared: () => Prepared, o: UncertaintyOptions): UncertaintyResult {
  const key = `${o.samples}|${o.seed}|${o.frictionCv ?? ""}|${canonicalJson(input)}`;
  const hit = UNCERTAINTY_CACHE.get(key);
  if (hit) return hit;
  const run = uncertaintyPrepared(prepared(), o);
  UNCERTAINTY_CACHE.set(key, run);
  return run;
}
