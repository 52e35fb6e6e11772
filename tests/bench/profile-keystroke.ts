// Where one torque keystroke's time goes in the plan editor: Chromium's sampling profiler (CDP) over
// the bench's five keystrokes at a CPU slow-down, self time summed by function (named through the
// build's source maps where there are any: `npm run build` with BUILD_SOURCEMAP=1) and by file, and
// the in-page timings of each keystroke (input event → figures changed → next frame).
//   npm run build && node --import tsx tests/bench/profile-keystroke.ts [rate=4]
import fs from "node:fs";
import path from "node:path";
import { chromium } from "@playwright/test";
import { SourceMapConsumer } from "source-map";
import { somePlanPath, startServer, BENCH_PORT } from "./parts/server";

const ROOT = path.resolve(import.meta.dirname, "../..");
const ORIGIN = `http://127.0.0.1:${BENCH_PORT}`;
const rate = Number(process.argv[2] ?? 4);

interface Node {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number; columnNumber: number };
  children?: number[];
}
interface Profile {
  nodes: Node[];
  samples: number[];
  timeDeltas: number[];
}

const maps = new Map<string, SourceMapConsumer | null>();
async function mapFor(url: string): Promise<SourceMapConsumer | null> {
  if (maps.has(url)) return maps.get(url)!;
  let m: SourceMapConsumer | null = null;
  const file = path.join(ROOT, "build/client", new URL(url).pathname + ".map");
  if (url.startsWith(ORIGIN) && fs.existsSync(file)) m = await new SourceMapConsumer(JSON.parse(fs.readFileSync(file, "utf8")));
  maps.set(url, m);
  return m;
}

async function where(f: Node["callFrame"]): Promise<string> {
  if (!f.url) return f.functionName || "(native)";
  const m = await mapFor(f.url);
  const base = path.basename(new URL(f.url).pathname);
  if (!m) return `${f.functionName || "(anonymous)"} ${base}:${f.lineNumber + 1}`;
  const o = m.originalPositionFor({ line: f.lineNumber + 1, column: f.columnNumber });
  const src = o.source ? o.source.replace(/^.*node_modules\//, "").replace(/^(\.\.\/)+/, "") : base;
  return `${o.name ?? f.functionName ?? "(anonymous)"} ${src}:${o.line ?? "?"}`;
}

const server = await startServer(path.join(ROOT, "tests/.bench-data/profile.sqlite"));
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu", "--no-first-run"] });
try {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  await page.goto(`${ORIGIN}/login`);
  await page.getByLabel("E-mail").fill("builder@example.com");
  await page.getByLabel("Password").fill("sealwright-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/login"));
  const cdp = await context.newCDPSession(page);
  await cdp.send("Emulation.setCPUThrottlingRate", { rate });
  await page.goto(`${ORIGIN}${somePlanPath(server.dbPath, true)}`, { waitUntil: "networkidle" });
  await page.waitForTimeout(1000);
  await cdp.send("Profiler.enable");
  await cdp.send("Profiler.setSamplingInterval", { interval: 100 });
  await cdp.send("Profiler.start");
  const timings: { changed: number; frame: number; handler: number }[] = [];
  for (const t of ["150", "170", "140", "160", "130"]) {
    const done = page.evaluate(
      () =>
        new Promise<{ changed: number; frame: number; handler: number }>((resolve) => {
          const target = document.querySelector('[data-testid="weakest-margin"]')!;
          const before = target.textContent;
          let t0 = NaN;
          let handler = NaN;
          // capture on the window: first in; the bubbling one on the window last out, after React's
          // listener on the document and the render it flushes in the microtask after it
          window.addEventListener("input", () => (t0 = performance.now()), { once: true, capture: true });
          window.addEventListener("input", () => (handler = performance.now() - t0), { once: true });
          const obs = new MutationObserver(() => {
            if (target.textContent === before) return;
            obs.disconnect();
            const changed = performance.now() - t0;
            requestAnimationFrame(() => setTimeout(() => resolve({ changed, frame: performance.now() - t0, handler }), 0));
          });
          obs.observe(target, { childList: true, characterData: true, subtree: true });
          setTimeout(() => resolve({ changed: NaN, frame: NaN, handler }), 8000);
        }),
    );
    await page.locator('input[name="torque"]').fill(t);
    timings.push(await done);
  }
  await page.waitForTimeout(600);
  const { profile } = (await cdp.send("Profiler.stop")) as { profile: Profile };
  console.log(`CPU slow-down ${rate}×; per keystroke (ms from the input event): window listener done / figures changed / next frame`);
  for (const t of timings) console.log(`  ${t.handler.toFixed(1)} / ${t.changed.toFixed(1)} / ${t.frame.toFixed(1)}`);

  // self time per node, then per function and per file
  const self = new Map<number, number>();
  profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
  const byFn = new Map<string, number>();
  const byFile = new Map<string, number>();
  let total = 0;
  for (const n of profile.nodes) {
    const us = self.get(n.id) ?? 0;
    if (n.callFrame.functionName === "(idle)" || n.callFrame.functionName === "(program)") continue;
    total += us;
    const key = await where(n.callFrame);
    byFn.set(key, (byFn.get(key) ?? 0) + us);
    const file = key.split(" ").slice(1).join(" ").replace(/:\S*$/, "") || key;
    byFile.set(file, (byFile.get(file) ?? 0) + us);
  }
  // inclusive time: a node's own and its callees', counted once per function on a path (recursion)
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const keys = new Map<number, string>();
  for (const n of profile.nodes) keys.set(n.id, await where(n.callFrame));
  const incl = new Map<string, number>();
  const walk = (id: number, onPath: Set<string>): number => {
    const n = byId.get(id)!;
    let us = self.get(id) ?? 0;
    const key = keys.get(id)!;
    const first = !onPath.has(key);
    if (first) onPath.add(key);
    for (const c of n.children ?? []) us += walk(c, onPath);
    if (first) {
      onPath.delete(key);
      incl.set(key, (incl.get(key) ?? 0) + us);
    }
    return us;
  };
  walk(profile.nodes[0]!.id, new Set());
  const top = (m: Map<string, number>, n: number) =>
    [...m]
      .sort((a, b) => b[1] - a[1])
      .slice(0, n)
      .map(([k, us]) => `  ${(us / 1000).toFixed(1).padStart(7)} ms ${((100 * us) / total).toFixed(1).padStart(5)} %  ${k}`);
  console.log(`busy (not idle) ${(total / 1000).toFixed(1)} ms over the five keystrokes and the fetch after the last`);
  console.log("by file:\n" + top(byFile, 25).join("\n"));
  console.log("by function:\n" + top(byFn, 40).join("\n"));
  const ours = new Map([...incl].filter(([k]) => / (app\/|react-dom|chart\.js|react-chartjs)/.test(k)));
  console.log(
    "inclusive (with callees), the app's, React's and the charts':\n" +
      top(ours, 45).join("\n") +
      "\nthe app's alone:\n" +
      top(new Map([...incl].filter(([k]) => / app\//.test(k))), 40).join("\n"),
  );
} finally {
  await browser.close();
  await server.stop();
}
