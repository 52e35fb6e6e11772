import { readManifest, initialJsBytes } from "./parts/bundle";
import zlib from "node:zlib"; import fs from "node:fs";
const m = readManifest();
const sizes = Object.keys(m.routes).map((id) => [id, initialJsBytes(m, id).bytes] as const).sort((a, b) => b[1] - a[1]);
console.log(sizes.slice(0, 6).map(([i, b]) => `${i} ${(b / 1024).toFixed(1)}`).join("\n"));
for (const id of [sizes[0][0], "routes/plans/editor"]) {
  console.log("==", id);
  for (const f of initialJsBytes(m, id).files) console.log((zlib.gzipSync(fs.readFileSync("build/client" + f)).length / 1024).toFixed(1), f);
}
