import type { Knex } from "knex";
import { data } from "react-router";
import type { LibraryKind } from "~/lib/library/labels";
import type { FastenerInput, GasketInput, MaterialInput } from "~/lib/library/schemas";
import { now, type DbRow, teamTransaction, withTeam } from "~/utils/db.server";
import { recordAudit } from "./audit.server";

export { seedTeamLibrary } from "./library-seed.server";

// The shop's libraries: materials, fasteners, gaskets. Every query is scoped by team id; another
// team's row is simply not found. Writes are recorded in audit_events ("fastener.created", …).

interface LibraryMeta {
  id: number;
  teamId: number;
  name: string;
  /** Handbook source for seeded rows; null for rows the shop entered. */
  source: string | null;
  enteredById: number | null;
  enteredByName: string | null;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export type MaterialRow = LibraryMeta & Omit<MaterialInput, "name">;
export type FastenerRow = LibraryMeta & Omit<FastenerInput, "name"> & { materialName: string | null };
export type GasketRow = LibraryMeta & Omit<GasketInput, "name">;
export type LibraryRow = MaterialRow | FastenerRow | GasketRow;

const TABLE: Record<LibraryKind, string> = { materials: "materials", fasteners: "fasteners", gaskets: "gaskets" };
const SINGULAR: Record<LibraryKind, string> = { materials: "material", fasteners: "fastener", gaskets: "gasket" };

// camelCase field ↔ snake_case column, per kind (only the kind's own fields).
const COLUMNS: Record<LibraryKind, Record<string, string>> = {
  materials: {
    kind: "kind",
    modulusMpa: "modulus_mpa",
    yieldMpa: "yield_mpa",
    expansionUmPerMC: "expansion_um_per_m_c",
    limitingSurfacePressureMpa: "limiting_surface_pressure_mpa",
    shearStrengthMpa: "shear_strength_mpa",
  },
  fasteners: {
    threadSystem: "thread_system",
    diameterMm: "diameter_mm",
    pitchMm: "pitch_mm",
    reducedShankDiameterMm: "reduced_shank_diameter_mm",
    reducedShankLengthMm: "reduced_shank_length_mm",
    freeThreadLengthMm: "free_thread_length_mm",
    engagementMm: "engagement_mm",
    materialId: "material_id",
    washerOdMm: "washer_od_mm",
    washerHoleMm: "washer_hole_mm",
    washerThicknessMm: "washer_thickness_mm",
    nutFaceOdMm: "nut_face_od_mm",
    washerHardnessHv: "washer_hardness_hv",
    makerTorqueNm: "maker_torque_nm",
    makerLubricant: "maker_lubricant",
    makerStages: "maker_stages",
    makerStretchMm: "maker_stretch_mm",
    threadFriction: "thread_friction",
    bearingFriction: "bearing_friction",
  },
  gaskets: {
    type: "type",
    compressedThicknessMm: "compressed_thickness_mm",
    boreMm: "bore_mm",
    sealDiameterMm: "seal_diameter_mm",
    ringWidthMm: "ring_width_mm",
    ringModulusMpa: "ring_modulus_mpa",
    sealLineYieldMpa: "seal_line_yield_mpa",
    bodyModulusMpa: "body_modulus_mpa",
    bodyAreaPerBoreMm2: "body_area_per_bore_mm2",
    expansionUmPerMC: "expansion_um_per_m_c",
    m: "m",
    yMpa: "y_mpa",
    relaxationPercent: "relaxation_percent",
    finishMinRaUm: "finish_min_ra_um",
    finishMaxRaUm: "finish_max_ra_um",
    sealLineHardnessMpa: "seal_line_hardness_mpa",
    beadLoadNPerMm: "bead_load_n_per_mm",
    beadTravelMm: "bead_travel_mm",
    seatingPressureMpa: "seating_pressure_mpa",
    minServicePressureMpa: "min_service_pressure_mpa",
    maxPressureMpa: "max_pressure_mpa",
    bodySealPressureMpa: "body_seal_pressure_mpa",
  },
};

const TEXT_COLUMNS = new Set(["maker_lubricant", "maker_stages"]);

function toRow(kind: LibraryKind, r: DbRow): LibraryRow {
  const out: DbRow = {
    id: r.id,
    teamId: r.team_id,
    name: r.name,
    source: r.source ?? null,
    enteredById: r.entered_by ?? null,
    enteredByName: r.entered_by_name ?? null,
    archivedAt: r.archived_at ?? null,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  };
  for (const [field, column] of Object.entries(COLUMNS[kind])) out[field] = r[column] ?? (TEXT_COLUMNS.has(column) ? "" : null);
  if (kind === "fasteners") out.materialName = r.material_name ?? null;
  return out as LibraryRow;
}

function toColumns(kind: LibraryKind, input: Record<string, unknown>): DbRow {
  const out: DbRow = { name: input.name };
  for (const [field, column] of Object.entries(COLUMNS[kind])) if (field in input) out[column] = input[field];
  return out;
}

function baseQuery(kind: LibraryKind, teamId: number, k: Knex) {
  const t = TABLE[kind];
  const q = k(`${t} as r`)
    .leftJoin("users as u", "u.id", "r.entered_by")
    .where("r.team_id", teamId)
    .select("r.*", { entered_by_name: "u.name" });
  if (kind === "fasteners") q.leftJoin("materials as mat", "mat.id", "r.material_id").select({ material_name: "mat.name" });
  return q;
}

/** The team's rows of one kind, active ones only unless includeArchived. Sorted by name. */
export async function listLibrary(kind: LibraryKind, teamId: number, opts: { includeArchived?: boolean } = {}): Promise<LibraryRow[]> {
  const rows = await withTeam(teamId, (k) => {
    const q = baseQuery(kind, teamId, k).orderBy(["r.name", "r.id"]);
    if (!opts.includeArchived) q.whereNull("r.archived_at");
    return q;
  });
  return rows.map((r: DbRow) => toRow(kind, r));
}

export const listMaterials = (teamId: number, opts?: { includeArchived?: boolean }) =>
  listLibrary("materials", teamId, opts) as Promise<MaterialRow[]>;
export const listFasteners = (teamId: number, opts?: { includeArchived?: boolean }) =>
  listLibrary("fasteners", teamId, opts) as Promise<FastenerRow[]>;
export const listGaskets = (teamId: number, opts?: { includeArchived?: boolean }) =>
  listLibrary("gaskets", teamId, opts) as Promise<GasketRow[]>;

/** One of the team's rows (archived too), or null; another team's row is null. */
export async function getLibraryItem(kind: LibraryKind, teamId: number, id: number): Promise<LibraryRow | null> {
  if (!Number.isInteger(id) || id <= 0) return null;
  const row = await withTeam(teamId, (k) => baseQuery(kind, teamId, k).where("r.id", id).first());
  return row ? toRow(kind, row) : null;
}

export const getMaterial = (teamId: number, id: number) => getLibraryItem("materials", teamId, id) as Promise<MaterialRow | null>;
export const getFastener = (teamId: number, id: number) => getLibraryItem("fasteners", teamId, id) as Promise<FastenerRow | null>;
export const getGasket = (teamId: number, id: number) => getLibraryItem("gaskets", teamId, id) as Promise<GasketRow | null>;

/** As getLibraryItem, but throws the 404 the ErrorBoundary shows. */
export async function requireLibraryItem(kind: LibraryKind, teamId: number, idParam: string | undefined): Promise<LibraryRow> {
  const item = await getLibraryItem(kind, teamId, Number(idParam));
  if (!item) throw data(`No such ${SINGULAR[kind]} in this shop.`, { status: 404 });
  return item;
}

type InputFor<K extends LibraryKind> = K extends "materials" ? MaterialInput : K extends "fasteners" ? FastenerInput : GasketInput;

/** A fastener's material must be one of the team's own (not another shop's). */
async function assertOwnMaterial(trx: Knex, teamId: number, input: Record<string, unknown>) {
  if (!("materialId" in input)) return;
  const own = await trx("materials")
    .where({ team_id: teamId, id: input.materialId as number })
    .first("id");
  if (!own) throw data({ errors: { materialId: "Pick one of this shop's materials" }, values: null }, { status: 400 });
}

/** A row the shop entered: no handbook source, entered_by names the person. */
export async function createLibraryItem<K extends LibraryKind>(
  kind: K,
  teamId: number,
  userId: number,
  input: InputFor<K>,
): Promise<number> {
  return teamTransaction(teamId, async (trx) => {
    await assertOwnMaterial(trx, teamId, input as Record<string, unknown>);
    const at = now();
    const [row] = await trx(TABLE[kind])
      .insert({
        ...toColumns(kind, input as Record<string, unknown>),
        team_id: teamId,
        source: null,
        entered_by: userId,
        created_at: at,
        updated_at: at,
      })
      .returning("id");
    const id = (row as { id: number }).id;
    await recordAudit(trx, teamId, userId, `${SINGULAR[kind]}.created`, { id, name: input.name });
    return id;
  });
}

/**
 * Updates one of the team's rows; false when it is not the team's. A handbook row keeps its source and
 * records who edited it in entered_by (the list then says "edited by").
 */
export async function updateLibraryItem<K extends LibraryKind>(
  kind: K,
  teamId: number,
  id: number,
  userId: number,
  input: InputFor<K>,
): Promise<boolean> {
  return teamTransaction(teamId, async (trx) => {
    await assertOwnMaterial(trx, teamId, input as Record<string, unknown>);
    const n = await trx(TABLE[kind])
      .where({ team_id: teamId, id })
      .update({ ...toColumns(kind, input as Record<string, unknown>), entered_by: userId, updated_at: now() });
    if (n === 0) return false;
    await recordAudit(trx, teamId, userId, `${SINGULAR[kind]}.updated`, { id, name: input.name });
    return true;
  });
}

/** Archives (hides from pickers) or brings back one of the team's rows; false when it is not the team's. */
export async function setLibraryArchived(
  kind: LibraryKind,
  teamId: number,
  id: number,
  userId: number,
  archived: boolean,
): Promise<boolean> {
  return teamTransaction(teamId, async (trx) => {
    const at = now();
    const n = await trx(TABLE[kind])
      .where({ team_id: teamId, id })
      .update({ archived_at: archived ? at : null, updated_at: at });
    if (n === 0) return false;
    await recordAudit(trx, teamId, userId, `${SINGULAR[kind]}.${archived ? "archived" : "unarchived"}`, { id });
    return true;
  });
}
