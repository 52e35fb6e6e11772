import type { Knex } from "knex";
import { data } from "react-router";
import type { EngineInput, PEAK_SOURCES, SleeveKind } from "~/lib/engine/schema";
import type { EngineStatus } from "~/lib/engine/status";
import type { EngineRecord } from "~/lib/plan/assemble";
import { now, teamTransaction, withTeam, type DbRow } from "~/utils/db.server";
import { parseId } from "~/utils/ids";
import { viewerScope, type Asker } from "./viewer-scope.server";
import { recordAudit } from "./audit.server";

export type { EngineStatus, SleeveKind };

/** A stored engine: the figures the clamp model reads (`EngineRecord`) and the record's own fields. */
export interface EngineRow extends EngineRecord {
  id: number;
  teamId: number;
  name: string;
  customer: string;
  rodLengthMm: number | null;
  blockMaterialId: number;
  headMaterialId: number;
  sleeveMaterialId: number | null;
  fuel: string;
  peakPressureSource: (typeof PEAK_SOURCES)[number];
  status: EngineStatus;
  notes: string;
  chosenPlanId: number | null;
  createdAt: string;
  updatedAt: string;
}

// snake_case row → EngineRow
export function toEngine(r: DbRow): EngineRow {
  return {
    id: r.id,
    teamId: r.team_id,
    name: r.name,
    customer: r.customer,
    cylinders: r.cylinders,
    layout: r.layout,
    boreMm: r.bore_mm,
    strokeMm: r.stroke_mm,
    rodLengthMm: r.rod_length_mm,
    blockMaterialId: r.block_material_id,
    headMaterialId: r.head_material_id,
    headThicknessAtStudMm: r.head_thickness_at_stud_mm,
    blockDepthToThreadMm: r.block_depth_to_thread_mm,
    sleeveKind: r.sleeve_kind,
    sleeveMaterialId: r.sleeve_material_id,
    sleeveWallMm: r.sleeve_wall_mm,
    sleeveSupportLengthMm: r.sleeve_support_length_mm,
    sleeveProtrusionMm: r.sleeve_protrusion_mm,
    studs: JSON.parse(r.studs),
    fuel: r.fuel,
    targetManifoldKpa: r.target_manifold_kpa,
    peakPressureMpa: r.peak_pressure_mpa,
    peakPressureSource: r.peak_pressure_source,
    pressureRiseFactor: r.pressure_rise_factor,
    runningHeadC: r.running_head_c,
    runningBlockC: r.running_block_c,
    chamberCc: r.chamber_cc,
    pistonVolumeCc: r.piston_volume_cc,
    deckClearanceMm: r.deck_clearance_mm,
    status: r.status,
    notes: r.notes,
    chosenPlanId: r.chosen_plan_id,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  };
}

/** The engine, if the asker may see it; else null (another team's, or a viewer's unshared engine). */
export async function getEngine(who: Asker, engineId: number): Promise<EngineRow | null> {
  if (!Number.isInteger(engineId)) return null;
  // withTeam: on PostgreSQL the row-security policies check the team too (a second wall)
  const row = await withTeam(who.teamId, (k) => viewerScope(k("engines"), who).where({ id: engineId }).whereNull("archived_at").first());
  return row ? toEngine(row) : null;
}

/** As getEngine, but throws a 404 the ErrorBoundary shows kindly. */
export async function requireEngine(who: Asker, engineIdParam: string | undefined): Promise<EngineRow> {
  const id = parseId(engineIdParam);
  const engine = id === null ? null : await getEngine(who, id);
  if (!engine) throw data("No such engine in this shop.", { status: 404 });
  return engine;
}

// ─── The team's engine table ───────────────────────────────────────────────────────────────

/** Sortable columns of the engine table → the SQL that orders them. */
export const ENGINE_SORTS = {
  name: "e.name",
  customer: "e.customer",
  layout: "layout_key",
  bore: "e.bore_mm",
  fuel: "e.fuel",
  boost: "e.target_manifold_kpa",
  status: "status_rank",
  plan: "p.name",
  updated: "e.updated_at",
} as const;
export type EngineSort = keyof typeof ENGINE_SORTS;

/** Own keys only: "toString", "constructor" or "__proto__" are not columns. */
export function isEngineSort(s: unknown): s is EngineSort {
  return typeof s === "string" && Object.hasOwn(ENGINE_SORTS, s);
}

export interface EngineListRow {
  id: number;
  name: string;
  customer: string;
  cylinders: number;
  layout: "inline" | "V";
  boreMm: number;
  fuel: string;
  targetManifoldKpa: number | null;
  status: EngineStatus;
  chosenPlanName: string | null;
  updatedAt: string;
}

export interface EngineListQuery {
  q?: string;
  status?: EngineStatus | "";
  sort?: EngineSort;
  dir?: "asc" | "desc";
  page?: number;
  pageSize?: number;
}

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** One page of the engines the asker sees (archived ones hidden), searched over name, customer and fuel. */
export function listEngines(who: Asker, query: EngineListQuery = {}): Promise<{ rows: EngineListRow[]; total: number }> {
  return withTeam(who.teamId, (k) => listEnginesOn(k, who, query));
}

async function listEnginesOn(k: Knex, who: Asker, query: EngineListQuery): Promise<{ rows: EngineListRow[]; total: number }> {
  const pageSize = query.pageSize ?? 25;
  const page = Math.max(1, Math.floor(query.page ?? 1));
  const sort: EngineSort = isEngineSort(query.sort) ? query.sort : "updated";
  const dir = query.dir === "asc" ? "asc" : query.dir === "desc" ? "desc" : sort === "updated" ? "desc" : "asc";
  const base = viewerScope(k("engines as e"), who, "e").whereNull("e.archived_at");
  const q = query.q?.trim();
  if (q) {
    const like = `%${likeEscape(q)}%`;
    base.where((w) =>
      w
        // lower() on both sides: SQLite's LIKE ignores ASCII case, PostgreSQL's does not; this matches alike on both
        .whereRaw("lower(e.name) like lower(?) escape '\\'", [like])
        .orWhereRaw("lower(e.customer) like lower(?) escape '\\'", [like])
        .orWhereRaw("lower(e.fuel) like lower(?) escape '\\'", [like]),
    );
  }
  if (query.status) base.where("e.status", query.status);
  // counted without the chosen plan's join: it finds at most one plan per engine (by id), so it changes
  // no count, and on a large shop it costs a plan lookup per engine
  const [{ n }] = await base.clone().count<{ n: number }[]>({ n: "e.id" });
  const rows = await base
    // the chosen plan must be this team's and this engine's, or it shows as none
    .leftJoin("seal_plans as p", function () {
      this.on("p.id", "=", "e.chosen_plan_id").andOn("p.engine_id", "=", "e.id").andOn("p.team_id", "=", "e.team_id");
    })
    .select({
      id: "e.id",
      name: "e.name",
      customer: "e.customer",
      cylinders: "e.cylinders",
      layout: "e.layout",
      boreMm: "e.bore_mm",
      fuel: "e.fuel",
      targetManifoldKpa: "e.target_manifold_kpa",
      status: "e.status",
      chosenPlanName: "p.name",
      updatedAt: "e.updated_at",
    })
    // layout sorts I before V, then by cylinder count; status in the order an engine lives it
    .select(k.raw("(case e.layout when 'inline' then 0 else 1 end) * 100 + e.cylinders as layout_key"))
    .select(k.raw("case e.status when 'quoted' then 0 when 'in-build' then 1 when 'running' then 2 else 3 end as status_rank"))
    .orderByRaw(`${ENGINE_SORTS[sort]} ${sort === "plan" ? `${dir} nulls last` : dir}`)
    .orderBy("e.id", dir)
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  return {
    rows: rows.map(({ layout_key: _l, status_rank: _s, ...r }: DbRow) => r as EngineListRow),
    total: Number(n),
  };
}

// ─── Writing the record ────────────────────────────────────────────────────────────────────

/** The validated form (EngineInput in app/lib/engine/schema.ts) → columns. */
function toColumns(input: EngineInput) {
  return {
    name: input.name,
    customer: input.customer,
    cylinders: input.cylinders,
    layout: input.layout,
    bore_mm: input.boreMm,
    stroke_mm: input.strokeMm,
    rod_length_mm: input.rodLengthMm ?? null,
    block_material_id: input.blockMaterialId,
    head_material_id: input.headMaterialId,
    head_thickness_at_stud_mm: input.headThicknessAtStudMm,
    block_depth_to_thread_mm: input.blockDepthToThreadMm,
    sleeve_kind: input.sleeveKind,
    sleeve_material_id: input.sleeveKind === "none" ? null : (input.sleeveMaterialId ?? null),
    sleeve_wall_mm: input.sleeveKind === "none" ? null : (input.sleeveWallMm ?? null),
    sleeve_support_length_mm: input.sleeveKind === "wet-mid" ? (input.sleeveSupportLengthMm ?? null) : null,
    sleeve_protrusion_mm: input.sleeveProtrusionMm,
    studs: JSON.stringify(input.studs),
    fuel: input.fuel,
    target_manifold_kpa: input.targetManifoldKpa,
    peak_pressure_mpa: input.peakPressureMpa ?? null,
    peak_pressure_source: input.peakPressureSource,
    pressure_rise_factor: input.pressureRiseFactor,
    running_head_c: input.runningHeadC,
    running_block_c: input.runningBlockC,
    chamber_cc: input.chamberCc ?? null,
    piston_volume_cc: input.pistonVolumeCc,
    deck_clearance_mm: input.deckClearanceMm,
    status: input.status,
    notes: input.notes,
  };
}

/** Material ids the engine names must be this team's active materials; otherwise a field error. */
async function foreignMaterialErrors(trx: Knex, teamId: number, input: EngineInput): Promise<Record<string, string>> {
  const wanted = { blockMaterialId: input.blockMaterialId, headMaterialId: input.headMaterialId, sleeveMaterialId: input.sleeveMaterialId };
  const ids = Object.values(wanted).filter((v): v is number => typeof v === "number");
  const found = new Set(
    (await trx("materials").where({ team_id: teamId }).whereNull("archived_at").whereIn("id", ids).pluck("id")) as number[],
  );
  const errors: Record<string, string> = {};
  const what = { blockMaterialId: "block (deck)", headMaterialId: "head", sleeveMaterialId: "sleeve" } as const;
  for (const [field, id] of Object.entries(wanted) as [keyof typeof wanted, number | undefined][]) {
    if (id !== undefined && !found.has(id)) errors[field] = `Choose the ${what[field]} material from this shop's materials`;
  }
  return errors;
}

export class EngineInputError extends Error {
  constructor(public errors: Record<string, string>) {
    super("engine input refused");
  }
}

export async function createEngine(teamId: number, userId: number, input: EngineInput): Promise<number> {
  return teamTransaction(teamId, async (trx) => {
    const errors = await foreignMaterialErrors(trx, teamId, input);
    if (Object.keys(errors).length > 0) throw new EngineInputError(errors);
    const at = now();
    const [{ id }] = await trx("engines")
      .insert({ team_id: teamId, ...toColumns(input), created_at: at, updated_at: at })
      .returning("id");
    await recordAudit(trx, teamId, userId, "engine.created", { engineId: id, name: input.name });
    return id as number;
  });
}

export async function updateEngine(teamId: number, userId: number, engineId: number, input: EngineInput): Promise<void> {
  await teamTransaction(teamId, async (trx) => {
    const errors = await foreignMaterialErrors(trx, teamId, input);
    if (Object.keys(errors).length > 0) throw new EngineInputError(errors);
    const n = await trx("engines")
      .where({ team_id: teamId, id: engineId })
      .whereNull("archived_at")
      .update({ ...toColumns(input), updated_at: now() });
    if (n === 0) throw data("No such engine in this shop.", { status: 404 });
    await recordAudit(trx, teamId, userId, "engine.updated", { engineId, name: input.name });
  });
}

export async function archiveEngine(teamId: number, userId: number, engineId: number): Promise<void> {
  await teamTransaction(teamId, async (trx) => {
    const at = now();
    const n = await trx("engines")
      .where({ team_id: teamId, id: engineId })
      .whereNull("archived_at")
      .update({ archived_at: at, updated_at: at });
    if (n === 0) throw data("No such engine in this shop.", { status: 404 });
    await recordAudit(trx, teamId, userId, "engine.archived", { engineId });
  });
}

// ─── What the form and the overview need besides the record ───────────────────────────────

export interface MaterialOption {
  id: number;
  name: string;
  kind: string;
}

/** The team's active materials for the engine form's selects. */
export async function listMaterialOptions(teamId: number): Promise<MaterialOption[]> {
  return withTeam(teamId, (k) =>
    k("materials").where({ team_id: teamId }).whereNull("archived_at").orderBy(["kind", "name", "id"]).select("id", "name", "kind"),
  );
}

/** Names of the materials an engine uses (archived ones included: the record still names them). */
export async function materialNames(teamId: number, ids: (number | null)[]): Promise<Record<number, string>> {
  const wanted = ids.filter((v): v is number => typeof v === "number");
  const rows = await withTeam(teamId, (k) => k("materials").where({ team_id: teamId }).whereIn("id", wanted).select("id", "name"));
  return Object.fromEntries(rows.map((r: { id: number; name: string }) => [r.id, r.name]));
}

/** The chosen plan's name, when it is this engine's. */
export async function chosenPlanName(teamId: number, engine: EngineRow): Promise<string | null> {
  if (engine.chosenPlanId === null) return null;
  const row = await withTeam(teamId, (k) =>
    k("seal_plans").where({ team_id: teamId, engine_id: engine.id, id: engine.chosenPlanId }).whereNull("archived_at").first("name"),
  );
  return row?.name ?? null;
}

/** How many of the engines the asker sees are in each status. */
export async function engineStatusCounts(who: Asker): Promise<Record<EngineStatus, number>> {
  const rows = await withTeam(who.teamId, (k) =>
    viewerScope(k("engines"), who).whereNull("archived_at").groupBy("status").select("status").count({ n: "*" }),
  );
  const out: Record<EngineStatus, number> = { quoted: 0, "in-build": 0, running: 0, retired: 0 };
  for (const r of rows as { status: EngineStatus; n: number }[]) out[r.status] = Number(r.n);
  return out;
}

// ─── Duplicating an engine ─────────────────────────────────────────────────────────────────

/** Longest engine name the table holds. */
const NAME_MAX = 120;

/** "Name (copy)", shortened so it fits the name column. */
export function copyName(name: string): string {
  const suffix = " (copy)";
  return name.length + suffix.length <= NAME_MAX ? name + suffix : `${name.slice(0, NAME_MAX - suffix.length - 1)}…${suffix}`;
}

/**
 * A new engine with this engine's record and stud pattern (not its plans, nor its chosen plan),
 * named "… (copy)". Returns the new id; another team's engine is not found (404).
 */
export async function duplicateEngine(teamId: number, userId: number, engineId: number): Promise<{ id: number; name: string }> {
  return teamTransaction(teamId, async (trx) => {
    const row = await trx("engines").where({ team_id: teamId, id: engineId }).whereNull("archived_at").first();
    if (!row) throw data("No such engine in this shop.", { status: 404 });
    const {
      id: _id,
      chosen_plan_id: _chosen,
      archived_at: _archived,
      created_at: _c,
      updated_at: _u,
      ...record
    } = row as Record<string, unknown>;
    const name = copyName(String(record.name));
    const at = now();
    const [{ id }] = await trx("engines")
      .insert({ ...record, name, team_id: teamId, chosen_plan_id: null, archived_at: null, created_at: at, updated_at: at })
      .returning("id");
    await recordAudit(trx, teamId, userId, "engine.duplicated", { engineId: id, fromEngineId: engineId, name });
    return { id: id as number, name };
  });
}

/** The active engines the asker sees, for a picker: id, name and bore. */
export async function engineChoices(who: Asker): Promise<{ id: number; name: string; boreMm: number }[]> {
  return withTeam(who.teamId, (k) =>
    viewerScope(k("engines"), who).whereNull("archived_at").orderBy(["name", "id"]).select("id", "name", { boreMm: "bore_mm" }),
  );
}
