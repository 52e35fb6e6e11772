// The engine table's address (?q=&status=&sort=&dir=&page=) → the query it asks for, with defaults
// for anything missing or not understood: a hand-edited address shows a table, never an error.
import { ENGINE_STATUSES, type EngineStatus } from "./status";

export const ENGINE_PAGE_SIZE = 25;
/** Past any real list; a larger page number would overflow SQLite's integer offset. */
export const ENGINE_MAX_PAGE = 1_000_000;
/** The longest search text kept (an engine name is at most 120 characters). */
export const ENGINE_SEARCH_MAX = 120;

export interface EngineListQuery<Sort extends string> {
  q: string;
  status: EngineStatus | "";
  sort: Sort;
  dir: "asc" | "desc";
  page: number;
}

/**
 * Read the table's query. `isSort` says which column keys exist (the model keeps their SQL);
 * unsorted means "updated", newest first; any other column reads ascending unless asked.
 */
export function readEngineListQuery<Sort extends string>(
  params: URLSearchParams,
  isSort: (s: string) => s is Sort,
  defaultSort: Sort,
): EngineListQuery<Sort> {
  const statusParam = params.get("status") ?? "";
  const sortParam = params.get("sort") ?? "";
  const sort = isSort(sortParam) ? sortParam : defaultSort;
  const dirParam = params.get("dir");
  return {
    q: (params.get("q") ?? "").slice(0, ENGINE_SEARCH_MAX),
    status: (ENGINE_STATUSES as readonly string[]).includes(statusParam) ? (statusParam as EngineStatus) : "",
    sort,
    dir: dirParam === "asc" || dirParam === "desc" ? dirParam : sort === defaultSort ? "desc" : "asc",
    page: Math.min(ENGINE_MAX_PAGE, Math.max(1, Math.floor(Number(params.get("page")) || 1))),
  };
}
