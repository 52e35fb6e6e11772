import { describe, expect, it } from "vitest";
import { prepare } from "../../../../app/lib/clamp";
import { uncertaintyPrepared } from "../../../../app/lib/clamp/uncertainty";
import { cachedUncertainty, canonicalJson, UNCERTAINTY_CACHE } from "../../../../app/lib/clamp/uncertainty-cache";
import { coreFigures, referenceFigures } from "../../../bench/reference";
import { evaluatePrepared } from "../../../../app/lib/clamp/evaluate";
import { v8Raw, workedExample } from "./fixtures";
import { PlanInputSchema } from "../../../../app/lib/clamp";

describe("scatter-run cache", () => {
  it("keys equal inputs alike whatever their key order, and different inputs apart", () => {
    expect(canonicalJson({ b: 1, a: { d: [1, { y: 2, x: 1 }], c: "s" } })).toBe(
      canonicalJson({ a: { c: "s", d: [1, { x: 1, y: 2 }] }, b: 1 }),
    );
    expect(canonicalJson({ a: 1 })).not.toBe(canonicalJson({ a: 2 }));
    expect(canonicalJson({ a: undefined, b: 1 })).toBe(canonicalJson({ b: 1 }));
  });

  it("gives the run a fresh computation gives, and computes it once per input and options", () => {
    UNCERTAINTY_CACHE.clear();
    const plan = workedExample();
    let prepared = 0;
    const p = () => (prepared++, prepare(plan));
    const a = cachedUncertainty(plan, p, { samples: 500, seed: 3 });
    const b = cachedUncertainty(structuredClone(plan), p, { samples: 500, seed: 3 });
    expect(b).toBe(a);
    expect(prepared).toBe(1);
    expect(a).toEqual(uncertaintyPrepared(prepare(plan), { samples: 500, seed: 3 }));
    expect(cachedUncertainty(plan, p, { samples: 500, seed: 4 })).not.toBe(a);
    expect(prepared).toBe(2);
  });
});

describe("bare-loop reference (tests/bench)", () => {
  it("gives the evaluation's numbers to the last bit on both fixtures", () => {
    for (const plan of [workedExample(), PlanInputSchema.parse(v8Raw())]) {
      const p = prepare(plan);
      const n = p.cylinders * 6 + 5;
      const ref = Array.from(referenceFigures(p, new Float64Array(n)));
      const core = Array.from(coreFigures(evaluatePrepared(p, undefined), new Float64Array(n)));
      expect(ref).toEqual(core);
      expect(ref.every(Number.isFinite)).toBe(true);
    }
  });
});
