import crypto from "node:crypto";
import path from "node:path";
import { createFsFileStorage } from "@remix-run/file-storage/fs";
import type { FileStorage } from "@remix-run/file-storage";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { getEnv } from "./env.server";
import { ALLOWED_UPLOAD_TYPES, MAX_UPLOAD_BYTES, type UploadType } from "./upload-rules";

// The file store: local disk outside the web root (UPLOAD_DIR, default "uploads" beside the database),
// through @remix-run/file-storage. Keys are made here (team/random), never from the person's file name.

let store: FileStorage | undefined;
let storeDir: string | undefined;

export function uploadDir(): string {
  const env = getEnv();
  return path.resolve(env.UPLOAD_DIR ?? path.join(path.dirname(env.DATABASE_PATH), "uploads"));
}

export function fileStorage(): FileStorage {
  const dir = uploadDir();
  if (!store || storeDir !== dir) {
    store = createFsFileStorage(dir);
    storeDir = dir;
  }
  return store;
}

export function teamQuotaBytes(): number {
  return Math.round(getEnv().UPLOAD_TEAM_QUOTA_MB * 1024 * 1024);
}

export function newStorageKey(teamId: number): string {
  return `t${teamId}/${crypto.randomUUID()}`;
}

/** The file's real type from its first bytes (magic numbers), or null when it is not one we keep. */
export async function sniffType(bytes: Uint8Array): Promise<UploadType | null> {
  const found = await fileTypeFromBuffer(bytes);
  return found && (ALLOWED_UPLOAD_TYPES as readonly string[]).includes(found.mime) ? (found.mime as UploadType) : null;
}

/** A 320 px wide WebP of a photo; throws when the bytes are not a readable image. */
export async function thumbnail(bytes: Uint8Array): Promise<Uint8Array> {
  return new Uint8Array(
    await sharp(bytes, { limitInputPixels: 100_000_000 })
      .rotate()
      .resize({ width: 320, withoutEnlargement: true })
      .webp({ quality: 70 })
      .toBuffer(),
  );
}

export { MAX_UPLOAD_BYTES };
