// The dashboard on the demo shop and on the large invented one (tests/bench/dataset.ts), each request
// alone (one connection), the same server build and machine, one after the other.
import path from "node:path";
import fs from "node:fs";
import { growShop, BIG } from "../dataset";
import { hammer, signIn, startServer } from "./server";
import { fmt, type Row } from "./measure";

const ROOT = path.resolve(import.meta.dirname, "../../..");

async function dashboardMs(dbPath: string, seed: boolean, grow: boolean): Promise<number> {
  if (grow) {
    const s = await startServer(dbPath, true);
    await s.stop();
    growShop(dbPath);
  }
  const server = await startServer(dbPath, seed && !grow);
  try {
    const cookie = await signIn();
    const headers = { cookie };
    await hammer("warm", { url: "/dashboard", headers, amount: 10, connections: 1 });
    return (await hammer("dashboard", { url: "/dashboard", headers, amount: 60, connections: 1 })).p50;
  } finally {
    await server.stop();
  }
}

export async function datasetRows(): Promise<Row[]> {
  const dir = path.join(ROOT, "tests/.bench-data");
  const demo = await dashboardMs(path.join(dir, "demo.sqlite"), true, false);
  const big = await dashboardMs(path.join(dir, "big.sqlite"), true, true);
  fs.rmSync(path.join(dir, "big.sqlite"), { force: true });
  const ratio = big / demo;
  return [
    { figure: "dashboard p50, demo shop (one connection)", value: `${fmt(demo, 1)} ms`, target: "baseline", met: null },
    {
      figure: `dashboard p50, ${BIG.engines.toLocaleString("en")} engines / ${BIG.plans.toLocaleString("en")} plans / ${BIG.activity.toLocaleString("en")} activity rows`,
      value: `${fmt(big, 1)} ms (×${fmt(ratio, 2)} the demo)`,
      target: "≤ ×2 the demo",
      met: ratio <= 2,
    },
  ];
}
