// npm run bench — the project's benchmark (issue 14). Prints every figure with its target and whether it
// is met. Parts: core, bundle, server, browser, dataset (all but core need npm run build first).
//   npm run bench                      every part (the server parts need npm run build first)
//   npm run bench -- --only core       one part, or a comma list: --only core,bundle
//   npm run bench -- --rounds 3        server rounds (medians), default 1; --seconds 5 per route
// Times are CPU time for the core (the machine is shared) and wall time for the server; read ratios
// measured in the same run rather than absolute figures.
import os from "node:os";
import { coreRows } from "./parts/core";
import type { Row } from "./parts/measure";

const args = process.argv.slice(2);
const opt = (name: string, fallback: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : fallback;
};
const PARTS = ["core", "bundle", "server", "browser", "dataset"] as const;
const only = opt("only", PARTS.join(",")).split(",");
const rounds = Number(opt("rounds", "1"));
const seconds = Number(opt("seconds", "5"));

const rows: Row[] = [];
const load = os.loadavg()[0]!;
console.log(
  `Sealwright bench — node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? "cpu"}, load average ${load.toFixed(1)} at start`,
);
for (const part of only) {
  const t0 = Date.now();
  if (part === "core") rows.push(...coreRows());
  else if (part === "bundle") rows.push(...(await import("./parts/bundle")).bundleRows());
  else if (part === "server") rows.push(...(await (await import("./parts/server")).serverRows(rounds, seconds)));
  else if (part === "browser") rows.push(...(await (await import("./parts/browser")).browserRows()));
  else if (part === "dataset") rows.push(...(await (await import("./parts/dataset")).datasetRows()));
  else throw new Error(`unknown part ${part}: ${PARTS.join(", ")}`);
  console.error(`(${part}: ${((Date.now() - t0) / 1000).toFixed(0)} s)`);
}
const mark = (m: boolean | null) => (m === null ? "—" : m ? "met" : "NOT MET");
console.log("\n| figure | value | target | |\n| --- | --- | --- | --- |");
for (const r of rows) console.log(`| ${r.figure} | ${r.value}${r.note ? ` (${r.note})` : ""} | ${r.target} | ${mark(r.met)} |`);
console.log(
  `\nload average at the end ${os.loadavg()[0]!.toFixed(1)} (2 cores shared: figures are noisy, ratios in one run are what count)`,
);
