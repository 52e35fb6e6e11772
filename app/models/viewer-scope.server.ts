import type { Knex } from "knex";
import { db } from "~/utils/db.server";
import type { Role } from "./user.server";

/**
 * Who is asking: the team they are in, who they are and their role there. Engine queries take this
 * instead of a bare team id, because a viewer (a customer, a tuner) sees only the engines shared with
 * them, while builders and owners see every engine of the team.
 */
export interface Asker {
  teamId: number;
  userId: number;
  role: Role;
}

/** The engines this viewer has been given, as a subquery of engine ids. */
function sharedEngineIds(who: Asker): Knex.QueryBuilder {
  return db()("engine_shares").where({ team_id: who.teamId, user_id: who.userId }).select("engine_id");
}

/**
 * Narrows a query over engines to those the asker may see: the team's, and for a viewer only the ones
 * shared with them. `alias` is the engines table's name or alias in the query ("e" or "engines").
 */
export function viewerScope<Q extends Knex.QueryBuilder>(query: Q, who: Asker, alias = "engines"): Q {
  // a bare team id from an untyped caller would scope nothing: refuse it loudly
  if (typeof who !== "object" || !Number.isInteger(who.teamId))
    throw new TypeError("viewerScope needs who is asking (an Asker), not a team id");
  query.where(`${alias}.team_id`, who.teamId);
  if (who.role === "viewer") query.whereIn(`${alias}.id`, sharedEngineIds(who));
  return query;
}
