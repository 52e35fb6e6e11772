import { Outlet } from "react-router";
import type { Route } from "./+types/layout";
import { AppShell } from "~/components/app-shell";
import { ToastLine } from "~/components/toast-line";
import { useRootData } from "~/root";
import { requireUser } from "~/utils/auth.server";
import { navFor } from "~/utils/navigation";

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team, role, memberships } = await requireUser(request);
  return { user, team, role, memberships, nav: navFor(role) };
}

export default function AppLayout({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell {...loaderData}>
      <ToastLine toast={useRootData()?.toast} />
      <Outlet />
    </AppShell>
  );
}
