// The OpenAPI document (app/lib/api/openapi.ts), built from the zod schemas. The route list check is in
// tests/integration/api-openapi.test.ts; this file checks the document's own shape.
import { describe, expect, it } from "vitest";
import { API_V1_PATHS, apiDocument } from "../../../../app/lib/api/openapi";

describe("apiDocument", () => {
  const doc = apiDocument("https://shop.example/");
  it("is OpenAPI 3.1 with one server, the bearer and session schemes, and says the estimates are estimates", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.servers).toEqual([{ url: "https://shop.example/" }]);
    expect(Object.keys(doc.components?.securitySchemes ?? {}).sort()).toEqual(["bearer", "session"]);
    expect(doc.info.description).toContain("Estimates only");
  });
  it("documents every path of API_V1_PATHS, with the router's :param as {param}", () => {
    expect(Object.keys(doc.paths ?? {}).sort()).toEqual(Object.values(API_V1_PATHS).sort());
    for (const [router, open] of Object.entries(API_V1_PATHS)) expect(open).toBe(router.replace(/:(\w+)/g, "{$1}"));
  });
  it("every operation has an id, and the ids are distinct", () => {
    const ids: string[] = [];
    for (const item of Object.values(doc.paths ?? {}))
      for (const [method, op] of Object.entries(item as Record<string, { operationId?: string }>))
        if (["get", "post", "put", "patch", "delete"].includes(method)) ids.push(op.operationId!);
    expect(ids.every((x) => typeof x === "string" && x.length > 0)).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toContain("estimatePlan");
  });
});
