import crypto from "node:crypto";
import { PassThrough } from "node:stream";
import { createReadableStreamFromReadable } from "@react-router/node";
import { isbot } from "isbot";
import type { RenderToPipeableStreamOptions } from "react-dom/server";
import { renderToPipeableStream } from "react-dom/server";
import {
  isRouteErrorResponse,
  ServerRouter,
  type EntryContext,
  type HandleDataRequestFunction,
  type HandleErrorFunction,
} from "react-router";
import { NonceProvider } from "./components/nonce";
import { logCrossSiteRefusal } from "./utils/request-guard.server";
import { fillSecurityHeaders, securityHeaders } from "./utils/security-headers.server";

export const streamTimeout = 5_000;

// For the production server (scripts/serve.mjs), which must use the build's own copies: the router
// context keys it puts the client's address and "this is a page request" under, and the header table it puts on static files.
export { clientAddressContext } from "./utils/client-address.server";
export { documentRequestContext } from "./utils/page-cache.server";
export { fillHeaderValues, kindOf } from "./utils/security-headers.server";

const production = process.env.NODE_ENV === "production";

function applyHeaders(headers: Headers, nonce: string) {
  for (const [name, value] of Object.entries(securityHeaders({ nonce, production }))) {
    if (name === "Cache-Control" && headers.has(name)) continue;
    headers.set(name, value);
  }
}

export const handleDataRequest: HandleDataRequestFunction = (response) => {
  fillSecurityHeaders(response.headers, "other", production);
  return response;
};

// React Router refuses an action whose Origin is not the request's own before any middleware runs,
// and hands us the refusal as an error (on a data request, as a bare "Bad Request").
const ROUTER_CSRF_REFUSAL = /^(Bad Request$|The `request\.url` origin does not match|`origin` header is not a valid URL)/;

// One line for a refused cross-site write, nothing for answers in words (4xx), the stack for real faults.
export const handleError: HandleErrorFunction = (error, { request }) => {
  if (request.signal.aborted) return;
  if (error instanceof Error && ROUTER_CSRF_REFUSAL.test(error.message)) return logCrossSiteRefusal(request);
  if (isRouteErrorResponse(error) && error.status < 500) return;
  console.error(error);
};

export default function handleRequest(request: Request, responseStatusCode: number, responseHeaders: Headers, routerContext: EntryContext) {
  const nonce = crypto.randomBytes(16).toString("base64");
  applyHeaders(responseHeaders, nonce);

  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }

  return new Promise<Response>((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    const readyOption: keyof RenderToPipeableStreamOptions =
      (userAgent && isbot(userAgent)) || routerContext.isSpaMode ? "onAllReady" : "onShellReady";

    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);

    const { pipe, abort } = renderToPipeableStream(
      <NonceProvider value={nonce}>
        <ServerRouter context={routerContext} url={request.url} nonce={nonce} />
      </NonceProvider>,
      {
        nonce,
        [readyOption]() {
          shellRendered = true;
          const body = new PassThrough({
            final(callback) {
              clearTimeout(timeoutId);
              timeoutId = undefined;
              callback();
            },
          });
          responseHeaders.set("Content-Type", "text/html");
          pipe(body);
          resolve(new Response(createReadableStreamFromReadable(body), { headers: responseHeaders, status: responseStatusCode }));
        },
        onShellError(error: unknown) {
          reject(error);
        },
        onError(error: unknown) {
          responseStatusCode = 500;
          if (shellRendered) console.error(error);
        },
      },
    );
  });
}
