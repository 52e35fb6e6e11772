import { readManifest, initialJsBytes } from "./parts/bundle";
import zlib from "node:zlib"; import fs from "node:fs";
const m = readManifest();
for (const id of ["routes/plans/editor", "routes/plans/list"]) { const r = initialJsBytes(m, id); console.log(id); for (const f of r.files) console.log("  ", (zlib.gzipSync(fs.readFileSync("build/client" + f)).length/1024).toFixed(1), f); }
