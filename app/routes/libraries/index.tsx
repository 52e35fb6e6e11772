import { redirect } from "react-router";
import type { Route } from "./+types/index";
import { requireRole } from "~/utils/auth.server";

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "builder");
  return redirect("/libraries/fasteners");
}
