import { sleeveOf } from "~/lib/plan/assemble";
import {
  figureUses,
  measuredParts,
  protrusionRuns,
  sideBySide,
  type FigureUse,
  type MachiningInput,
  type MachiningRecord,
  type SideBySide,
} from "~/lib/records/machining";
import type { UnitSystem } from "~/lib/units";
import { type DbRow, now, withTeam, writeTransaction } from "~/utils/db.server";
import type { EngineRow } from "./engine.server";
import { evaluateVariants } from "./plan-estimate.server";
import type { PlanRow } from "./plan.server";
import { recordAudit } from "./audit.server";

// Machining and measurement records of an engine's builds, each scoped to the team given, and the
// plan's estimate re-run with the measured figures through the one estimate service.

function toMachining(r: DbRow): MachiningRecord {
  return {
    id: r.id,
    engineId: r.engine_id,
    planId: r.plan_id,
    measuredOn: r.measured_on,
    measuredBy: r.measured_by,
    headFlatnessMm: r.head_flatness_mm,
    deckFlatnessMm: r.deck_flatness_mm,
    headFinishUm: r.head_finish_um,
    deckFinishUm: r.deck_finish_um,
    headRemovedMm: r.head_removed_mm,
    deckRemovedMm: r.deck_removed_mm,
    sleeveProtrusionMm: JSON.parse(r.sleeve_protrusion_mm) as (number | null)[],
    wireProjectionMm: r.wire_projection_mm,
    receiverGrooveDepthMm: r.receiver_groove_depth_mm,
    gasketCompressedMm: r.gasket_compressed_mm,
    notes: r.notes,
    createdAt: r.created_at,
  };
}

export async function listMachining(teamId: number, engineId: number): Promise<MachiningRecord[]> {
  const rows = await withTeam(teamId, (k) =>
    k("machining_records").where({ team_id: teamId, engine_id: engineId }).orderBy("measured_on", "desc").orderBy("id", "desc"),
  );
  return rows.map(toMachining);
}

export async function createMachining(teamId: number, userId: number, engineId: number, m: MachiningInput): Promise<number> {
  return writeTransaction(
    async (trx) => {
      const at = now();
      const [row] = await trx("machining_records")
        .insert({
          team_id: teamId,
          engine_id: engineId,
          plan_id: m.planId,
          measured_on: m.measuredOn,
          measured_by: m.measuredBy,
          head_flatness_mm: m.headFlatnessMm,
          deck_flatness_mm: m.deckFlatnessMm,
          head_finish_um: m.headFinishUm,
          deck_finish_um: m.deckFinishUm,
          head_removed_mm: m.headRemovedMm,
          deck_removed_mm: m.deckRemovedMm,
          sleeve_protrusion_mm: JSON.stringify(m.sleeveProtrusionMm),
          wire_projection_mm: m.wireProjectionMm,
          receiver_groove_depth_mm: m.receiverGrooveDepthMm,
          gasket_compressed_mm: m.gasketCompressedMm,
          notes: m.notes,
          created_by: userId,
          created_at: at,
          updated_at: at,
        })
        .returning("id");
      await recordAudit(trx, teamId, userId, "machining.recorded", { engineId, machiningId: row.id, planId: m.planId });
      return row.id as number;
    },
    { teamId },
  );
}

export type MeasuredEstimate =
  | { ok: true; compare: SideBySide; uses: FigureUse[]; planned: { protrusionMm: number; gasketMm: number } }
  | { ok: false; problems: string[] };

/** The record's plan estimated as planned and with the measured figures, side by side, in the person's units. */
export async function measuredEstimate(
  teamId: number,
  engine: EngineRow,
  plan: PlanRow,
  m: MachiningRecord,
  units: UnitSystem,
): Promise<MeasuredEstimate> {
  // one estimate per distinct measured protrusion; which it needs depends on whether the model sees sleeves
  let sleeved = false;
  let runOfBore: number[] = [];
  const r = await evaluateVariants(teamId, engine, plan, units, (parts) => {
    sleeved = sleeveOf(parts) !== null;
    const runs = protrusionRuns(m, engine.cylinders, sleeved);
    runOfBore = runs.runOfBore;
    return runs.values.map((v) => measuredParts(parts, m, v));
  });
  if (!r.ok) return r;
  const problems = r.variants.flatMap((v) => (v.ok ? [] : v.problems));
  if (problems.length) return { ok: false, problems: [...new Set(problems)] };
  const runs = r.variants.map((v) => (v.ok ? v.estimate : null)!);
  return {
    ok: true,
    compare: sideBySide(r.planned, runs, runOfBore),
    uses: figureUses(sleeved, plan.wireLocation !== "none"),
    planned: {
      protrusionMm: sleeved ? (plan.sleeveProtrusionMm ?? engine.sleeveProtrusionMm) : 0,
      gasketMm: r.parts.gasket.compressedThicknessMm,
    },
  };
}
