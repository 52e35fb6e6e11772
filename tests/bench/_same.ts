import fc from "fast-check";
import * as NEW from "../../app/lib/clamp";
import * as OLD from "/tmp/perf-base/app/lib/clamp";
import { estimateView as newView } from "../../app/lib/plan/estimate-view";
import { estimateView as oldView } from "/tmp/perf-base/app/lib/plan/estimate-view";
import { rawPlan } from "../unit/lib/clamp/arbitraries";
import { v8Raw, workedExampleRaw } from "../unit/lib/clamp/fixtures";
const plans = fc.sample(rawPlan, { numRuns: +(process.env.N ?? 300), seed: 4 }).map((r) => NEW.PlanInputSchema.safeParse(r)).filter((r) => r.success).map((r) => r.data!);
plans.unshift(NEW.PlanInputSchema.parse(v8Raw()), NEW.PlanInputSchema.parse(workedExampleRaw()));
const norm = (x: unknown) => JSON.stringify(x, (_k, v) => (typeof v === "number" && !Number.isFinite(v) ? String(v) : v));
let bad = 0;
const uncertaintyToo = process.env.U === "1";
for (const p of plans) {
  const a = norm(OLD.evaluatePlan(p)), b = norm(NEW.evaluatePlan(p));
  if (a !== b) { bad++; if (bad < 3) { for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) { console.log("eval diff at", a.slice(i - 200, i + 100), "\n---\n", b.slice(i - 200, i + 100)); break; } } }
  const r = { fromNm: 10, toNm: 500, points: 30 };
  if (norm(OLD.torqueSweep(p, r)) !== norm(NEW.torqueSweep(p, r))) { bad++; console.log("sweep diff"); }
  if (uncertaintyToo) { const strip = (v: any) => { const { probabilityMarginBelowOne, probabilityStudOverLimit, weakestMarginBand, preloadSpread, ...rest } = v; return rest; }; const va = norm(strip(oldView(p))), vb = norm(strip(newView(p))); if (va !== vb) { bad++; console.log("view diff"); } }
}
console.log(`${plans.length} plans, ${bad} differences`);
