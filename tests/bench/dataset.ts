// The large shop for the bench: 5,000 engines, 30,000 seal plans and 48,000 activity rows, invented
// by cloning the demo shop's own rows (every name says it is bench data), written straight into a
// seeded database with one transaction. Run alone: node --import tsx tests/bench/dataset.ts <db file>
import Database from "better-sqlite3";

export const BIG = { engines: 5000, plans: 30_000, activity: 48_000 };

export function growShop(dbPath: string, size = BIG): { teamId: number } {
  const d = new Database(dbPath);
  try {
    const team = d
      .prepare("select m.team_id as id, u.id as userId from memberships m join users u on u.id = m.user_id where u.email = ?")
      .get("builder@example.com") as { id: number; userId: number };
    const engines = d.prepare("select * from engines where team_id = ? and archived_at is null order by id").all(team.id) as Record<
      string,
      unknown
    >[];
    const plans = d.prepare("select * from seal_plans where team_id = ? and archived_at is null order by id").all(team.id) as Record<
      string,
      unknown
    >[];
    const insert = (table: string, row: Record<string, unknown>) => {
      const cols = Object.keys(row).filter((c) => c !== "id");
      return d.prepare(`insert into ${table} (${cols.map((c) => `"${c}"`).join(",")}) values (${cols.map(() => "?").join(",")})`);
    };
    const engineIns = insert("engines", engines[0]!);
    const planIns = insert("seal_plans", plans[0]!);
    const chooseUpd = d.prepare("update engines set chosen_plan_id = ? where id = ?");
    const auditIns = d.prepare("insert into audit_events (team_id, user_id, action, detail, created_at) values (?, ?, ?, ?, ?)");
    const plansPerEngine = Math.round(size.plans / size.engines);
    const t0 = Date.parse("2026-01-01T00:00:00Z");
    d.transaction(() => {
      for (let i = 0; i < size.engines; i++) {
        const src = engines[i % engines.length]!;
        const row = {
          ...src,
          name: `Bench engine ${String(i + 1).padStart(4, "0")} (invented)`,
          customer: `Bench customer ${i % 97}`,
          chosen_plan_id: null,
          updated_at: new Date(t0 + i * 60_000).toISOString(),
          created_at: new Date(t0 + i * 60_000).toISOString(),
        };
        const engineId = Number(
          engineIns.run(
            ...Object.keys(src)
              .filter((c) => c !== "id")
              .map((c) => (row as Record<string, unknown>)[c]),
          ).lastInsertRowid,
        );
        const srcPlans = plans.filter((p) => p.engine_id === src.id);
        const pool = srcPlans.length > 0 ? srcPlans : plans;
        let first = 0;
        for (let k = 0; k < plansPerEngine; k++) {
          const sp = pool[k % pool.length]!;
          const prow = { ...sp, engine_id: engineId, name: `Bench plan ${k + 1} (invented)` };
          const id = Number(
            planIns.run(
              ...Object.keys(sp)
                .filter((c) => c !== "id")
                .map((c) => (prow as Record<string, unknown>)[c]),
            ).lastInsertRowid,
          );
          if (k === 0) first = id;
        }
        chooseUpd.run(first, engineId);
      }
      for (let i = 0; i < size.activity; i++) {
        auditIns.run(
          team.id,
          team.userId,
          "plan.updated",
          JSON.stringify({ name: `Bench plan ${i % 6} (invented)` }),
          new Date(t0 + i * 30_000).toISOString(),
        );
      }
    })();
    d.pragma("optimize");
    return { teamId: team.id };
  } finally {
    d.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const file = process.argv[2];
  if (!file) throw new Error("usage: tests/bench/dataset.ts <seeded sqlite file>");
  console.log(growShop(file));
}
