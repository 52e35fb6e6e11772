import type { Knex } from "knex";
import { beforeAll, describe, expect, it } from "vitest";
import { engineStatusCounts, listEngines } from "~/models/engine.server";
import { listPlans } from "~/models/plan.server";
import { listAuditEvents, livePlans } from "~/models/team.server";
import { appDb, ownerDb } from "../setup/db-roles";
import { onPostgres, rowsOf } from "../setup/engine";
import { capturedSelects } from "./captured-selects";
import { chosenPlanVerdictsOneByOne } from "./one-by-one-verdicts";

// PostgreSQL's plans of the hot queries (engine list, plan list, dashboard counts and verdicts, activity)
// at hosted size: 5,000 engines and 30,000 plans in one team (issue 15). The statements are the ones the
// model functions send (captured from Knex); each is EXPLAINed as the app role with the team set, so the
// row-security predicates are in the plan too. A Seq Scan of a team-scoped table fails the test.

const TEAM_TABLES = new Set([
  "engines",
  "seal_plans",
  "audit_events",
  "materials",
  "fasteners",
  "gaskets",
  "memberships",
  "sessions",
  "engine_shares",
  "assemblies",
  "runs",
  "files",
  "machining_records",
]);
const ENGINES = 5000;
const PLANS_PER_ENGINE = 6;

type PlanNode = { "Node Type": string; "Relation Name"?: string; Plans?: PlanNode[] };

function nodes(n: PlanNode): PlanNode[] {
  return [n, ...(n.Plans ?? []).flatMap(nodes)];
}

// A Seq Scan of a table that holds a handful of rows (a shop's library, its members) is the right plan;
// one of a table that grows with the shop's work (engines, plans, activity) is what the test is for.
const SMALL_ROWS = 1000;

/** The team-scoped tables a plan reads in full, of those large enough for it to matter. */
async function fullScans(plan: PlanNode): Promise<string[]> {
  const scanned = nodes(plan)
    .filter((n) => n["Node Type"] === "Seq Scan" && TEAM_TABLES.has(n["Relation Name"] ?? ""))
    .map((n) => n["Relation Name"]!);
  const out: string[] = [];
  for (const table of scanned) {
    const [row] = rowsOf<{ n: number }>(await ownerDb().raw("select reltuples::bigint as n from pg_class where relname = ?", [table]));
    if (Number(row?.n ?? 0) > SMALL_ROWS) out.push(table);
  }
  return out;
}

/** The plan of each captured statement as the app role for the team, and the team tables it reads in full. */
async function seqScans(teamId: number, run: () => Promise<unknown>): Promise<{ sql: string; seq: string[]; plan: string }[]> {
  const out: { sql: string; seq: string[]; plan: string }[] = [];
  for (const captured_ of await capturedSelects(run)) {
    // the query event carries pg's $1, $2 … placeholders; knex.raw takes ? in the same order
    const q = { sql: captured_.sql.replace(/\$\d+/g, "?"), bindings: captured_.bindings };
    const [json, text] = await appDb().transaction(async (trx: Knex.Transaction) => {
      await trx.raw("select set_config('app.team_id', ?, true)", [String(teamId)]);
      const j = rowsOf<{ "QUERY PLAN": { Plan: PlanNode }[] }>(await trx.raw(`explain (format json) ${q.sql}`, q.bindings as never[]));
      const t = rowsOf<{ "QUERY PLAN": string }>(await trx.raw(`explain ${q.sql}`, q.bindings as never[]));
      return [j[0]!["QUERY PLAN"][0]!.Plan, t.map((r) => r["QUERY PLAN"]).join("\n")] as const;
    });
    const seq = await fullScans(json);
    out.push({ sql: q.sql, seq, plan: text });
  }
  return out;
}

const owner = (teamId: number) => ({ teamId, userId: 0, role: "owner" as const });

describe.runIf(onPostgres)("hot query plans on PostgreSQL at 5,000 engines / 30,000 plans", () => {
  let teamId = 0;
  let engineId = 0;

  // copies of one demo engine and its plan, made in SQL as the owner (seconds, not minutes), then ANALYZE
  beforeAll(async () => {
    const k = ownerDb();
    const e = await k("engines").whereNotNull("chosen_plan_id").orderBy("id").first();
    teamId = e.team_id as number;
    engineId = e.id as number;
    const cols = async (table: string) =>
      rowsOf<{ column_name: string }>(
        await k.raw(
          "select column_name from information_schema.columns where table_schema = 'public' and table_name = ? and column_name <> 'id' order by ordinal_position",
          [table],
        ),
      ).map((r) => r.column_name);
    const engineCols = (await cols("engines")).filter((c) => c !== "chosen_plan_id");
    const pick = (c: string, replace: Record<string, string>) => replace[c] ?? `src.${c}`;
    await k.raw(
      `insert into engines (${engineCols.join(", ")}) select ${engineCols
        .map((c) => pick(c, { name: "'Bulk ' || g", status: "(array['quoted','in-build','running','retired'])[1 + g % 4]" }))
        .join(", ")} from engines src cross join generate_series(1, ${ENGINES - 1}) g where src.id = ?`,
      [engineId],
    );
    // a hosted server holds many shops: the other team gets nine times as many engines, so the team filter
    // is selective, as it is in production (with one shop holding every row, a Seq Scan is the right plan)
    const otherTeam = (await k("teams").whereNot({ id: teamId }).orderBy("id").first("id"))!.id as number;
    await k.raw(
      `insert into engines (${engineCols.join(", ")}) select ${engineCols
        .map((c) => pick(c, { name: "'Other shop ' || g", team_id: String(otherTeam) }))
        .join(", ")} from engines src cross join generate_series(1, ${ENGINES * 9}) g where src.id = ?`,
      [engineId],
    );
    const planCols = await cols("seal_plans");
    const plan = await k("seal_plans").where({ id: e.chosen_plan_id }).first("id");
    await k.raw(
      `insert into seal_plans (${planCols.join(", ")}) select ${planCols
        .map((c) => pick(c, { engine_id: "be.id", name: "'Bulk plan ' || g" }))
        .join(
          ", ",
        )} from seal_plans src cross join (select id from engines where team_id = ? and name like 'Bulk %') be cross join generate_series(1, ${PLANS_PER_ENGINE}) g where src.id = ?`,
      [teamId, plan.id],
    );
    await k.raw(
      "update engines set chosen_plan_id = (select min(p.id) from seal_plans p where p.engine_id = engines.id) where name like 'Bulk %'",
    );
    await k.raw(
      `insert into audit_events (team_id, action, detail, created_at) select ?, 'engine.updated', '{}', to_char(now() - g * interval '1 minute', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') from generate_series(1, 20000) g`,
      [teamId],
    );
    await k.raw("analyze");
    const counts = await k("engines").where({ team_id: teamId }).count({ n: "*" });
    expect(Number(counts[0]!.n)).toBeGreaterThanOrEqual(ENGINES);
    const plans = await k("seal_plans").where({ team_id: teamId }).count({ n: "*" });
    expect(Number(plans[0]!.n)).toBeGreaterThanOrEqual(ENGINES * PLANS_PER_ENGINE - PLANS_PER_ENGINE);
  }, 120_000);

  const HOT: [string, () => Promise<unknown>][] = [
    ["dashboard activity", () => listAuditEvents(teamId, 10)],
    ["dashboard engine counts", () => engineStatusCounts(owner(teamId))],
    ["dashboard chosen-plan verdicts", () => chosenPlanVerdictsOneByOne(owner(teamId), "metric")],
    ["engine list, default sort", () => listEngines(owner(teamId), {})],
    ["engine list by name", () => listEngines(owner(teamId), { sort: "name", dir: "asc" })],
    ["engine list by status filter", () => listEngines(owner(teamId), { status: "running" })],
    ["plan list", () => listPlans(teamId, engineId)],
    ["activity plan names", () => livePlans(teamId, [1, 2, 3])],
  ];

  for (const [name, run] of HOT) {
    it(`${name}: no Seq Scan of a team-scoped table`, async () => {
      const ps = await seqScans(teamId, run);
      expect(ps.length).toBeGreaterThan(0);
      if (process.env.QUERY_PLANS_PRINT) for (const p of ps) console.log(`-- ${name}\n${p.sql}\n${p.plan}\n`);
      for (const p of ps) expect({ sql: p.sql, seq: p.seq, plan: p.plan }).toMatchObject({ sql: p.sql, seq: [] });
    }, 60_000);
  }

  it("the detector itself sees a Seq Scan of a large team table, and passes a small one", async () => {
    const explain = async (sql: string) =>
      rowsOf<{ "QUERY PLAN": { Plan: PlanNode }[] }>(await ownerDb().raw(`explain (format json) ${sql}`))[0]!["QUERY PLAN"][0]!.Plan;
    expect(await fullScans(await explain("select id from engines where fuel = 'E85'"))).toEqual(["engines"]);
    expect(await fullScans(await explain("select id from materials where kind = 'iron'"))).toEqual([]);
  });
});
