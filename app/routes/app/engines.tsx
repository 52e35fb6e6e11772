import type { Route } from "./+types/engines";
import { NotBuiltYet, PageTitle } from "~/components/app-shell";
import { requireRole } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Engines · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "viewer");
  return null;
}

export default function EnginesPage() {
  return (
    <>
      <PageTitle>Engines</PageTitle>
      <NotBuiltYet what="The engine table and engine pages arrive with the planner; until then there is nothing to list." />
    </>
  );
}
