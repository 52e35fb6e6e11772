import type { Knex } from "knex";
import { DEMO_FASTENERS, DEMO_GASKETS, HANDBOOK_MATERIAL_ROWS } from "../lib/library/seed-data.ts";
import { recordAudit } from "./audit.server.ts";

// Seeds a new shop's library from the data in app/lib/library/seed-data.ts. Imported by the seed
// files with a relative path, so nothing here may use the "~" alias or the app's db().

/** Inserts the handbook materials and the demo fasteners and gaskets for one team. */
export async function seedTeamLibrary(trx: Knex | Knex.Transaction, teamId: number): Promise<void> {
  const at = new Date().toISOString();
  const stamp = { team_id: teamId, created_at: at, updated_at: at, entered_by: null, archived_at: null };
  const materialIds = new Map<string, number>();
  for (const m of HANDBOOK_MATERIAL_ROWS) {
    const [row] = await trx("materials")
      .insert({ ...stamp, ...m })
      .returning("id");
    materialIds.set(m.name, (row as { id: number }).id);
  }
  for (const { material, ...f } of DEMO_FASTENERS) {
    await trx("fasteners").insert({ ...stamp, ...f, material_id: materialIds.get(material) });
  }
  for (const g of DEMO_GASKETS) await trx("gaskets").insert({ ...stamp, ...g });
  await recordAudit(trx, teamId, null, "library.seeded", {}, at);
}
