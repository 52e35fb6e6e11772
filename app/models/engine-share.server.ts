import { data } from "react-router";
import { type DbRow, now, withTeam, writeTransaction } from "~/utils/db.server";
import { recordAudit } from "./audit.server";

// Which of the shop's viewers (customers, tuners) may see an engine. Builders and owners see every
// engine of the shop; a viewer sees only those shared here (app/models/viewer-scope.server.ts).

export interface ViewerShare {
  userId: number;
  name: string;
  email: string;
  shared: boolean;
}

function toViewerShare(r: DbRow): ViewerShare {
  return { userId: r.user_id, name: r.name, email: r.email, shared: r.shared_at !== null };
}

/** The shop's viewers, each with whether this engine is shared with them. */
export async function engineViewers(teamId: number, engineId: number): Promise<ViewerShare[]> {
  const rows = await withTeam(teamId, (k) =>
    k("memberships as m")
      .join("users as u", "u.id", "m.user_id")
      .leftJoin("engine_shares as s", function () {
        this.on("s.user_id", "=", "m.user_id").andOn("s.team_id", "=", "m.team_id").andOnVal("s.engine_id", "=", engineId);
      })
      .where({ "m.team_id": teamId, "m.role": "viewer" })
      .orderBy("u.name")
      // created_at alone would not say whose: it is the share's, the moment the engine was shared
      .select("m.user_id", "u.name", "u.email", { shared_at: "s.created_at" }),
  );
  return rows.map(toViewerShare);
}

/** Shares the engine (this team's, not archived) with one of the team's viewers; anything else is 404. */
export async function setEngineShare(teamId: number, byUserId: number, engineId: number, viewerId: number, shared: boolean): Promise<void> {
  await writeTransaction(
    async (trx) => {
      const engine = await trx("engines").where({ team_id: teamId, id: engineId }).whereNull("archived_at").first("id");
      if (!engine) throw data("No such engine in this shop.", { status: 404 });
      const viewer = await trx("memberships").where({ team_id: teamId, user_id: viewerId, role: "viewer" }).first("user_id");
      if (!viewer) throw data("No such viewer in this shop.", { status: 404 });
      const key = { engine_id: engineId, user_id: viewerId, team_id: teamId };
      if (shared) {
        if (!(await trx("engine_shares").where(key).first("engine_id")))
          await trx("engine_shares").insert({ ...key, shared_by: byUserId, created_at: now() });
      } else {
        await trx("engine_shares").where(key).delete();
      }
      await recordAudit(trx, teamId, byUserId, shared ? "engine.shared" : "engine.unshared", { engineId, viewerId });
    },
    { teamId },
  );
}
