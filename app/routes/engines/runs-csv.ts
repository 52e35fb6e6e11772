import { stringify } from "csv-stringify/sync";
import type { Route } from "./+types/runs-csv";
import { RUN_CSV_COLUMNS, runCsvRows, selectRuns } from "~/lib/records/run";
import { runQuery } from "~/lib/records/run-query";
import { requireEngine } from "~/models/engine.server";
import { listRuns } from "~/models/records.server";
import { requireUser } from "~/utils/auth.server";

// The engine's run log as CSV (SI figures, the table's filters and order), quoted by csv-stringify.
export async function loader({ request, params }: Route.LoaderArgs) {
  const { team, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const q = runQuery(new URL(request.url).searchParams);
  const runs = selectRuns(await listRuns(team.id, engine.id), q.filter, q.sort, q.dir);
  const csv = stringify([[...RUN_CSV_COLUMNS], ...runCsvRows(runs)]);
  const name = `runs-engine-${engine.id}.csv`;
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${name}"`,
      "X-Content-Type-Options": "nosniff",
    },
  });
}
