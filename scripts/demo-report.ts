// Prints every demo plan's verdict, margins, torque ceiling and seal gained per +10 % torque, read the
// way the app reads them (stored rows → planParts → the clamp model). Usage:
//   DATABASE_PATH=/tmp/demo.sqlite npm run db:setup && DATABASE_PATH=/tmp/demo.sqlite node --import tsx scripts/demo-report.ts
import { CEILING_WORDS } from "~/lib/clamp";
import { toEngine } from "~/models/engine.server";
import { estimatePlan } from "~/models/plan-estimate.server";
import { listPlans } from "~/models/plan.server";
import { closeDb, db } from "~/utils/db.server";

const team = await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
for (const row of await db()("engines").where({ team_id: team.id }).orderBy("id")) {
  const engine = toEngine(row);
  console.log(`\n${engine.name}`);
  for (const plan of await listPlans(team.id, engine.id)) {
    const r = await estimatePlan(team.id, engine, plan, { units: "metric" });
    if (!r.ok) {
      console.log(`  ${plan.name}: cannot estimate — ${r.problems.join("; ")}`);
      continue;
    }
    const v = r.view;
    const e = v.estimate;
    console.log(
      `  ${plan.name} @ ${plan.torqueNm.toFixed(0)} N·m (maker ${r.fastener.makerTorqueNm?.toFixed(0) ?? "—"}): ${e.verdict.status.toUpperCase()} — ${e.verdict.headline}\n` +
        `    weakest margin ${e.weakestMargin.toFixed(2)} (bottom of band; nominal ${e.weakestMarginNominal.toFixed(2)}), P(<1) ${(v.probabilityMarginBelowOne * 100).toFixed(1)} %, ` +
        `ceiling ${v.ceiling.torqueNm.toFixed(0)} N·m (${CEILING_WORDS[v.ceiling.cause]}), gain/+10 % ${(e.gain.share * 100).toFixed(0)} %, squeezes head: ${e.squeeze.mostlySqueezing ? e.squeeze.reason : "no"}` +
        `${v.headSqueezeOnsetNm !== null ? ` (from ${v.headSqueezeOnsetNm.toFixed(0)} N·m)` : ""}\n` +
        `    checks: ${e.verdict.checks
          .filter((c) => c.checked)
          .map((c) => `${c.id} ${c.status} ${c.ratio.toFixed(2)}`)
          .join(", ")}`,
    );
  }
}
await closeDb();
