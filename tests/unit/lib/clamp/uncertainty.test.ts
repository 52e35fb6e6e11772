// The scatter run (app/lib/clamp/uncertainty.ts): the generator, the normals and the preload band.
import { describe, expect, it } from "vitest";
import {
  fillNormals,
  fillNormalsPolar,
  fillNormalsPolarInline,
  mulberry32,
  normal,
  percentiles,
  uncertainty,
} from "../../../../app/lib/clamp/uncertainty";
import { PlanInputSchema } from "../../../../app/lib/clamp";
import { TIGHTENING_FACTOR } from "../../../../app/lib/clamp/torque";
import { v8Raw, workedExample } from "./fixtures";

describe("mulberry32", () => {
  it("is deterministic for a seed, differs between seeds, and stays in [0, 1)", () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const c = mulberry32(43);
    const xs = Array.from({ length: 1000 }, () => a());
    expect(Array.from({ length: 1000 }, () => b())).toEqual(xs);
    expect(c()).not.toBe(xs[0]);
    for (const x of xs) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThan(1);
    }
  });
  it("is uniform: the mean of 100 000 draws is 0.5 ± 0.005", () => {
    const r = mulberry32(7);
    let sum = 0;
    for (let i = 0; i < 100_000; i++) sum += r();
    expect(Math.abs(sum / 100_000 - 0.5)).toBeLessThan(0.005);
  });
});

describe("normal deviates (Box & Muller 1958)", () => {
  it("mean 0 and standard deviation 1 over 100 000 draws, ±0.01", () => {
    const out = fillNormals(mulberry32(1), new Float64Array(100_000));
    let m = 0;
    for (const x of out) m += x;
    m /= out.length;
    let v = 0;
    for (const x of out) v += (x - m) ** 2;
    expect(Math.abs(m)).toBeLessThan(0.01);
    expect(Math.abs(Math.sqrt(v / out.length) - 1)).toBeLessThan(0.01);
  });
  it("about 95.4 % fall within ±2σ (the normal distribution's 95.45 %), ±0.5 %", () => {
    const r = mulberry32(3);
    let inside = 0;
    for (let i = 0; i < 50_000; i++) if (Math.abs(normal(r)) <= 2) inside++;
    expect(Math.abs(inside / 50_000 - 0.9545)).toBeLessThan(0.005);
  });
});

describe("uncertainty", () => {
  const plan = workedExample();
  it("the sampled preload's 2.5th/97.5th percentiles sit on the tightening band (taken as ±2σ), ±2 %", () => {
    const aA = TIGHTENING_FACTOR[plan.tightening.method];
    const r = uncertainty(plan, { samples: 4000, seed: 11 });
    expect(Math.abs(r.preloadSpread.p2_5 - 2 / (1 + aA))).toBeLessThan(0.02);
    expect(Math.abs(r.preloadSpread.p97_5 - (2 * aA) / (1 + aA))).toBeLessThan(0.02);
  });
  it("is repeatable for a seed, and its probabilities and percentiles are ordered and in [0, 1]", () => {
    const a = uncertainty(plan, { samples: 500, seed: 5 });
    expect(uncertainty(plan, { samples: 500, seed: 5 })).toEqual(a);
    expect(a.samples).toBe(500);
    for (const p of [a.probabilityMarginBelowOne, a.probabilityStudOverLimit]) {
      expect(p).toBeGreaterThanOrEqual(0);
      expect(p).toBeLessThanOrEqual(1);
    }
    expect(a.weakestMargin.p5).toBeLessThanOrEqual(a.weakestMargin.p50);
    expect(a.weakestMargin.p50).toBeLessThanOrEqual(a.weakestMargin.p95);
  });
  it("more torque lowers the chance the seal opens (trend)", () => {
    const at = (torqueNm: number) =>
      uncertainty({ ...plan, tightening: { ...plan.tightening, target: { mode: "torque", torqueNm } } }, { samples: 800, seed: 2 })
        .probabilityMarginBelowOne;
    expect(at(240)).toBeLessThanOrEqual(at(120));
  });
});

describe("the scatter run's inner steps (third performance round)", () => {
  it("draws the same deviates inline as fillNormalsPolar on mulberry32, to the last bit, and leaves the state where it stopped", () => {
    for (const seed of [0, 1, 42, 0xffffffff]) {
      const rand = mulberry32(seed);
      const state = Uint32Array.of(seed >>> 0);
      for (const length of [1, 2, 7, 20, 40]) {
        const want = fillNormalsPolar(rand, new Float64Array(length));
        const got = new Float64Array(length);
        fillNormalsPolarInline(state, got);
        expect(Array.from(got)).toEqual(Array.from(want));
      }
    }
  });

  it("reads the percentiles by selection exactly as from the sorted values, ties and NaN included", () => {
    const rand = mulberry32(5);
    for (const n of [1, 2, 3, 10, 101, 1000]) {
      // coarse values: many ties
      const a = Float64Array.from({ length: n }, () => Math.round(rand() * 20) / 4);
      if (n === 101) a[50] = NaN;
      const sorted = Float64Array.from(a).sort();
      const read = (q: number) => {
        const x = q * (n - 1);
        const i = Math.floor(x);
        const j = Math.min(n - 1, i + 1);
        return sorted[i]! + (sorted[j]! - sorted[i]!) * (x - i);
      };
      const qs = [0.025, 0.05, 0.5, 0.95, 0.975];
      expect(percentiles(Float64Array.from(a), qs)).toEqual(qs.map(read));
    }
  });

  it("keeps the stud-over chance the per-stud check gave where it is neither 0 nor 1 (V8 fixture, seed 9)", () => {
    // figures of the round-2 code, which checked every stud of every sample; the run now checks the
    // sample's smallest and largest preload only (the check is convex in the preload)
    for (const [torqueNm, want] of [
      [130, 0.1805],
      [140, 0.66375],
    ] as const) {
      const plan = PlanInputSchema.parse(v8Raw());
      (plan.tightening.target as { torqueNm: number }).torqueNm = torqueNm;
      expect(uncertainty(plan, { samples: 4000, seed: 9 }).probabilityStudOverLimit).toBe(want);
    }
  });
});
