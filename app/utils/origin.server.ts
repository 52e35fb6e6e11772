// Form posts must come from our own pages: the Origin (or Referer) must match the Host.
// SameSite=Lax cookies already stop most cross-site posts; this is the second lock.
export function isSameOriginPost(request: Request): boolean {
  const method = request.method.toUpperCase();
  if (method === "GET" || method === "HEAD" || method === "OPTIONS") return true;
  const host = request.headers.get("X-Forwarded-Host") ?? request.headers.get("Host") ?? new URL(request.url).host;
  const source = request.headers.get("Origin") ?? request.headers.get("Referer");
  // Browsers always name the origin of a post. A request that names none and carries no cookie is a
  // script or an API client: it has no session to forge, and the route's own guard answers it.
  if (!source) return !request.headers.get("Cookie");
  if (source === "null") return false;
  try {
    return new URL(source).host === host;
  } catch {
    return false;
  }
}
