import { FormDataParseError, MaxFileSizeExceededError, MaxFilesExceededError, parseFormData } from "@remix-run/form-data-parser";
import { db, now, writeTransaction, type DbRow } from "~/utils/db.server";
import { fileStorage, MAX_UPLOAD_BYTES, newStorageKey, sniffType, teamQuotaBytes, thumbnail } from "~/utils/files.server";
import { parseId } from "~/utils/ids";

// Files kept on an engine (and on one of its assemblies or runs): the rows, scoped to the team, and
// the upload that streams one in. The bytes go to the file storage under a key made here; the row is
// written only once the whole request has been read and the file checked, so an upload cut off midway
// leaves neither a row nor a file.

export interface FileRow {
  id: number;
  engineId: number;
  assemblyId: number | null;
  runId: number | null;
  name: string;
  contentType: string;
  sizeBytes: number;
  hasThumb: boolean;
  createdAt: string;
}

type Row = DbRow;
const toFile = (r: Row): FileRow => ({
  id: r.id,
  engineId: r.engine_id,
  assemblyId: r.assembly_id,
  runId: r.run_id,
  name: r.name,
  contentType: r.content_type,
  sizeBytes: r.size_bytes,
  hasThumb: Boolean(r.thumb_key),
  createdAt: r.created_at,
});

export async function listFiles(teamId: number, engineId: number): Promise<FileRow[]> {
  return (await db()("files").where({ team_id: teamId, engine_id: engineId }).orderBy("id", "desc")).map(toFile);
}

/** The stored file of this team (with its storage keys), or null: another team's file is not found. */
export async function getStoredFile(teamId: number, idParam: string | undefined) {
  const id = parseId(idParam);
  const row = id === null ? null : await db()("files").where({ team_id: teamId, id }).first();
  return row ? { ...toFile(row), storageKey: row.storage_key as string, thumbKey: (row.thumb_key as string | null) ?? null } : null;
}

export async function teamUsedBytes(teamId: number): Promise<number> {
  const r = await db()("files").where({ team_id: teamId }).sum({ total: "size_bytes" }).first();
  return Number(r?.total ?? 0);
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

export async function receiveUpload(request: Request, teamId: number, userId: number, engineId: number): Promise<UploadResult> {
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
  const used = await teamUsedBytes(teamId);
  const quota = teamQuotaBytes();
  if (used + chosen.bytes.length > quota)
    return {
      ok: false,
      status: 413,
      message: `The shop's file space is full: ${MB(used)} of ${MB(quota)} used, and this file needs ${MB(chosen.bytes.length)}.`,
    };

  const text = (k: string) => (typeof form.get(k) === "string" ? (form.get(k) as string) : "");
  const owner = await attachTo(teamId, engineId, text("assemblyId"), text("runId"));
  if (!owner.ok) return owner;

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
  try {
    await storage.set(key, new File([chosen.bytes as BlobPart], name, { type }));
    if (thumb && thumbKey) await storage.set(thumbKey, new File([thumb as BlobPart], "thumb.webp", { type: "image/webp" }));
    const id = await writeTransaction(async (trx) => {
      const at = now();
      const [row] = await trx("files")
        .insert({
          team_id: teamId,
          engine_id: engineId,
          assembly_id: owner.assemblyId,
          run_id: owner.runId,
          storage_key: key,
          thumb_key: thumbKey,
          name,
          content_type: type,
          size_bytes: chosen.bytes.length,
          created_by: userId,
          created_at: at,
        })
        .returning("id");
      await trx("audit_events").insert({
        team_id: teamId,
        user_id: userId,
        action: "file.uploaded",
        detail: JSON.stringify({ engineId, fileId: row.id }),
        created_at: at,
      });
      return row.id as number;
    });
    const row = await db()("files").where({ id }).first();
    const returnTo = text("returnTo");
    return { ok: true, file: toFile(row), returnTo: /^\/engines\/\d+\/[a-z]+$/.test(returnTo) ? returnTo : null };
  } catch (e) {
    // both or neither: a file whose row was not written is taken away again
    await storage.remove(key);
    if (thumbKey) await storage.remove(thumbKey);
    throw e;
  }
}

async function attachTo(teamId: number, engineId: number, assemblyText: string, runText: string) {
  const out = { ok: true as const, assemblyId: null as number | null, runId: null as number | null };
  if (assemblyText) {
    const id = parseId(assemblyText);
    const row = id === null ? null : await db()("assemblies").where({ team_id: teamId, engine_id: engineId, id }).first("id");
    if (!row) return { ok: false as const, status: 404 as const, message: "No such assembly on this engine." };
    out.assemblyId = row.id;
  }
  if (runText) {
    const id = parseId(runText);
    const row = id === null ? null : await db()("runs").where({ team_id: teamId, engine_id: engineId, id }).first("id");
    if (!row) return { ok: false as const, status: 404 as const, message: "No such run on this engine." };
    out.runId = row.id;
  }
  return out;
}
