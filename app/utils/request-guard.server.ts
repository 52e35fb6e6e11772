import { parseId, idParamNames } from "./ids";
import { isSameOriginPost } from "./origin.server";
import { MAX_JSON_BYTES, readUpTo } from "./json-body.server";
import { MAX_UPLOAD_BYTES, UPLOAD_PATH } from "./upload-rules";

// Checks every request passes before any loader or action sees it (root middleware, and the
// production server before React Router): where a write may come from, what body it may carry and how
// big, and that record ids in the path are decimal. A refusal is an answer in words, never a 500.

/** Form posts larger than this are refused (413) before they are parsed. The engine form at its 80-stud
 * maximum with 4,000 characters of notes is under 40 KiB. */
export const MAX_FORM_BYTES = 128 * 1024;

const FORM_TYPES = new Set(["application/x-www-form-urlencoded", "multipart/form-data"]);
const JSON_TYPES = new Set(["application/json"]);

export interface Refusal {
  status: 400 | 403 | 404 | 413 | 415;
  message: string;
}

export const CROSS_SITE_MESSAGE = "This form was sent from another site, so it was refused.";

export function isMutation(method: string): boolean {
  const m = method.toUpperCase();
  return m !== "GET" && m !== "HEAD" && m !== "OPTIONS";
}

export function isApiPath(pathname: string): boolean {
  return pathname.startsWith("/api/");
}

/** "multipart/form-data; boundary=x" → "multipart/form-data". */
function mediaType(contentType: string | null): string {
  return (contentType ?? "").split(";")[0]!.trim().toLowerCase();
}

/** An upload may carry one file at the cap plus its form fields and multipart framing. */
export const MAX_UPLOAD_BODY_BYTES = MAX_UPLOAD_BYTES + 64 * 1024;

function bodyLimit(pathname: string): number {
  if (UPLOAD_PATH.test(pathname)) return MAX_UPLOAD_BODY_BYTES;
  return isApiPath(pathname) ? MAX_JSON_BYTES : MAX_FORM_BYTES;
}

/** What the request line and headers alone already refuse; null when they pass. */
export function headerRefusal(request: Request, params: Record<string, string | undefined> = {}): Refusal | null {
  for (const name of idParamNames(params)) {
    if (parseId(params[name]) === null) return { status: 404, message: "There is nothing at this address." };
  }
  if (!isMutation(request.method)) return null;
  if (!isSameOriginPost(request)) return { status: 403, message: CROSS_SITE_MESSAGE };
  const pathname = new URL(request.url).pathname;
  const contentType = request.headers.get("Content-Type");
  const type = mediaType(contentType);
  if (isApiPath(pathname)) {
    if (!JSON_TYPES.has(type)) return { status: 415, message: "Send the body as JSON (Content-Type: application/json)." };
  } else if (!FORM_TYPES.has(type)) {
    return { status: 415, message: "Send the form as application/x-www-form-urlencoded or multipart/form-data." };
  } else if (type === "multipart/form-data" && !/;\s*boundary=/i.test(contentType ?? "")) {
    return { status: 400, message: "The form's multipart body names no boundary." };
  }
  const declared = request.headers.get("Content-Length");
  if (declared !== null) {
    if (!/^\d+$/.test(declared.trim())) return { status: 400, message: "The Content-Length header is not a number." };
    if (Number(declared) > bodyLimit(pathname)) return tooLarge(pathname);
  }
  return null;
}

function tooLarge(pathname: string): Refusal {
  if (UPLOAD_PATH.test(pathname))
    return { status: 413, message: "Files may be at most 10 MB each; this upload is larger, so it was refused and nothing was kept." };
  return { status: 413, message: `The body is larger than ${Math.round(bodyLimit(pathname) / 1024)} KiB.` };
}

/**
 * Reads a copy of the body up to the limit (a chunked body names no length): 413 past it. A multipart
 * body that does not parse is a 400 here rather than a 500 in the action. The action still reads the
 * original, which holds at most the limit.
 */
const NUL_REFUSAL: Refusal = { status: 400, message: "The form holds a NUL character, which no field accepts." };

export async function bodyRefusal(request: Request): Promise<Refusal | null> {
  if (!isMutation(request.method) || !request.body) return null;
  const pathname = new URL(request.url).pathname;
  // An upload is streamed by its action, which stops at the file cap: reading a copy here would hold it whole.
  if (UPLOAD_PATH.test(pathname)) return null;
  const limit = bodyLimit(pathname);
  // The original is left alone: destroying it would reset the connection before the 413 is sent; the
  // server discards the unread rest once the answer is out.
  const chunks = await readUpTo(request.clone().body!, limit);
  if (chunks === null) return tooLarge(pathname);
  const contentType = request.headers.get("Content-Type") ?? "";
  // PostgreSQL text cannot hold a NUL character (22021, a 500); no field of ours means one, so a form
  // carrying one (%00, or a raw zero byte) is refused on both engines alike.
  if (mediaType(contentType) === "application/x-www-form-urlencoded") {
    const body = Buffer.concat(chunks);
    if (body.includes(0) || /%00/i.test(body.toString("latin1"))) return NUL_REFUSAL;
  }
  if (mediaType(contentType) === "multipart/form-data") {
    let form: FormData;
    try {
      form = await new Response(Buffer.concat(chunks), { headers: { "Content-Type": contentType } }).formData();
    } catch {
      return { status: 400, message: "The form's multipart body could not be read." };
    }
    // text fields only: an uploaded file may hold zero bytes
    for (const value of form.values()) if (typeof value === "string" && value.includes("\0")) return NUL_REFUSAL;
  }
  return null;
}

/** Refusal for the request, from its headers or its body; null when it may go on. */
export async function requestRefusal(request: Request, params: Record<string, string | undefined> = {}): Promise<Refusal | null> {
  return headerRefusal(request, params) ?? (await bodyRefusal(request));
}

/** One line for a refused cross-site write (React Router's own refusal logged a stack trace per request). */
export function logCrossSiteRefusal(request: Request): void {
  const url = new URL(request.url);
  const from = request.headers.get("Origin") ?? request.headers.get("Referer") ?? "no origin";
  console.warn(`refused cross-site ${request.method.toUpperCase()} ${url.pathname} from ${JSON.stringify(from.slice(0, 200))}`);
}
