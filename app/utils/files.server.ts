import crypto from "node:crypto";
import path from "node:path";
import { createFsFileStorage } from "@remix-run/file-storage/fs";
import type { FileStorage } from "@remix-run/file-storage";
import { createS3FileStorage } from "@remix-run/file-storage-s3";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { getEnv, type Env } from "./env.server";
import { ALLOWED_UPLOAD_TYPES, MAX_UPLOAD_BYTES, type UploadType } from "./upload-rules";

// The file store, through @remix-run/file-storage: local disk outside the web root by default (UPLOAD_DIR,
// default "uploads" beside the database), or S3-compatible object storage when FILE_STORAGE=s3
// (@remix-run/file-storage-s3). Keys are made here (team/random), never from the person's file name.

let store: FileStorage | undefined;
let storeFor: string | undefined;

function uploadDir(env: Env = getEnv()): string {
  return path.resolve(env.UPLOAD_DIR ?? path.join(path.dirname(env.DATABASE_PATH), "uploads"));
}

export function fileStorage(): FileStorage {
  const env = getEnv();
  const where = env.FILE_STORAGE === "s3" ? `s3 ${env.S3_ENDPOINT ?? env.S3_REGION} ${env.S3_BUCKET}` : `disk ${uploadDir(env)}`;
  if (!store || storeFor !== where) {
    store = env.FILE_STORAGE === "s3" ? s3Storage(env) : createFsFileStorage(uploadDir(env));
    storeFor = where;
  }
  return store;
}

// env.server.ts has refused FILE_STORAGE=s3 without a bucket and keys, so the `!`s hold.
function s3Storage(env: Env): FileStorage {
  return createS3FileStorage({
    bucket: env.S3_BUCKET!,
    region: env.S3_REGION,
    endpoint: env.S3_ENDPOINT,
    forcePathStyle: env.S3_FORCE_PATH_STYLE ? env.S3_FORCE_PATH_STYLE === "true" : undefined,
    accessKeyId: env.S3_ACCESS_KEY_ID!,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
    sessionToken: env.S3_SESSION_TOKEN,
  });
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
