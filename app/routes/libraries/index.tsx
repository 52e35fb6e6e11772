import { redirect } from "react-router";
import type { Route } from "./+types/index";
import { requireUser } from "~/utils/auth.server";

export async function loader({ request }: Route.LoaderArgs) {
  await requireUser(request);
  return redirect("/libraries/fasteners");
}

// A page component keeps this a UI route, so a refusal (403) shows the kind "Not allowed" page
// rather than a bare response; the loader always redirects before it renders.
export default function LibrariesIndex() {
  return null;
}
