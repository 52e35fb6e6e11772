import crypto from "node:crypto";
import type { z } from "zod";
import { callerForToken } from "~/models/api-token.server";
import type { Role } from "~/models/user.server";
import { requireApiMember, roleAtLeast } from "./auth.server";
import { clientAddress } from "./client-address.server";
import { readJsonBody } from "./json-body.server";
import { isSameOriginPost } from "./origin.server";
import { takeAll, tooManyHeaders, waitWords } from "./rate-limit.server";
import { CROSS_SITE_MESSAGE, isMutation } from "./request-guard.server";

// The JSON API's door: who is calling (a bearer token, else the session cookie), the throttles, the
// Origin check for cookie writes, body and query validation against the documented zod schemas, and
// the one error body { error, errors? } for every refusal (docs/api.md). Routes stay thin on top.

export interface ApiCaller {
  userId: number;
  teamId: number;
  teamName: string;
  role: Role;
  via: "token" | "cookie";
}

export function apiError(
  status: number,
  error: string,
  extra: { errors?: { path: string; message: string }[]; headers?: HeadersInit } = {},
): Response {
  const body = extra.errors ? { error, errors: extra.errors } : { error };
  return Response.json(body, { status, headers: extra.headers });
}

function tooMany(waitMs: number): Response {
  return apiError(429, `Too many requests; try again in ${waitWords(waitMs)}.`, { headers: tooManyHeaders(waitMs) });
}

const UNAUTHORIZED = { "WWW-Authenticate": 'Bearer realm="sealwright"' };

/** The caller, or throws 401 (no or bad credentials), 403 (cookie write from elsewhere) or 429. */
export async function apiCaller(request: Request, context: unknown): Promise<ApiCaller> {
  // the address pays first, so a flood of made-up tokens is throttled before any lookup
  const addressWait = await takeAll([["apiAddress", clientAddress(context)]]);
  if (addressWait > 0) throw tooMany(addressWait);
  const authorization = request.headers.get("Authorization");
  if (authorization !== null) {
    const match = /^Bearer\s+(\S+)\s*$/i.exec(authorization);
    if (!match) throw apiError(401, 'Send the token as "Authorization: Bearer <token>".', { headers: UNAUTHORIZED });
    const caller = await callerForToken(match[1]!);
    if (!caller) throw apiError(401, "This token is unknown or has been revoked.", { headers: UNAUTHORIZED });
    const wait = await takeAll([["apiToken", String(caller.tokenId)]]);
    if (wait > 0) throw tooMany(wait);
    return { userId: caller.userId, teamId: caller.teamId, teamName: caller.teamName, role: caller.role, via: "token" };
  }
  let member;
  try {
    member = await requireApiMember(request);
  } catch (thrown) {
    if (thrown instanceof Response && thrown.status === 401)
      throw apiError(401, "Sign in, or send a personal API token as Authorization: Bearer <token>.", { headers: UNAUTHORIZED });
    throw thrown;
  }
  // React Router's own cross-site check does not cover resource routes, and a cookie is sent by the
  // browser on its own: a cookie write must come from our pages (the root middleware checks it too).
  if (isMutation(request.method) && !isSameOriginPost(request)) throw apiError(403, CROSS_SITE_MESSAGE);
  const wait = await takeAll([["apiUser", String(member.user.id)]]);
  if (wait > 0) throw tooMany(wait);
  return { userId: member.user.id, teamId: member.team.id, teamName: member.team.name, role: member.role, via: "cookie" };
}

export function requireApiRole(caller: ApiCaller, needed: Role): void {
  if (!roleAtLeast(caller.role, needed)) {
    const how = caller.via === "token" ? "this token acts as" : "you are";
    throw apiError(403, `This needs the ${needed} role; ${how} a ${caller.role} in ${caller.teamName}.`);
  }
}

function fieldErrors(error: z.ZodError, prefix: string[] = []) {
  return error.issues.map((i) => {
    const keys = i.code === "unrecognized_keys" ? (i as { keys?: string[] }).keys : undefined;
    const path = [...prefix, ...i.path.map(String)].join(".");
    return { path: keys ? [path, keys.join(",")].filter(Boolean).join(".") : path, message: i.message };
  });
}

/** The JSON body parsed with the schema; 400 with field errors (or 413/415 from the reader) otherwise. */
export async function apiBody<S extends z.ZodType>(
  request: Request,
  schema: S,
  precheck?: (body: unknown) => Response | null,
): Promise<z.output<S>> {
  const body = await readJsonBody(request);
  if (body === null || typeof body !== "object" || Array.isArray(body)) throw apiError(400, "Send a JSON object.");
  const early = precheck?.(body);
  if (early) throw early;
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw apiError(400, "The request has problems; nothing was done.", { errors: fieldErrors(parsed.error) });
  return parsed.data;
}

/** The query string parsed with the schema (each name once); 400 with field errors otherwise. */
export function apiQuery<S extends z.ZodType>(request: Request, schema: S): z.output<S> {
  const params = new URL(request.url).searchParams;
  const raw: Record<string, string> = {};
  for (const [k, v] of params) {
    if (k in raw) throw apiError(400, `Give ${k} once.`, { errors: [{ path: k, message: "given more than once" }] });
    raw[k] = v;
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw apiError(400, "The query has problems.", { errors: fieldErrors(parsed.error) });
  return parsed.data;
}

export function apiFieldErrors(error: z.ZodError, prefix: string[] = []) {
  return fieldErrors(error, prefix);
}

/**
 * A read's answer with an ETag (a hash of the body) and Cache-Control: private data, so shared caches
 * keep none, and every reuse asks again (no-cache) — a 304 when nothing changed saves the body.
 */
export function apiRead(request: Request, body: unknown, cacheControl = "private, no-cache"): Response {
  const text = JSON.stringify(body);
  const etag = `"${crypto.createHash("sha256").update(text).digest("base64url").slice(0, 27)}"`;
  const headers = { ETag: etag, "Cache-Control": cacheControl, Vary: "Authorization, Cookie" };
  const wanted = request.headers.get("If-None-Match");
  if (wanted && wanted.split(",").some((t) => t.trim().replace(/^W\//, "") === etag)) return new Response(null, { status: 304, headers });
  return new Response(text, { status: 200, headers: { ...headers, "Content-Type": "application/json; charset=utf-8" } });
}

export function wrongMethod(allowed: string): Response {
  return apiError(405, `Use ${allowed}.`, { headers: { Allow: allowed } });
}

export function notFound(what: string): Response {
  return apiError(404, what);
}
