import { redirect } from "react-router";
import type { Route } from "./+types/duplicate";
import { duplicateEngine, requireEngine } from "~/models/engine.server";
import { requireRole, requireUser } from "~/utils/auth.server";
import { redirectWithToast } from "~/utils/toast.server";

// POST only: a copy of the engine record and its stud pattern (not its plans). A GET lands on the engine.
export async function loader({ request, params }: Route.LoaderArgs) {
  const { who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  return redirect(`/engines/${engine.id}`);
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const copy = await duplicateEngine(team.id, user.id, engine.id);
  return redirectWithToast(
    request,
    `/engines/${copy.id}`,
    `“${copy.name}” made from “${engine.name}”: the record and stud pattern, no plans. Edit it to tell them apart.`,
  );
}
