import { data, redirect } from "react-router";
import type { Route } from "./+types/team-switch";
import { requireUser, safeRedirect } from "~/utils/auth.server";
import { parseId } from "~/utils/ids";
import { getSession, sessionStorage } from "~/utils/session.server";

// Switch the current shop; only to a team the person belongs to.
export async function action({ request }: Route.ActionArgs) {
  const { memberships } = await requireUser(request);
  const form = await request.formData();
  const teamId = parseId(form.get("teamId"));
  if (teamId === null || !memberships.some((m) => m.teamId === teamId)) throw data("You are not a member of that shop.", { status: 403 });
  const session = await getSession(request);
  session.set("teamId", teamId);
  return redirect(safeRedirect(String(form.get("returnTo") ?? "")), {
    headers: { "Set-Cookie": await sessionStorage().commitSession(session) },
  });
}

export function loader() {
  return redirect("/dashboard");
}
