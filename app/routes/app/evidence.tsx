import type { Route } from "./+types/evidence";
import { NotBuiltYet, PageTitle } from "~/components/app-shell";
import { requireRole } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Evidence · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "builder");
  return null;
}

export default function EvidencePage() {
  return (
    <>
      <PageTitle>Evidence</PageTitle>
      <NotBuiltYet what="Evidence across the shop's engines needs the run log, which is not built yet." />
    </>
  );
}
