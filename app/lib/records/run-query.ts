// The run table's query string → filter and sort; anything unknown is ignored.
import { OUTCOMES, RUN_KINDS, RUN_SORTS, type RunFilter, type RunSort } from "./run";

export function runQuery(params: URLSearchParams): { filter: RunFilter; sort: RunSort; dir: "asc" | "desc" } {
  const kind = params.get("kind") ?? "";
  const outcome = params.get("outcome") ?? "";
  const fuel = params.get("fuel") ?? "";
  const sort = params.get("sort") ?? "";
  return {
    filter: {
      ...((RUN_KINDS as readonly string[]).includes(kind) ? { kind: kind as RunFilter["kind"] } : {}),
      ...(outcome === "failed" || (OUTCOMES as readonly string[]).includes(outcome) ? { outcome: outcome as RunFilter["outcome"] } : {}),
      ...(fuel ? { fuel: fuel.slice(0, 60) } : {}),
    },
    sort: (RUN_SORTS as readonly string[]).includes(sort) ? (sort as RunSort) : "ranOn",
    dir: params.get("dir") === "asc" ? "asc" : "desc",
  };
}
