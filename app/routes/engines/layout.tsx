import { isRouteErrorResponse, Link, NavLink, Outlet } from "react-router";
import type { Route } from "./+types/layout";
import { StatusBadge } from "~/components/engine-status";
import { layoutName } from "~/lib/engine/labels";
import { requireEngine } from "~/models/engine.server";
import { roleAtLeast, requireUser } from "~/utils/auth.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.engine.name ?? "Engine"} · Sealwright` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  return { engine, role, canEdit: roleAtLeast(role, "builder") };
}

const TABS: { to: string; label: string; end?: boolean; builder?: boolean }[] = [
  { to: ".", label: "Overview", end: true },
  { to: "plans", label: "Seal plans" },
  { to: "chamber", label: "Chamber" },
  { to: "build-sheet", label: "Build sheet" },
  { to: "sharing", label: "Sharing", builder: true },
  { to: "assembly", label: "Assembly" },
  { to: "machining", label: "Machining" },
  { to: "runs", label: "Runs" },
  { to: "files", label: "Files" },
];

export default function EngineLayout({ loaderData }: Route.ComponentProps) {
  const { engine } = loaderData;
  return (
    <>
      <p className="no-print mb-2 text-sm">
        <Link to="/engines" className="text-copper-700 underline">
          ← Engines
        </Link>
      </p>
      <header className="mb-4 flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h1 className="text-3xl font-bold">{engine.name}</h1>
        <span className="text-lg text-forge-700">
          {layoutName(engine.layout, engine.cylinders)}
          {engine.customer ? ` · for ${engine.customer}` : ""}
        </span>
        <StatusBadge status={engine.status} />
      </header>
      <nav aria-label="Engine" className="no-print mb-6 border-b border-forge-300">
        <ul className="-mb-px flex flex-wrap gap-1">
          {TABS.filter((tab) => !tab.builder || loaderData.canEdit).map((tab) => (
            <li key={tab.label}>
              <NavLink
                to={tab.to}
                end={tab.end}
                className={({ isActive }) =>
                  `block border-b-2 px-3 py-2 text-base ${isActive ? "border-copper-600 font-bold text-forge-950" : "border-transparent text-forge-700 hover:text-forge-950"}`
                }
              >
                {tab.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <Outlet />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  const status = isRouteErrorResponse(error) ? error.status : 500;
  const title = status === 404 ? "No such engine" : status === 403 ? "Not open to your role" : "Something went wrong";
  const text =
    status === 404
      ? "This shop has no engine at that address. It may have been archived, or it belongs to another shop."
      : isRouteErrorResponse(error)
        ? String(error.data)
        : "The engine page could not be shown.";
  return (
    <div className="rounded border border-forge-300 bg-white p-6">
      <title>{`${title} · Sealwright`}</title>
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="mt-2 text-forge-700">{text}</p>
      <p className="mt-4">
        <Link to="/engines" className="text-copper-700 underline">
          Back to the engines
        </Link>
      </p>
    </div>
  );
}
