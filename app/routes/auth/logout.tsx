import { redirect } from "react-router";
import type { Route } from "./+types/logout";
import { endSession } from "~/utils/auth.server";

// Sign-out is a POST (no state change on GET); the session row is deleted server-side.
export async function action({ request }: Route.ActionArgs) {
  return endSession(request);
}

export function loader() {
  return redirect("/dashboard");
}
