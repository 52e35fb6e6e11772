import { isRouteErrorResponse } from "react-router";
import { middleware } from "~/root";
import type { Handler } from "./helpers";

// Runs a loader or action behind the root route's middleware, as the server does: refusals, id checks
// and the header table apply. Results become Responses the way React Router makes them; an error that
// is not an answer (no Response, no data(), no route error) propagates — that is a 500.

export interface Answer {
  status: number;
  headers: Headers;
  location: string | null;
  body: unknown;
}

async function toResponse(run: () => unknown): Promise<Response> {
  try {
    return asResponse(await run());
  } catch (thrown) {
    if (thrown instanceof Response) return thrown;
    if (isDataWithInit(thrown)) return Response.json(thrown.data, thrown.init ?? undefined);
    if (isRouteErrorResponse(thrown)) return Response.json(thrown.data, { status: thrown.status });
    throw thrown;
  }
}

function isDataWithInit(v: unknown): v is { data: unknown; init?: ResponseInit | null } {
  return Boolean(v && typeof v === "object" && (v as { type?: string }).type === "DataWithResponseInit");
}

function asResponse(value: unknown): Response {
  if (value instanceof Response) return value;
  if (isDataWithInit(value)) return Response.json(value.data, value.init ?? undefined);
  return Response.json(value ?? null);
}

export async function through(handler: Handler | undefined, request: Request, params: Record<string, string> = {}): Promise<Answer> {
  const args = { request, params, context: undefined, url: new URL(request.url), pattern: "" };
  const run = () => toResponse(() => (handler ? handler(args) : Promise.reject(new Response(null, { status: 405 }))));
  const chain = [...(middleware ?? [])] as unknown as ((a: typeof args, next: () => Promise<Response>) => Promise<Response>)[];
  const step = (i: number): Promise<Response> => (i < chain.length ? toResponse(() => chain[i]!(args, () => step(i + 1))) : run());
  const response = await step(0);
  const type = response.headers.get("Content-Type") ?? "";
  const text = await response.text();
  return {
    status: response.status,
    headers: response.headers,
    location: response.headers.get("Location"),
    body: type.includes("json") && text ? JSON.parse(text) : text,
  };
}
