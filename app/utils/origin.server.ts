// Form posts must come from our own pages: the Origin (or Referer) must match the Host.
// SameSite=Lax cookies already stop most cross-site posts; this is the second lock.
export function isSameOriginPost(request: Request): boolean {
  const method = request.method.toUpperCase();
  if (method === "GET" || method === "HEAD" || method === "OPTIONS") return true;
  // API clients with a bearer token carry no cookie, so there is nothing to forge.
  if (request.headers.get("Authorization")?.startsWith("Bearer ")) return true;
  const host = request.headers.get("X-Forwarded-Host") ?? request.headers.get("Host") ?? new URL(request.url).host;
  const source = request.headers.get("Origin") ?? request.headers.get("Referer");
  if (!source || source === "null") return false;
  try {
    return new URL(source).host === host;
  } catch {
    return false;
  }
}
