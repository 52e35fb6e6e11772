import * as OLD from "/tmp/perf-base/app/lib/clamp";
import { evaluatePrepared as oldEval } from "/tmp/perf-base/app/lib/clamp/evaluate";
import { estimateView as oldView } from "/tmp/perf-base/app/lib/plan/estimate-view";
import { PlanInputSchema, prepare } from "../../app/lib/clamp";
import { evaluatePrepared } from "../../app/lib/clamp/evaluate";
import { uncertaintyPrepared } from "../../app/lib/clamp/uncertainty";
import { estimateView } from "../../app/lib/plan/estimate-view";
import { UNCERTAINTY_CACHE } from "../../app/lib/clamp/uncertainty-cache";
import { referenceFigures } from "./reference";
import { timeMs } from "./parts/measure";
import { v8Raw } from "../unit/lib/clamp/fixtures";
const plan = PlanInputSchema.parse(v8Raw());
const po = OLD.prepare(plan), pn = prepare(plan);
const out = new Float64Array(100);
for (let r = 0; r < 2; r++) {
  const ref = timeMs(() => referenceFigures(pn, out)[0], 2000, 9);
  const before = timeMs(() => oldEval(po, undefined).weakestMargin, 1000, 9);
  const after = timeMs(() => evaluatePrepared(pn, undefined, undefined, { sentences: false }).weakestMargin, 1000, 9);
  const afterS = timeMs(() => evaluatePrepared(pn, undefined).weakestMargin, 1000, 9);
  const ub = timeMs(() => OLD.uncertainty(plan, { samples: 10000, seed: 42 }).samples, 1, 5, 1);
  const ua = timeMs(() => uncertaintyPrepared(pn, { samples: 10000, seed: 42 }).samples, 1, 5, 1);
  const vb = timeMs(() => oldView(plan).torqueNm, 3, 5, 1);
  const va = timeMs(() => (UNCERTAINTY_CACHE.clear(), estimateView(plan).torqueNm), 3, 5, 1);
  const vw = timeMs(() => estimateView(plan).torqueNm, 10, 5, 1);
  console.log(JSON.stringify({ ref: ref * 1e3, beforeEvalUs: before * 1e3, beforeRatio: before / ref, afterEvalUs: after * 1e3, afterRatio: after / ref, afterWithSentencesUs: afterS * 1e3, uncBeforeMs: ub, uncAfterMs: ua, viewBeforeMs: vb, viewAfterColdMs: va, viewAfterCachedMs: vw }));
}
