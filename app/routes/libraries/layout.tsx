import { NavLink, Outlet } from "react-router";
import type { Route } from "./+types/layout";
import { PageTitle } from "~/components/app-shell";
import { requireUser } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Libraries · Sealwright" }];

// Everyone in the shop reads the libraries; only builders and owners change them (edit.tsx).
export async function loader({ request }: Route.LoaderArgs) {
  await requireUser(request);
  return null;
}

const TABS = [
  { to: "/libraries/fasteners", label: "Fasteners" },
  { to: "/libraries/gaskets", label: "Gaskets" },
  { to: "/libraries/materials", label: "Materials" },
];

export default function LibrariesLayout() {
  return (
    <>
      <PageTitle sub="The shop's fasteners, gaskets and materials. Handbook rows name their source; rows the shop entered say who entered them.">
        Libraries
      </PageTitle>
      <nav aria-label="Libraries" className="mb-6 flex gap-1 border-b border-forge-300">
        {TABS.map((t) => (
          <NavLink
            key={t.to}
            to={t.to}
            className={({ isActive }) =>
              `-mb-px rounded-t border px-4 py-2 font-medium ${
                isActive
                  ? "border-forge-300 border-b-white bg-white text-forge-950"
                  : "border-transparent text-copper-700 hover:bg-forge-100"
              }`
            }
          >
            {t.label}
          </NavLink>
        ))}
      </nav>
      <Outlet />
    </>
  );
}
