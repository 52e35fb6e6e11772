// The clamp core: one evaluation against the bare-loop reference of the same equations (identical
// numbers checked first), the sweep, and the 10,000-sample scatter run cold and from the cache.
import fc from "fast-check";
import { PlanInputSchema, prepare, type PlanInput } from "../../../app/lib/clamp";
import { evaluatePrepared } from "../../../app/lib/clamp/evaluate";
import { sweepPrepared } from "../../../app/lib/clamp/sweep";
import { uncertaintyPrepared } from "../../../app/lib/clamp/uncertainty";
import { cachedUncertainty, UNCERTAINTY_CACHE } from "../../../app/lib/clamp/uncertainty-cache";
import { estimateView } from "../../../app/lib/plan/estimate-view";
import { rawPlan } from "../../unit/lib/clamp/arbitraries";
import { v8Raw, workedExampleRaw } from "../../unit/lib/clamp/fixtures";
import { coreFigures, referenceFigures } from "../reference";
import { fmt, timeMs, type Row } from "./measure";

/** Plans on which the reference must agree to the last bit: the two fixtures and 200 generated ones. */
export function referencePlans(): PlanInput[] {
  const generated = fc
    .sample(rawPlan, { numRuns: 200, seed: 14 })
    .map((r) => PlanInputSchema.safeParse(r))
    .flatMap((r) => (r.success ? [r.data] : []));
  return [PlanInputSchema.parse(v8Raw()), PlanInputSchema.parse(workedExampleRaw()), ...generated];
}

/** Indices where the reference and the product differ (Object.is: NaN and ±0 count). */
export function referenceMismatches(plan: PlanInput): number[] {
  const p = prepare(plan);
  const a = referenceFigures(p, new Float64Array(p.cylinders * 6 + 5));
  const b = coreFigures(evaluatePrepared(p, undefined), new Float64Array(p.cylinders * 6 + 5));
  const bad: number[] = [];
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) bad.push(i);
  return bad;
}

export function coreRows(): Row[] {
  const plans = referencePlans();
  const mismatched = plans.filter((pl) => referenceMismatches(pl).length > 0).length;
  const plan = plans[0];
  const out = new Float64Array(plan.engine.cylinders * 6 + 5);
  const p = prepare(plan);
  // the same work on both sides: the torque-dependent evaluation of a prepared plan; the sentences
  // (warnings, assumptions: not equations) are timed apart
  const lean = { sentences: false };
  const ratios: number[] = [];
  let core = 0;
  let ref = 0;
  let full = 0;
  let prep = 0;
  for (let round = 0; round < 3; round++) {
    core = timeMs(() => evaluatePrepared(p, undefined, undefined, lean).weakestMargin, 2000, 9);
    ref = timeMs(() => referenceFigures(p, out)[0], 2000, 9);
    full = timeMs(() => evaluatePrepared(prepare(plan), undefined).warnings.length, 1000, 9);
    prep = timeMs(() => prepare(plan).phi, 2000, 9);
    ratios.push(core / ref);
  }
  ratios.sort((a, b) => a - b);
  const ratio = ratios[1];
  const sweep = timeMs(() => sweepPrepared(p, { fromNm: 40, toNm: 300, points: 41 }).points.length, 20, 9);
  const scatter = timeMs(() => uncertaintyPrepared(p, { samples: 10_000, seed: 42 }).probabilityMarginBelowOne, 1, 9, 2);
  UNCERTAINTY_CACHE.clear();
  cachedUncertainty(plan, () => p, { samples: 2000, seed: 1 });
  const cached = timeMs(() => cachedUncertainty(plan, () => p, { samples: 2000, seed: 1 }).samples, 200, 9);
  UNCERTAINTY_CACHE.clear();
  const viewCold = timeMs(() => (UNCERTAINTY_CACHE.clear(), estimateView(plan).torqueNm), 3, 7, 2);
  const viewWarm = timeMs(() => estimateView(plan).torqueNm, 20, 7);
  return [
    {
      figure: "reference agrees (identical numbers)",
      value: `${plans.length - mismatched}/${plans.length} plans`,
      target: "all",
      met: mismatched === 0,
    },
    {
      figure: "one plan evaluation / bare-loop reference",
      value: `×${fmt(ratio, 2)} (${fmt(core * 1000)} vs ${fmt(ref * 1000)} µs)`,
      target: "≤ ×2",
      met: ratio <= 2,
      note: `the whole evaluatePlan with prepare() and the sentences: ${fmt(full * 1000)} µs (prepare alone ${fmt(prep * 1000)} µs)`,
    },
    { figure: "torque sweep, 41 points", value: `${fmt(sweep, 2)} ms`, target: "info", met: null },
    { figure: "10,000-sample uncertainty run", value: `${fmt(scatter)} ms`, target: "≤ 25 ms", met: scatter <= 25 },
    { figure: "uncertainty run, cached (same validated input)", value: `${fmt(cached * 1000, 1)} µs`, target: "info", met: null },
    {
      figure: "estimate view (evaluation + sweep + 2,000 samples), cold / cached run",
      value: `${fmt(viewCold, 1)} / ${fmt(viewWarm, 2)} ms`,
      target: "info",
      met: null,
    },
  ];
}
