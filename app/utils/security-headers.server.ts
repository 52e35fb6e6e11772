// Response headers set on every page and data response, each with the reason it is there.
export function securityHeaders(options: { nonce: string; production: boolean }): Record<string, string> {
  const headers: Record<string, string> = {
    // Scripts only from our origin or inline with this response's nonce; no plugins, no framing.
    "Content-Security-Policy": [
      "default-src 'self'",
      `script-src 'self' 'nonce-${options.nonce}'`,
      "style-src 'self' 'unsafe-inline'",
      "img-src 'self' data: blob:",
      "font-src 'self'",
      "connect-src 'self'",
      "object-src 'none'",
      "base-uri 'self'",
      "form-action 'self'",
      "frame-ancestors 'none'",
    ].join("; "),
    // Never guess a content type: an upload served as an image must not run as a script.
    "X-Content-Type-Options": "nosniff",
    // Older browsers that ignore frame-ancestors: no clickjacking through frames.
    "X-Frame-Options": "DENY",
    // Links to other sites carry no path (engine names and ids stay in the shop).
    "Referrer-Policy": "strict-origin-when-cross-origin",
    // The app needs none of these device features.
    "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=()",
    // Pages with shop data are not kept by shared caches.
    "Cache-Control": "private, no-store",
  };
  // Dev server's HMR injects inline scripts without a nonce; the policy is for the built app.
  if (!options.production) delete headers["Content-Security-Policy"];
  return headers;
}
