// Response headers for every response the app sends — pages, data, API JSON, /healthz, redirects,
// refusals and static files — each with the reason it is there. One table, three kinds of response.
export type ResponseKind = "document" | "api" | "other";

const DOCUMENT_CSP = (nonce: string) =>
  [
    // Scripts only from our origin or inline with this response's nonce; no plugins, no framing.
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");

// Anything that is not one of our pages (JSON, a redirect, a script file, an SVG) needs no powers at
// all if a browser ever renders it as a document: an uploaded or crafted file cannot run script.
const NON_DOCUMENT_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** The full table for one kind of response. */
export function headersFor(kind: ResponseKind, options: { nonce?: string; production: boolean }): Record<string, string> {
  const headers: Record<string, string> = {
    "Content-Security-Policy": kind === "document" ? DOCUMENT_CSP(options.nonce ?? "") : NON_DOCUMENT_CSP,
    // Never guess a content type: an upload served as an image must not run as a script.
    "X-Content-Type-Options": "nosniff",
    // Older browsers that ignore frame-ancestors: no clickjacking through frames.
    "X-Frame-Options": "DENY",
    // Links to other sites carry no path (engine names and ids stay in the shop).
    "Referrer-Policy": "strict-origin-when-cross-origin",
    // The app needs none of these device features.
    "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=()",
    // A window another site opens cannot reach back into ours, nor embed our files.
    "Cross-Origin-Opener-Policy": "same-origin",
    "Cross-Origin-Resource-Policy": "same-origin",
    // Pages with shop data are not kept by shared caches; API answers by no cache at all unless the
    // route chose a policy (its reads revalidate by ETag).
    "Cache-Control": kind === "api" ? "no-store" : "private, no-store",
  };
  // The dev server's HMR injects inline scripts without a nonce; the page policy is for the built app.
  if (kind === "document" && !options.production) delete headers["Content-Security-Policy"];
  return headers;
}

/** The page table (kept under its old name for entry.server). */
export function securityHeaders(options: { nonce: string; production: boolean }): Record<string, string> {
  return headersFor("document", options);
}

/** Which kind a response to this path is: the API, or anything else that is not a rendered page. */
export function kindOf(pathname: string, contentType: string | null): ResponseKind {
  if (pathname.startsWith("/api/")) return "api";
  if (contentType?.startsWith("text/html")) return "document";
  return "other";
}

/**
 * Sets every header of the table the response does not already carry (a page's nonce policy, a static
 * file's long cache). The API's Cache-Control is no-store unless the route chose one (the v1 reads answer
 * "private, no-cache" with an ETag, app/utils/api.server.ts). A page's policy is never guessed here:
 * entry.server sets it with the nonce, so an HTML response without one is left without.
 */
export function fillSecurityHeaders(headers: Headers, kind: ResponseKind, production: boolean): void {
  fillHeaderValues(
    (name) => headers.has(name),
    (name, value) => headers.set(name, value),
    kind,
    production,
  );
}

/** The same fill for any header store (the production server's Node responses, scripts/serve.mjs). */
export function fillHeaderValues(
  has: (name: string) => boolean,
  set: (name: string, value: string) => void,
  kind: ResponseKind,
  production: boolean,
): void {
  for (const [name, value] of Object.entries(headersFor(kind, { production }))) {
    if (kind === "document" && name === "Content-Security-Policy") continue;
    if (!has(name)) set(name, value);
  }
}

/** As fillSecurityHeaders, on a response whose headers may be immutable (then on a copy). */
export function withSecurityHeaders(response: Response, pathname: string, production: boolean): Response {
  const kind = kindOf(pathname, response.headers.get("Content-Type"));
  try {
    fillSecurityHeaders(response.headers, kind, production);
    return response;
  } catch {
    const copy = new Response(response.body, response);
    fillSecurityHeaders(copy.headers, kind, production);
    return copy;
  }
}
