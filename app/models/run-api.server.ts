import type { Knex } from "knex";
import type { z } from "zod";
import type { RunCreateSchema } from "~/lib/api/schemas";
import { db, type DbRow, now, withTeam, writeTransaction } from "~/utils/db.server";
import { getEngine } from "./engine.server";
import { viewerScope, type Asker } from "./viewer-scope.server";
import { recordAudit } from "./audit.server";

// What the API needs of the run log, over the `runs` table the run-log branch creates (this branch
// creates no such table). The columns it expects:
//   id (increments), team_id, engine_id, ran_on (ISO date text), kind, manifold_pressure_kpa (nullable),
//   fuel, peak_cylinder_pressure_mpa (nullable), peak_pressure_source ('measured' | 'estimated'),
//   outcome, cylinders_affected (JSON text: an array of cylinder numbers), notes, created_by, created_at;
//   and, as the run-log branch's migration (20261217000000_records.ts) has them, plan_id (nullable),
//   teardown_findings and updated_at.

export const RUNS_TABLE = "runs";
export type RunCreate = z.output<typeof RunCreateSchema>;

export interface RunApiRow {
  id: number;
  engineId: number;
  ranOn: string;
  kind: RunCreate["kind"];
  manifoldPressureKpa: number | null;
  fuel: string;
  peakCylinderPressureMpa: number | null;
  peakPressureSource: "measured" | "estimated";
  outcome: RunCreate["outcome"];
  cylindersAffected: number[];
  notes: string;
  teardownFindings: string;
  planId: number | null;
  createdBy: number | null;
  createdAt: string;
}

export interface RunFilter {
  engineId?: number;
  kind?: string;
  outcome?: string;
  from?: string;
  to?: string;
  /** The id of the last run on the previous page (runs come newest id first). */
  cursor?: number;
  limit: number;
}

function toRun(r: DbRow): RunApiRow {
  let cylinders: number[] = [];
  try {
    const parsed = JSON.parse(r.cylinders_affected ?? "[]");
    if (Array.isArray(parsed)) cylinders = parsed.filter((n) => Number.isInteger(n));
  } catch {
    // a hand-edited row: shown with no cylinders rather than failing the whole list
  }
  return {
    id: r.id,
    engineId: r.engine_id,
    ranOn: r.ran_on,
    kind: r.kind,
    manifoldPressureKpa: r.manifold_pressure_kpa ?? null,
    fuel: r.fuel ?? "",
    peakCylinderPressureMpa: r.peak_cylinder_pressure_mpa ?? null,
    peakPressureSource: r.peak_pressure_source,
    outcome: r.outcome,
    cylindersAffected: cylinders,
    notes: r.notes ?? "",
    teardownFindings: r.teardown_findings ?? "",
    planId: r.plan_id ?? null,
    createdBy: r.created_by ?? null,
    createdAt: r.created_at,
  };
}

/** One page of the team's runs, newest first; the next cursor is null on the last page. */
export async function listRunsForApi(who: Asker, f: RunFilter): Promise<{ rows: RunApiRow[]; nextCursor: string | null }> {
  const q = db()(RUNS_TABLE)
    .where({ team_id: who.teamId })
    // a viewer sees the runs of the engines shared with them only
    .whereIn("engine_id", viewerScope(db()("engines").select("engines.id"), who));
  if (f.engineId !== undefined) q.andWhere({ engine_id: f.engineId });
  if (f.kind) q.andWhere({ kind: f.kind });
  if (f.outcome) q.andWhere({ outcome: f.outcome });
  if (f.from) q.andWhere("ran_on", ">=", f.from);
  if (f.to) q.andWhere("ran_on", "<=", f.to);
  if (f.cursor !== undefined) q.andWhere("id", "<", f.cursor);
  // one more than the page tells whether another page follows
  // built above on db(); run inside the team's scope (on PostgreSQL a transaction with app.team_id set)
  const rows = await withTeam(who.teamId, (k) =>
    (k.isTransaction ? q.transacting(k as Knex.Transaction) : q).orderBy("id", "desc").limit(f.limit + 1),
  );
  const page = rows.slice(0, f.limit).map(toRun);
  return { rows: page, nextCursor: rows.length > f.limit ? String(page.at(-1)!.id) : null };
}

export type RunCreateResult = { ok: true; run: RunApiRow } | { ok: false; status: 400 | 404; path: string; message: string };

/**
 * Logs a run on one of the team's engines, with its audit row. The plan is the engine's chosen plan at
 * the time (the run log's own form may know better: its latest assembly on or before the day).
 */
export async function createRunForApi(who: Asker, run: RunCreate): Promise<RunCreateResult> {
  const { teamId, userId } = who;
  const engine = await getEngine(who, run.engineId);
  if (!engine) return { ok: false, status: 404, path: "engineId", message: "not an engine of this shop" };
  const beyond = run.cylindersAffected.find((c) => c > engine.cylinders);
  if (beyond !== undefined)
    return {
      ok: false,
      status: 400,
      path: "cylindersAffected",
      message: `the engine has ${engine.cylinders} cylinders; there is no cylinder ${beyond}`,
    };
  const stored = await writeTransaction(
    async (trx) => {
      const createdAt = now();
      const [row] = await trx(RUNS_TABLE)
        .insert({
          team_id: teamId,
          engine_id: engine.id,
          ran_on: run.ranOn,
          kind: run.kind,
          manifold_pressure_kpa: run.manifoldPressureKpa,
          fuel: run.fuel,
          peak_cylinder_pressure_mpa: run.peakCylinderPressureMpa,
          peak_pressure_source: run.peakPressureSource,
          outcome: run.outcome,
          cylinders_affected: JSON.stringify(run.cylindersAffected),
          notes: run.notes,
          teardown_findings: run.teardownFindings,
          plan_id: engine.chosenPlanId,
          created_by: userId,
          created_at: createdAt,
          updated_at: createdAt,
        })
        .returning("id");
      const id = typeof row === "object" ? row.id : row;
      await recordAudit(trx, teamId, userId, "run.logged", { engineId: engine.id, runId: id }, createdAt);
      return toRun(await trx(RUNS_TABLE).where({ id }).first());
    },
    { teamId: who.teamId },
  );
  return { ok: true, run: stored };
}
