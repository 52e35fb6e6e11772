import { db } from "~/utils/db.server";
import type { Route } from "./+types/healthz";

// For a process supervisor: answers once the database answers.
export async function loader(_args: Route.LoaderArgs) {
  await db().raw("select 1");
  return Response.json({ ok: true });
}
