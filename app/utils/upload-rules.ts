// Upload limits the browser shows and the server enforces (one source for both).

/** 10 MB per file. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
export const ALLOWED_UPLOAD_TYPES = ["image/jpeg", "image/png", "image/webp", "application/pdf"] as const;
export type UploadType = (typeof ALLOWED_UPLOAD_TYPES)[number];
export const UPLOAD_RULE_TEXT = "Photos (JPEG, PNG, WebP) and PDFs, at most 10 MB each.";

/** The upload endpoints (an engine's, a fastener's or gasket's); the request guard lets their bodies run to the file cap. */
export const UPLOAD_PATH = /^\/(engines\/\d+|libraries\/(fasteners|gaskets)\/\d+)\/files\/upload\/?$/;
