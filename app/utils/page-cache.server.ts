import crypto from "node:crypto";
import { createContext, type RouterContextProvider } from "react-router";
import { LruCache } from "~/lib/lru-cache";
import { teamDataVersion } from "~/models/team-version.server";
import { requireUser } from "./auth.server";

// A whole rendered page kept per person and per version of their shop's data, for pages that are read
// far more often than written (the plan editor). Everything the page shows is either in the key or moves
// the version: who asks (user row with its units, current team, role, every membership with its team's
// name), the URL, and the team's newest audit id (every write records one in its own transaction). The
// session is checked on every request (a signed-out or revoked session never reaches the cache). Pages
// carrying a toast are never kept nor served from here, and nothing that sets a cookie is kept. An
// in-process table: it holds nothing another process needs; the version comes from the database.

/**
 * True for a GET of a rendered page (not a `.data` request, whose body is the loader data). Set by the
 * production server (scripts/serve.mjs) from the request's own path; without it (dev, tests) the cache
 * is off unless a test sets it.
 */
export const documentRequestContext = createContext<boolean>(false);

interface KeptPage {
  status: number;
  headers: [string, string][];
  /** The page's bytes cut at each place its CSP nonce stood; each answer puts a fresh one there. */
  parts: Buffer[];
  /** The CSP nonce the page was rendered with (in the headers). */
  nonce: string;
}

/** Editor pages are 60–120 KB of HTML: 200 of them stay under ~25 MB. */
export const PAGE_CACHE = new LruCache<KeptPage>(200);

const TOAST_COOKIE = /(?:^|;\s*)sw_toast=/;
const NONCE_ATTR = /\bnonce="([^"]+)"/;

function isDocumentRequest(context: unknown): boolean {
  try {
    return (context as RouterContextProvider | undefined)?.get(documentRequestContext) === true;
  } catch {
    return false;
  }
}

interface MiddlewareArgs {
  request: Request;
  context: unknown;
}

/** Route middleware: answers from the table when this person saw this page at this data version. */
export async function cachedPage({ request, context }: MiddlewareArgs, next: () => Promise<Response>): Promise<Response> {
  if (request.method !== "GET" || !isDocumentRequest(context) || TOAST_COOKIE.test(request.headers.get("Cookie") ?? "")) return next();
  let member: Awaited<ReturnType<typeof requireUser>>;
  try {
    member = await requireUser(request);
  } catch {
    // signed out, or in no shop: the loaders give the answer (a redirect, a 403)
    return next();
  }
  // read before the page is rendered: a page kept under this version holds data at least this new
  const version = await teamDataVersion(member.team.id);
  const key = JSON.stringify([request.url, member.user, member.team.id, member.role, member.memberships, version]);
  const kept = PAGE_CACHE.get(key);
  if (kept) return replay(kept);
  const response = await next();
  if (response.status !== 200 || response.headers.has("Set-Cookie") || !response.headers.get("Content-Type")?.startsWith("text/html"))
    return response;
  const body = await response.text();
  const nonce = NONCE_ATTR.exec(body)?.[1];
  if (nonce)
    PAGE_CACHE.set(key, {
      status: response.status,
      headers: [...response.headers],
      parts: body.split(nonce).map((p) => Buffer.from(p)),
      nonce,
    });
  return new Response(body, { status: response.status, headers: response.headers });
}

/**
 * The kept page with a fresh nonce in the body and the headers (one nonce per response, as rendered):
 * the bytes joined around it, no text to search or encode again.
 */
function replay(kept: KeptPage): Response {
  const nonce = crypto.randomBytes(16).toString("base64");
  const headers = new Headers();
  for (const [name, value] of kept.headers) headers.append(name, value.replaceAll(kept.nonce, nonce));
  const nonceBytes = Buffer.from(nonce);
  const chunks: Buffer[] = [];
  for (const [i, part] of kept.parts.entries()) {
    if (i > 0) chunks.push(nonceBytes);
    chunks.push(part);
  }
  return new Response(Buffer.concat(chunks), { status: kept.status, headers });
}
