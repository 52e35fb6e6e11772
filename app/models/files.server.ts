import type { Knex } from "knex";
import { FormDataParseError, MaxFileSizeExceededError, MaxFilesExceededError, parseFormData } from "@remix-run/form-data-parser";
import { type DbRow, now, withTeam, writeTransaction } from "~/utils/db.server";
import { getEnv } from "~/utils/env.server";
import { fileStorage, MAX_UPLOAD_BYTES, newStorageKey, sniffType, teamQuotaBytes, thumbnail } from "~/utils/files.server";
import { parseId } from "~/utils/ids";
import { recordAudit } from "./audit.server";

// Files kept on an engine (and on one of its assemblies or runs), or on a fastener or gasket of the
// library (the maker's sheet): the rows, scoped to the team, and the upload that streams one in.
// The order keeps the store and the rows in step: the bytes go to the file storage under a key made
// here; the row is written (in a transaction, with the quota checked inside it) only once the whole
// request has been read and the file checked; when that write fails the stored objects are removed
// again. A crash between the two leaves an object without a row, which sweepOrphanFiles() removes once
// it is older than any upload in flight. Deleting goes the other way: the row first, then the objects.

export interface FileRow {
  id: number;
  engineId: number | null;
  assemblyId: number | null;
  runId: number | null;
  fastenerId: number | null;
  gasketId: number | null;
  name: string;
  contentType: string;
  sizeBytes: number;
  hasThumb: boolean;
  createdAt: string;
}

/** What a file belongs to: exactly one of an engine, a fastener or a gasket (the table checks it too). */
export type FileOwner = { engineId: number } | { fastenerId: number } | { gasketId: number };
/** The library kinds that keep files (the makers' sheets). */
export type FileLibraryKind = "fasteners" | "gaskets";

export const libraryOwner = (kind: FileLibraryKind, itemId: number): FileOwner =>
  kind === "fasteners" ? { fastenerId: itemId } : { gasketId: itemId };

const ownerColumns = (owner: FileOwner) => ({
  engine_id: "engineId" in owner ? owner.engineId : null,
  fastener_id: "fastenerId" in owner ? owner.fastenerId : null,
  gasket_id: "gasketId" in owner ? owner.gasketId : null,
});

function toFile(r: DbRow): FileRow {
  return {
    id: r.id,
    engineId: r.engine_id,
    assemblyId: r.assembly_id,
    runId: r.run_id,
    fastenerId: r.fastener_id,
    gasketId: r.gasket_id,
    name: r.name,
    contentType: r.content_type,
    sizeBytes: r.size_bytes,
    hasThumb: Boolean(r.thumb_key),
    createdAt: r.created_at,
  };
}

/** An engine's files (with those of its assemblies and runs), or a fastener's or gasket's, newest first. */
export async function listFiles(teamId: number, owner: number | FileOwner): Promise<FileRow[]> {
  const where = ownerColumns(typeof owner === "number" ? { engineId: owner } : owner);
  return (
    await withTeam(teamId, (k) =>
      k("files")
        .where({ team_id: teamId, ...where })
        .orderBy("id", "desc"),
    )
  ).map(toFile);
}

/** The stored file of this team (with its storage keys), or null: another team's file is not found. */
export async function getStoredFile(teamId: number, idParam: string | undefined) {
  const id = parseId(idParam);
  const row = id === null ? null : await withTeam(teamId, (k) => k("files").where({ team_id: teamId, id }).first());
  return row ? { ...toFile(row), storageKey: row.storage_key as string, thumbKey: (row.thumb_key as string | null) ?? null } : null;
}

export async function teamUsedBytes(teamId: number, q?: Knex): Promise<number> {
  const sum = (k: Knex) => k("files").where({ team_id: teamId }).sum({ total: "size_bytes" }).first();
  const r = await (q ? sum(q) : withTeam(teamId, sum));
  return Number(r?.total ?? 0);
}

// Thrown inside the row's transaction when the team's space is full, so the quota is read and the row
// written as one step (two uploads at once cannot both squeeze into the last megabytes).
class QuotaFull extends Error {
  constructor(readonly used: number) {
    super("quota full");
  }
}

export type UploadResult =
  { ok: true; file: FileRow; returnTo: string | null } | { ok: false; status: 400 | 404 | 413 | 415; message: string };

const MB = (n: number) => `${(n / 1024 / 1024).toFixed(1)} MB`;
// A shown file name: no path, no control characters, at most 200 characters.
const cleanName = (s: string) =>
  (s.split(/[\\/]/).pop() ?? "")
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is removed
    .replace(/[\u0000-\u001f\u007f"]/g, "")
    .trim()
    .slice(0, 200) || "file";

export async function receiveUpload(request: Request, teamId: number, userId: number, owner: FileOwner): Promise<UploadResult> {
  let picked: { bytes: Uint8Array; name: string } | null = null;
  let form: FormData;
  try {
    form = await parseFormData(request, { maxFileSize: MAX_UPLOAD_BYTES, maxFiles: 1 }, async (file) => {
      if (file.fieldName !== "file") return null;
      picked = { bytes: new Uint8Array(await file.arrayBuffer()), name: file.name };
      return null;
    });
  } catch (e) {
    if (e instanceof MaxFileSizeExceededError)
      return {
        ok: false,
        status: 413,
        message: `Files may be at most ${MB(MAX_UPLOAD_BYTES)} each; this one is larger, so it was refused and nothing was kept.`,
      };
    if (e instanceof MaxFilesExceededError) return { ok: false, status: 400, message: "Send one file at a time." };
    if (e instanceof FormDataParseError) return { ok: false, status: 400, message: "The upload could not be read; nothing was kept." };
    return { ok: false, status: 400, message: "The upload was cut off before it finished; nothing was kept. Try again." };
  }
  const chosen = picked as { bytes: Uint8Array; name: string } | null;
  if (!chosen || chosen.bytes.length === 0) return { ok: false, status: 400, message: "Choose a file to upload." };
  const type = await sniffType(chosen.bytes);
  if (!type)
    return {
      ok: false,
      status: 415,
      message: "Only photos (JPEG, PNG, WebP) and PDFs are kept, and this file's content is none of them (its name does not count).",
    };
  const text = (k: string) => (typeof form.get(k) === "string" ? (form.get(k) as string) : "");
  const on = "engineId" in owner ? await attachTo(teamId, owner.engineId, text("assemblyId"), text("runId")) : NOT_ON_RECORD;
  if (!on.ok) return on;

  let thumb: Uint8Array | null = null;
  if (type !== "application/pdf") {
    try {
      thumb = await thumbnail(chosen.bytes);
    } catch {
      return { ok: false, status: 415, message: "This photo could not be read as an image; nothing was kept." };
    }
  }
  const name = cleanName(chosen.name);
  const key = newStorageKey(teamId);
  const thumbKey = thumb ? `${key}-thumb` : null;
  const storage = fileStorage();
  const quota = teamQuotaBytes();
  try {
    await storage.set(key, new File([chosen.bytes as BlobPart], name, { type }));
    if (thumb && thumbKey) await storage.set(thumbKey, new File([thumb as BlobPart], "thumb.webp", { type: "image/webp" }));
    const row = await writeTransaction(
      async (trx) => {
        const used = await teamUsedBytes(teamId, trx);
        if (used + chosen.bytes.length > quota) throw new QuotaFull(used);
        const at = now();
        const [inserted] = await trx("files")
          .insert({
            team_id: teamId,
            ...ownerColumns(owner),
            assembly_id: on.assemblyId,
            run_id: on.runId,
            storage_key: key,
            thumb_key: thumbKey,
            name,
            content_type: type,
            size_bytes: chosen.bytes.length,
            created_by: userId,
            created_at: at,
          })
          .returning("*");
        await recordAudit(trx, teamId, userId, "file.uploaded", { ...owner, fileId: inserted.id }, at);
        return inserted as DbRow;
      },
      { teamId },
    );
    const returnTo = text("returnTo");
    return { ok: true, file: toFile(row), returnTo: /^\/engines\/\d+\/[a-z]+$/.test(returnTo) ? returnTo : null };
  } catch (e) {
    // both or neither: a file whose row was not written is taken away again
    await removeObjects(key, thumbKey);
    if (!(e instanceof QuotaFull)) throw e;
    return {
      ok: false,
      status: 413,
      message: `The shop's file space is full: ${MB(e.used)} of ${MB(quota)} used, and this file needs ${MB(chosen.bytes.length)}.`,
    };
  }
}

// An object the store would not remove (it is down, say) stays for the sweep; the caller's outcome stands.
async function removeObjects(...keys: (string | null)[]) {
  const storage = fileStorage();
  for (const key of keys) {
    if (key)
      await Promise.resolve(storage.remove(key)).catch((e: Error) => console.warn(`stored object ${key} left for the sweep: ${e.message}`));
  }
}

/** Takes a file away (a builder's act): the row and its audit line first, then the stored objects. */
export async function deleteFile(teamId: number, userId: number, idParam: string | undefined): Promise<FileRow | null> {
  const id = parseId(idParam);
  if (id === null) return null;
  const row = await writeTransaction(
    async (trx) => {
      const found = await trx("files").where({ team_id: teamId, id }).first();
      if (!found) return null;
      await trx("files").where({ team_id: teamId, id }).delete();
      await recordAudit(trx, teamId, userId, "file.deleted", { fileId: id, name: found.name });
      return found as DbRow;
    },
    { teamId },
  );
  if (!row) return null;
  await removeObjects(row.storage_key, row.thumb_key);
  return toFile(row);
}

const NOT_ON_RECORD = { ok: true as const, assemblyId: null, runId: null };

async function attachTo(teamId: number, engineId: number, assemblyText: string, runText: string) {
  const out = { ok: true as const, assemblyId: null as number | null, runId: null as number | null };
  if (assemblyText) {
    const id = parseId(assemblyText);
    const row =
      id === null ? null : await withTeam(teamId, (k) => k("assemblies").where({ team_id: teamId, engine_id: engineId, id }).first("id"));
    if (!row) return { ok: false as const, status: 404 as const, message: "No such assembly on this engine." };
    out.assemblyId = row.id;
  }
  if (runText) {
    const id = parseId(runText);
    const row =
      id === null ? null : await withTeam(teamId, (k) => k("runs").where({ team_id: teamId, engine_id: engineId, id }).first("id"));
    if (!row) return { ok: false as const, status: 404 as const, message: "No such run on this engine." };
    out.runId = row.id;
  }
  return out;
}

// Keys this app makes: t<team id>/<uuid>, and <that>-thumb for a photo's thumbnail (newStorageKey).
const KEY = /^t(\d+)\/[0-9a-f-]{36}(-thumb)?$/;

/**
 * Removes stored objects that no row names, once they are older than `olderThanMinutes` (an upload in
 * flight has stored its object but not yet written its row). Works the same on disk and on S3: it lists
 * the store, then asks each team's rows (through withTeam, so PostgreSQL's row security lets them be
 * seen) which of that team's keys are kept. Objects under keys this app does not make are left alone.
 */
export async function sweepOrphanFiles(
  options: { olderThanMinutes?: number; pageSize?: number; at?: number } = {},
): Promise<{ listed: number; removed: string[] }> {
  const { olderThanMinutes = getEnv().FILE_SWEEP_MINUTES, pageSize = 100, at = Date.now() } = options;
  const cutoff = at - olderThanMinutes * 60_000;
  const storage = fileStorage();
  // listed in full before anything is removed: removing while paging would move the cursor's ground
  const byTeam = new Map<number, string[]>();
  let listed = 0;
  let cursor: string | undefined;
  do {
    const page = await storage.list({ cursor, limit: pageSize, includeMetadata: true });
    listed += page.files.length;
    for (const f of page.files) {
      const team = KEY.exec(f.key)?.[1];
      if (team && f.lastModified < cutoff) byTeam.set(Number(team), [...(byTeam.get(Number(team)) ?? []), f.key]);
    }
    cursor = page.cursor;
  } while (cursor);

  const removed: string[] = [];
  for (const [teamId, keys] of byTeam) {
    for (let i = 0; i < keys.length; i += 500) {
      const batch = keys.slice(i, i + 500);
      const rows = await withTeam(teamId, (q) =>
        q("files")
          .where({ team_id: teamId })
          .where((w) => void w.whereIn("storage_key", batch).orWhereIn("thumb_key", batch))
          .select("storage_key", "thumb_key"),
      );
      const kept = new Set(rows.flatMap((r: DbRow) => [r.storage_key, r.thumb_key]));
      for (const key of batch.filter((k) => !kept.has(k))) {
        await storage.remove(key);
        removed.push(key);
      }
    }
  }
  return { listed, removed };
}
