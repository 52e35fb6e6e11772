import { describe, expect, it } from "vitest";
import { engineStatusCounts, listEngines } from "~/models/engine.server";
import { chosenPlanVerdicts } from "~/models/dashboard.server";
import { listPlans } from "~/models/plan.server";
import { listAuditEvents, livePlans } from "~/models/team.server";
import { db } from "~/utils/db.server";
import { capturedSelects } from "./captured-selects";
import { chosenPlanVerdictsOneByOne } from "./one-by-one-verdicts";

// The hot queries (dashboard, engine list, plan list) read through EXPLAIN QUERY PLAN: none may scan a
// team-scoped table in full, and the activity and the default engine list must not sort in a temp tree.
// The statements are the ones the model functions really send (captured from Knex), not copies.

const TEAM_TABLES = new Set(["engines", "seal_plans", "audit_events", "materials", "fasteners", "gaskets", "memberships", "sessions"]);

interface Step {
  detail: string;
}

/** Every step of every captured statement's plan, with the table name resolved from its alias. */
async function plans(run: () => Promise<unknown>): Promise<{ sql: string; steps: string[] }[]> {
  const out: { sql: string; steps: string[] }[] = [];
  for (const q of await capturedSelects(run)) {
    const rows = (await db().raw(`explain query plan ${q.sql}`, q.bindings as never[])) as Step[];
    out.push({ sql: q.sql, steps: rows.map((r) => r.detail) });
  }
  return out;
}

/** Full scans of team-scoped tables ("SCAN engines", "SCAN e" for an alias of one, with or without an index). */
function fullScans(sql: string, steps: string[]): string[] {
  const alias = new Map<string, string>();
  for (const m of sql.matchAll(/[`"](\w+)[`"]\s+as\s+[`"](\w+)[`"]/gi)) alias.set(m[2]!, m[1]!);
  return steps.filter((s) => {
    const m = /^SCAN (\w+)/.exec(s);
    if (!m) return false;
    const table = alias.get(m[1]!) ?? m[1]!;
    return TEAM_TABLES.has(table);
  });
}

async function teamAndEngine(): Promise<{ teamId: number; engineId: number }> {
  const e = await db()("engines").whereNotNull("chosen_plan_id").orderBy("id").first();
  return { teamId: e.team_id, engineId: e.id };
}

// the whole team's view (an owner's): the widest query each page sends
const owner = (teamId: number) => ({ teamId, userId: 0, role: "owner" as const });

const HOT: [string, (t: { teamId: number; engineId: number }) => Promise<unknown>][] = [
  ["dashboard activity", ({ teamId }) => listAuditEvents(teamId, 10)],
  ["dashboard engine counts", ({ teamId }) => engineStatusCounts(owner(teamId))],
  ["dashboard chosen-plan verdicts", ({ teamId }) => chosenPlanVerdictsOneByOne(owner(teamId), "metric")],
  ["dashboard chosen-plan verdicts, batched", ({ teamId }) => chosenPlanVerdicts(owner(teamId), "metric")],
  ["engine list, default sort", ({ teamId }) => listEngines(owner(teamId), {})],
  ["engine list by name", ({ teamId }) => listEngines(owner(teamId), { sort: "name", dir: "asc" })],
  ["engine list by status filter", ({ teamId }) => listEngines(owner(teamId), { status: "running" })],
  ["plan list", ({ teamId, engineId }) => listPlans(teamId, engineId)],
  ["activity plan names", async ({ teamId }) => livePlans(teamId, [1, 2, 3])],
];

// SQLite's planner (EXPLAIN QUERY PLAN, the pragmas): the embedded default every shop runs. The
// PostgreSQL pass leaves *.sqlite.test.ts out (scripts/test-pg.mjs).
describe("hot query plans", () => {
  for (const [name, run] of HOT) {
    it(`${name}: no full scan of a team-scoped table`, async () => {
      const t = await teamAndEngine();
      const ps = await plans(() => run(t));
      expect(ps.length).toBeGreaterThan(0);
      for (const p of ps) expect({ sql: p.sql, scans: fullScans(p.sql, p.steps) }).toEqual({ sql: p.sql, scans: [] });
    });
  }

  it("the activity and the default engine list come off an index in order (no temp sort)", async () => {
    const t = await teamAndEngine();
    for (const run of [() => listAuditEvents(t.teamId, 10), () => listEngines(owner(t.teamId), {})]) {
      for (const p of await plans(run)) {
        if (!/order by/i.test(p.sql)) continue;
        expect({ sql: p.sql, steps: p.steps.filter((s) => /TEMP B-TREE FOR ORDER BY/.test(s)) }).toEqual({ sql: p.sql, steps: [] });
      }
    }
  });

  it("every foreign key has an index that starts with its column (deletes and joins from the parent side)", async () => {
    const tables = (
      (await db().raw("select name from sqlite_master where type = 'table' and name not like 'knex_%' and name not like 'sqlite_%'")) as {
        name: string;
      }[]
    ).map((r) => r.name);
    const missing: string[] = [];
    for (const table of tables) {
      const fks = (await db().raw(`pragma foreign_key_list("${table}")`)) as { from: string }[];
      if (fks.length === 0) continue;
      const leading = new Set<string>();
      for (const ix of (await db().raw(`pragma index_list("${table}")`)) as { name: string }[]) {
        const cols = (await db().raw(`pragma index_info("${ix.name}")`)) as { seqno: number; name: string }[];
        const first = cols.find((c) => c.seqno === 0);
        if (first) leading.add(first.name);
      }
      for (const fk of fks) if (!leading.has(fk.from)) missing.push(`${table}.${fk.from}`);
    }
    // the people who entered a row are kept for the record only, never looked up by it
    expect(missing.filter((m) => !m.endsWith(".entered_by"))).toEqual([]);
  });

  it("the detector itself sees a full scan where there is one", async () => {
    const rows = (await db().raw("explain query plan select * from engines as e where e.fuel = ?", ["E85"])) as Step[];
    expect(
      fullScans(
        'select * from "engines" as "e"',
        rows.map((r) => r.detail),
      ),
    ).toHaveLength(1);
  });
});
