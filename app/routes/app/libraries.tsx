import type { Route } from "./+types/libraries";
import { NotBuiltYet, PageTitle } from "~/components/app-shell";
import { requireRole } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Libraries · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "builder");
  return null;
}

export default function LibrariesPage() {
  return (
    <>
      <PageTitle>Libraries</PageTitle>
      <NotBuiltYet what="Fastener, gasket and material libraries arrive with the planner." />
    </>
  );
}
