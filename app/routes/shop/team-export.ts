import { exportTeam } from "~/models/team-export.server";
import { requireRole } from "~/utils/auth.server";
import type { Route } from "./+types/team-export";

// GET /team/export: the owner downloads the shop's data as one JSON file (docs/reliability.md).
export async function loader({ request }: Route.LoaderArgs) {
  const { team } = await requireRole(request, "owner");
  const body = await exportTeam(team.id);
  const day = body.exportedAt.slice(0, 10);
  return new Response(JSON.stringify(body, null, 2), {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="sealwright-team-${team.id}-${day}.json"`,
    },
  });
}
