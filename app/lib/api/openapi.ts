// The OpenAPI 3.1 document of /api/v1, built from the same zod schemas the routes validate with.
import { z } from "zod";
import { createDocument, type ZodOpenApiOperationObject, type ZodOpenApiPathsObject } from "zod-openapi";
import {
  EngineListQuerySchema,
  EngineListSchema,
  EngineSchema,
  ErrorBodySchema,
  EstimateRequestSchema,
  EstimateViewSchema,
  PAGE_LIMIT_MAX,
  PageQuerySchema,
  PlanListSchema,
  PlanReadQuerySchema,
  PlanWithEstimateSchema,
  RunCreateSchema,
  RunListQuerySchema,
  RunListSchema,
  RunSchema,
  SweepRequestSchema,
  SweepResponseSchema,
} from "./schemas";

const json = (schema: z.ZodType) => ({ "application/json": { schema } });
const refusal = (description: string) => ({ description, content: json(ErrorBodySchema) });
const REFUSALS = {
  "401": refusal("No session and no token, or the token is unknown or revoked."),
  "429": {
    ...refusal("Too many requests; wait the Retry-After seconds."),
    headers: { "Retry-After": { schema: { type: "integer" as const }, description: "seconds" } },
  },
};
const WRITE_REFUSALS = {
  ...REFUSALS,
  "400": refusal("Not JSON, wrong types, missing or unknown fields: `errors` lists each."),
  "403": refusal("A cookie write from another site, or a role too low for the write."),
  "413": refusal("Body over 64 KiB."),
  "415": refusal("Not Content-Type: application/json."),
};
const READ_HEADERS = {
  ETag: { schema: { type: "string" as const }, description: "Send back as If-None-Match; 304 when unchanged." },
  "Cache-Control": { schema: { type: "string" as const }, description: "private, no-cache" },
};
const read = (schema: z.ZodType, description: string) => ({
  "200": { description, headers: READ_HEADERS, content: json(schema) },
  "304": { description: "Unchanged since the ETag sent in If-None-Match." },
});
const engineIdParam = z.object({
  engineId: z
    .string()
    .regex(/^[1-9][0-9]*$/)
    .meta({ description: "engine id" }),
});
const planIdParams = engineIdParam.extend({
  planId: z
    .string()
    .regex(/^[1-9][0-9]*$/)
    .meta({ description: "plan id" }),
});
const notFound = refusal("Not this team's, or no such record.");

const op = (o: ZodOpenApiOperationObject) => ({ security: [{ bearer: [] }, { session: [] }], ...o });

/** Every path of /api/v1 (as the router spells it, `:param`) → its OpenAPI path. */
export const API_V1_PATHS = {
  "/api/v1/estimate": "/api/v1/estimate",
  "/api/v1/sweep": "/api/v1/sweep",
  "/api/v1/engines": "/api/v1/engines",
  "/api/v1/engines/:engineId": "/api/v1/engines/{engineId}",
  "/api/v1/engines/:engineId/plans": "/api/v1/engines/{engineId}/plans",
  "/api/v1/engines/:engineId/plans/:planId": "/api/v1/engines/{engineId}/plans/{planId}",
  "/api/v1/runs": "/api/v1/runs",
  "/api/v1/openapi.json": "/api/v1/openapi.json",
} as const;

const paths: ZodOpenApiPathsObject = {
  "/api/v1/estimate": {
    post: op({
      operationId: "estimatePlan",
      summary: "Run the clamp model on one plan (stores nothing)",
      requestBody: { required: true, content: json(EstimateRequestSchema) },
      responses: {
        "200": {
          description: "The estimate, a torque sweep around the plan's torque and the scatter run.",
          content: json(EstimateViewSchema),
        },
        ...WRITE_REFUSALS,
      },
    }),
  },
  "/api/v1/sweep": {
    post: op({
      operationId: "sweepTorque",
      summary: "The clamp model over a torque range (stores nothing)",
      requestBody: { required: true, content: json(SweepRequestSchema) },
      responses: { "200": { description: "One point per torque step.", content: json(SweepResponseSchema) }, ...WRITE_REFUSALS },
    }),
  },
  "/api/v1/engines": {
    get: op({
      operationId: "listEngines",
      summary: `The team's engines, a page at a time (limit at most ${PAGE_LIMIT_MAX})`,
      requestParams: { query: EngineListQuerySchema },
      responses: { ...read(EngineListSchema, "One page of engines."), ...REFUSALS, "400": refusal("A query value is wrong.") },
    }),
  },
  "/api/v1/engines/{engineId}": {
    get: op({
      operationId: "getEngine",
      summary: "One engine",
      requestParams: { path: engineIdParam },
      responses: { ...read(EngineSchema, "The engine."), ...REFUSALS, "404": notFound },
    }),
  },
  "/api/v1/engines/{engineId}/plans": {
    get: op({
      operationId: "listPlans",
      summary: `The engine's seal plans (limit at most ${PAGE_LIMIT_MAX})`,
      requestParams: { path: engineIdParam, query: PageQuerySchema },
      responses: { ...read(PlanListSchema, "One page of plans."), ...REFUSALS, "400": refusal("A query value is wrong."), "404": notFound },
    }),
  },
  "/api/v1/engines/{engineId}/plans/{planId}": {
    get: op({
      operationId: "getPlan",
      summary: "One plan with its clamp-model input and estimate",
      requestParams: { path: planIdParams, query: PlanReadQuerySchema },
      responses: {
        ...read(PlanWithEstimateSchema, "The plan and its estimate."),
        ...REFUSALS,
        "400": refusal("A query value is wrong."),
        "404": notFound,
      },
    }),
  },
  "/api/v1/runs": {
    get: op({
      operationId: "listRuns",
      summary: `The team's run log, newest first, by cursor (limit at most ${PAGE_LIMIT_MAX})`,
      requestParams: { query: RunListQuerySchema },
      responses: {
        ...read(RunListSchema, "One page of runs."),
        ...REFUSALS,
        "400": refusal("A filter is wrong."),
        "404": refusal("The run log is not in this installation yet."),
      },
    }),
    post: op({
      operationId: "logRun",
      summary: "Log one dyno session or pass (builder or owner)",
      requestBody: { required: true, content: json(RunCreateSchema) },
      responses: {
        "201": { description: "The run as stored.", content: json(RunSchema) },
        ...WRITE_REFUSALS,
        "404": refusal("The engine is not this team's, or the run log is not installed yet."),
      },
    }),
  },
  "/api/v1/openapi.json": {
    get: {
      operationId: "openApiDocument",
      summary: "This document (public)",
      security: [],
      responses: { "200": { description: "OpenAPI 3.1" } },
    },
  },
};

export function apiDocument(serverUrl = "/") {
  return createDocument({
    openapi: "3.1.0",
    info: {
      title: "Sealwright API",
      version: "1.0.0",
      description:
        "Head-sealing plans, engines and the run log of one shop, as JSON in SI units (field names carry the unit). " +
        "Estimates only: the fastener and engine makers' torque, lubricant and procedure govern. See /docs/api.",
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: {
        bearer: { type: "http", scheme: "bearer", description: "A personal API token from Settings → API tokens." },
        session: { type: "apiKey", in: "cookie", name: "sw_session", description: "The browser's session; writes must carry our Origin." },
      },
    },
    paths,
  });
}
