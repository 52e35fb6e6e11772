// Shared by the bench parts: timing with warm-up, medians, and the rows of the final table.

export interface Row {
  figure: string;
  value: string;
  target: string;
  /** null where the figure is informative only. */
  met: boolean | null;
  note?: string;
}

let sink = 0;
/** CPU time of this process in ms (user + system): steadier than the wall clock on a shared machine. */
export function cpuMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/**
 * Median CPU time of one call, in ms, over `rounds` rounds of `batch` calls each, after a warm-up. CPU
 * time, not wall time: the machine is shared, and waiting for a core is not the code's cost.
 */
export function timeMs(fn: () => number, batch: number, rounds: number, warmup = batch): number {
  for (let i = 0; i < warmup; i++) sink += fn();
  const per = new Float64Array(rounds);
  for (let r = 0; r < rounds; r++) {
    const t0 = cpuMs();
    for (let i = 0; i < batch; i++) sink += fn();
    per[r] = (cpuMs() - t0) / batch;
  }
  per.sort();
  if (!Number.isFinite(sink)) sink = 0;
  return per[Math.floor(rounds / 2)];
}

export const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

export const fmt = (x: number, digits = 1) => x.toFixed(digits);
