import { data } from "react-router";
import { isApiPath, logCrossSiteRefusal, requestRefusal, type Refusal } from "./request-guard.server";
import { withSecurityHeaders } from "./security-headers.server";

const production = process.env.NODE_ENV === "production";

interface MiddlewareArgs {
  request: Request;
  params: Record<string, string | undefined>;
}

/**
 * The root route's middleware. A refusal is answered as JSON on the API and thrown as a route error on
 * pages (so the error page says it in words); every response that comes back gets the header table.
 */
export async function guardRequest({ request, params }: MiddlewareArgs, next: () => Promise<Response>): Promise<Response> {
  const pathname = new URL(request.url).pathname;
  const refused = await requestRefusal(request, params);
  if (refused) {
    if (refused.status === 403) logCrossSiteRefusal(request);
    if (isApiPath(pathname)) return withSecurityHeaders(refusalJson(refused), pathname, production);
    throw data(refused.message, { status: refused.status });
  }
  return withSecurityHeaders(await next(), pathname, production);
}

export function refusalJson(refused: Refusal): Response {
  return Response.json({ error: refused.message }, { status: refused.status });
}
