import { db } from "~/utils/db.server";

// For a process supervisor: answers once the database answers.
export async function loader() {
  await db().raw("select 1");
  return Response.json({ ok: true });
}
