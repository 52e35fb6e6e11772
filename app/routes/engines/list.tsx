import { Form, Link } from "react-router";
import type { Route } from "./+types/list";
import { PageTitle } from "~/components/app-shell";
import { StatusBadge } from "~/components/engine-status";
// from the modules themselves, not the barrel: the barrel's schema would bring zod to this page
import { layoutName, STATUS_LABEL } from "~/lib/engine/labels";
import { ENGINE_PAGE_SIZE, readEngineListQuery } from "~/lib/engine/list-query";
import { ENGINE_STATUSES, type EngineStatus } from "~/lib/engine/status";
import { formatQuantity } from "~/lib/units";
import { isEngineSort, listEngines, type EngineSort } from "~/models/engine.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Engines · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  const { user, role, who } = await requireUser(request);
  const query = readEngineListQuery(new URL(request.url).searchParams, isEngineSort, "updated");
  const { rows, total } = await listEngines(who, { ...query, pageSize: ENGINE_PAGE_SIZE });
  return { rows, total, ...query, pageSize: ENGINE_PAGE_SIZE, units: user.units, canEdit: roleAtLeast(role, "builder") };
}

const COLUMNS: { key: EngineSort; label: string; numeric?: boolean }[] = [
  { key: "name", label: "Name" },
  { key: "customer", label: "Customer" },
  { key: "layout", label: "Layout" },
  { key: "bore", label: "Bore", numeric: true },
  { key: "fuel", label: "Fuel" },
  { key: "boost", label: "Target boost", numeric: true },
  { key: "status", label: "Status" },
  { key: "plan", label: "Chosen plan" },
  { key: "updated", label: "Updated" },
];

export default function EngineList({ loaderData }: Route.ComponentProps) {
  const { rows, total, page, pageSize, q, status, sort, dir, units, canEdit } = loaderData;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const href = (over: Record<string, string | number>) => {
    const sp = new URLSearchParams();
    const all = { q, status, sort, dir, page, ...over };
    for (const [k, v] of Object.entries(all)) if (v !== "" && !(k === "page" && v === 1)) sp.set(k, String(v));
    return `?${sp.toString()}`;
  };
  const filtered = q !== "" || status !== "";
  return (
    <>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageTitle sub="Every engine this shop has quoted, is building, runs or has retired.">Engines</PageTitle>
        {canEdit ? (
          <Link to="/engines/new" className="rounded bg-copper-700 px-4 py-2 font-medium text-white hover:bg-copper-600">
            New engine
          </Link>
        ) : null}
      </div>

      <Form method="get" role="search" className="mb-4 flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="engine-q" className="block text-sm font-medium text-forge-800">
            Search name, customer or fuel
          </label>
          <input
            id="engine-q"
            type="search"
            name="q"
            defaultValue={q}
            className="mt-1 w-72 rounded border border-forge-500 bg-white px-3 py-2"
          />
        </div>
        <div>
          <label htmlFor="engine-status" className="block text-sm font-medium text-forge-800">
            Status
          </label>
          <select
            id="engine-status"
            name="status"
            defaultValue={status}
            className="mt-1 rounded border border-forge-500 bg-white px-3 py-2"
          >
            <option value="">Any status</option>
            {ENGINE_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABEL[s].word}
              </option>
            ))}
          </select>
        </div>
        <input type="hidden" name="sort" value={sort} />
        <input type="hidden" name="dir" value={dir} />
        <button type="submit" className="rounded border border-forge-300 bg-white px-4 py-2 font-medium hover:bg-forge-100">
          Show
        </button>
        {filtered ? (
          <Link to="/engines" className="py-2 text-copper-700 underline">
            Clear
          </Link>
        ) : null}
      </Form>

      {rows.length === 0 ? (
        <div className="rounded border border-dashed border-forge-300 bg-white p-6">
          {total > 0 ? (
            <p>
              No engines on page {page}; the list has {pages} page{pages > 1 ? "s" : ""}.{" "}
              <Link to={href({ page: 1 })} className="text-copper-700 underline">
                Back to page 1
              </Link>
            </p>
          ) : filtered ? (
            <p>
              No engine matches {q ? <>“{q}”</> : "that filter"}
              {status ? ` with status ${STATUS_LABEL[status as EngineStatus].word.toLowerCase()}` : ""}.
            </p>
          ) : (
            <>
              <p className="font-bold">No engines yet.</p>
              <p className="mt-1 text-forge-700">
                An engine record holds the geometry, materials, sleeves, stud pattern and boost target its seal plans work from.
                {canEdit ? " Start with “New engine”." : " A builder in this shop adds them."}
              </p>
            </>
          )}
        </div>
      ) : (
        <div className="overflow-x-auto rounded border border-forge-100 bg-white">
          <table className="w-full border-collapse text-left tabular">
            <caption className="sr-only">
              Engines, sorted by {COLUMNS.find((c) => c.key === sort)?.label.toLowerCase()} {dir === "asc" ? "ascending" : "descending"}
            </caption>
            <thead className="bg-forge-100 text-sm">
              <tr>
                {COLUMNS.map((c) => {
                  const active = c.key === sort;
                  const next = active && dir === "asc" ? "desc" : active ? "asc" : c.key === "updated" ? "desc" : "asc";
                  return (
                    <th
                      key={c.key}
                      scope="col"
                      aria-sort={active ? (dir === "asc" ? "ascending" : "descending") : undefined}
                      className={`whitespace-nowrap px-3 py-2 ${c.numeric ? "text-right" : ""}`}
                    >
                      <Link to={href({ sort: c.key, dir: next, page: 1 })} className="hover:underline">
                        {c.label}
                        <span aria-hidden="true" className="ml-1 text-copper-700">
                          {active ? (dir === "asc" ? "▲" : "▼") : ""}
                        </span>
                      </Link>
                    </th>
                  );
                })}
              </tr>
            </thead>
            <tbody>
              {rows.map((e) => (
                <tr key={e.id} className="border-t border-forge-100 hover:bg-forge-50">
                  <td className="px-3 py-2 font-medium">
                    <Link to={`/engines/${e.id}`} className="text-copper-700 underline">
                      {e.name}
                    </Link>
                  </td>
                  <td className="px-3 py-2">{e.customer || "—"}</td>
                  <td className="px-3 py-2">{layoutName(e.layout, e.cylinders)}</td>
                  <td className="whitespace-nowrap px-3 py-2 text-right">{formatQuantity(e.boreMm, "length", units)}</td>
                  <td className="px-3 py-2">{e.fuel || "—"}</td>
                  <td className="whitespace-nowrap px-3 py-2 text-right">{formatQuantity(e.targetManifoldKpa, "manifold", units)}</td>
                  <td className="px-3 py-2">
                    <StatusBadge status={e.status} />
                  </td>
                  <td className="px-3 py-2">{e.chosenPlanName ?? <span className="text-forge-700">none yet</span>}</td>
                  <td className="whitespace-nowrap px-3 py-2 text-sm">
                    <time dateTime={e.updatedAt}>{e.updatedAt.slice(0, 10)}</time>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      {total > 0 ? (
        <nav aria-label="Pages" className="mt-4 flex flex-wrap items-center gap-4">
          <p>
            {(page - 1) * pageSize + 1}–{Math.min(page * pageSize, total)} of {total} engine{total === 1 ? "" : "s"}
          </p>
          {pages > 1 ? (
            <>
              {page > 1 ? (
                <Link to={href({ page: page - 1 })} className="rounded border border-forge-300 bg-white px-3 py-1">
                  ← Previous
                </Link>
              ) : null}
              <span>
                Page {page} of {pages}
              </span>
              {page < pages ? (
                <Link to={href({ page: page + 1 })} className="rounded border border-forge-300 bg-white px-3 py-1">
                  Next →
                </Link>
              ) : null}
            </>
          ) : null}
        </nav>
      ) : null}
    </>
  );
}
