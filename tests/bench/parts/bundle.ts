// Per-route initial JavaScript from the production build: the entry, the root and every route module
// on the way to the page, with their static imports, each file gzipped once (what a first visit loads).
import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";
import { fmt, type Row } from "./measure";

const CLIENT = path.resolve(import.meta.dirname, "../../../build/client");
export const BUDGET_KB = 170;

interface Entry {
  module: string;
  imports?: string[];
  parentId?: string;
}
interface Manifest {
  entry: Entry;
  routes: Record<string, Entry & { id: string }>;
}

export function readManifest(): Manifest {
  const dir = path.join(CLIENT, "assets");
  const file = fs.readdirSync(dir).find((f) => /^manifest-.*\.js$/.test(f));
  if (!file) throw new Error("No client manifest: run npm run build first.");
  const text = fs.readFileSync(path.join(dir, file), "utf8");
  return JSON.parse(text.slice(text.indexOf("{"), text.lastIndexOf("}") + 1)) as Manifest;
}

const gz = new Map<string, number>();
function gzipBytes(url: string): number {
  let n = gz.get(url);
  if (n === undefined) {
    n = zlib.gzipSync(fs.readFileSync(path.join(CLIENT, url))).length;
    gz.set(url, n);
  }
  return n;
}

/** Gzipped bytes of the JS a first visit to this route loads. */
export function initialJsBytes(m: Manifest, routeId: string): { bytes: number; files: string[] } {
  const files = new Set<string>([m.entry.module, ...(m.entry.imports ?? [])]);
  for (let id: string | undefined = routeId; id; id = m.routes[id]?.parentId) {
    const r = m.routes[id];
    if (!r) break;
    files.add(r.module);
    for (const i of r.imports ?? []) files.add(i);
  }
  let bytes = 0;
  for (const f of files) bytes += gzipBytes(f);
  return { bytes, files: [...files] };
}

const PAGES: [string, string][] = [
  ["dashboard", "routes/shop/dashboard"],
  ["engine list", "routes/engines/list"],
  ["plan editor", "routes/plans/editor"],
  ["plan list", "routes/plans/list"],
  ["sign-in", "routes/auth/login"],
];

export function bundleRows(): Row[] {
  const m = readManifest();
  const rows: Row[] = [];
  for (const [name, id] of PAGES) {
    if (!m.routes[id]) continue;
    const { bytes, files } = initialJsBytes(m, id);
    const zod = files.some((f) => /zod|schemas?-/i.test(path.basename(f)));
    rows.push({
      figure: `initial JS, ${name} (gzip)`,
      value: `${fmt(bytes / 1024, 1)} KB in ${files.length} files`,
      target: `≤ ${BUDGET_KB} KB`,
      met: bytes / 1024 <= BUDGET_KB,
      note: zod ? "a chunk named like zod is loaded" : undefined,
    });
  }
  // every route, not only the pages above: the largest by name, and any other over the budget
  const sizes = Object.keys(m.routes)
    .map((id) => ({ id, kb: initialJsBytes(m, id).bytes / 1024 }))
    .sort((a, b) => b.kb - a.kb);
  const largest = sizes[0] ?? { id: "none", kb: 0 };
  const over = sizes.filter((r) => r.kb > BUDGET_KB);
  rows.push({
    figure: "initial JS, largest route (gzip)",
    value: `${fmt(largest.kb, 1)} KB (${largest.id}, of ${sizes.length} routes)`,
    target: `≤ ${BUDGET_KB} KB`,
    met: largest.kb <= BUDGET_KB,
    note: over.length > 1 ? `over the budget: ${over.map((r) => `${r.id} ${fmt(r.kb, 1)} KB`).join(", ")}` : undefined,
  });
  return rows;
}
