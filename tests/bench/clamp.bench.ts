// npm run bench — timings of the clamp model on this machine (not a test).
// Warm-up, then many timed iterations; prints median and mean.
import { performance } from "node:perf_hooks";
import { evaluatePlan, PlanInputSchema, torqueSweep, uncertainty } from "../../app/lib/clamp";
import { v8Raw } from "../unit/lib/clamp/fixtures";

const plan = PlanInputSchema.parse(v8Raw());
let peakRss = process.memoryUsage().rss;
let sink = 0;

function bench(name: string, target: string, fn: () => number, warmup: number, iterations: number, unit: "µs" | "ms") {
  for (let i = 0; i < warmup; i++) sink += fn();
  const times = new Float64Array(iterations);
  for (let i = 0; i < iterations; i++) {
    const t0 = performance.now();
    sink += fn();
    times[i] = performance.now() - t0;
    if ((i & 63) === 0) peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }
  times.sort();
  const scale = unit === "µs" ? 1000 : 1;
  const median = times[Math.floor(iterations / 2)] * scale;
  const mean = (times.reduce((a, b) => a + b, 0) / iterations) * scale;
  const p95 = times[Math.floor(iterations * 0.95)] * scale;
  console.log(
    `${name.padEnd(44)} median ${median.toFixed(2).padStart(8)} ${unit}  mean ${mean.toFixed(2).padStart(8)} ${unit}  p95 ${p95.toFixed(2).padStart(8)} ${unit}  (target ${target}, n=${iterations})`,
  );
}

console.log(`Sealwright clamp model bench — node ${process.version}, ${plan.engine.cylinders} cylinders, ${plan.studs.length} studs`);
bench("evaluatePlan (one full plan estimate)", "< 50 µs", () => evaluatePlan(plan).weakestMargin, 2000, 20000, "µs");
bench("torqueSweep (100 points)", "< 5 ms", () => torqueSweep(plan, { fromNm: 40, toNm: 300, points: 100 }).points.length, 200, 2000, "ms");
bench("uncertainty (10,000 samples)", "< 100 ms", () => uncertainty(plan, { samples: 10_000, seed: 42 }).probabilityMarginBelowOne, 5, 50, "ms");
const mem = process.memoryUsage();
peakRss = Math.max(peakRss, mem.rss);
const mb = (x: number) => `${(x / 1024 / 1024).toFixed(1)} MB`;
console.log(`memory: peak rss ${mb(peakRss)} (sampled), heap used ${mb(mem.heapUsed)}, resourceUsage maxRSS ${mb(process.resourceUsage().maxRSS * 1024)}`);
if (!Number.isFinite(sink)) console.log("(sink)", sink);
