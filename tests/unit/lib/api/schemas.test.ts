// The JSON API's shapes (app/lib/api/schemas.ts): paging, the sweep request's bounds, one list of statuses.
import { describe, expect, it } from "vitest";
import {
  ENGINE_STATUSES,
  ErrorBodySchema,
  PageQuerySchema,
  SWEEP_MAX_NM,
  SWEEP_MAX_POINTS,
  SweepRequestSchema,
} from "../../../../app/lib/api/schemas";
import { ENGINE_STATUSES as ENGINE_STATUSES_OF_THE_RECORD } from "../../../../app/lib/engine/status";
import { workedExampleRaw } from "../clamp/fixtures";

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => i.message);

describe("PageQuerySchema", () => {
  it("page 1 and 25 a page by default; query strings are read as numbers", () => {
    expect(PageQuerySchema.parse({})).toEqual({ page: 1, limit: 25 });
    expect(PageQuerySchema.parse({ page: "3", limit: "100" })).toEqual({ page: 3, limit: 100 });
  });
  it("limit 1 to 100, page from 1, whole numbers, nothing else in the query", () => {
    expect(messages(PageQuerySchema.safeParse({ limit: "101" }))).toEqual(["limit is at most 100"]);
    expect(messages(PageQuerySchema.safeParse({ limit: "0" }))).toEqual(["limit is at least 1"]);
    expect(messages(PageQuerySchema.safeParse({ page: "0" }))).toEqual(["page starts at 1"]);
    expect(messages(PageQuerySchema.safeParse({ page: "1.5" }))).toEqual(["page is a whole number"]);
    expect(PageQuerySchema.safeParse({ sort: "name" }).success).toBe(false);
  });
});

describe("SweepRequestSchema", () => {
  const input = workedExampleRaw();
  it("41 points by default; the end must be above the start", () => {
    expect(SweepRequestSchema.parse({ input, fromNm: 50, toNm: 200 }).points).toBe(41);
    expect(messages(SweepRequestSchema.safeParse({ input, fromNm: 200, toNm: 100 }))).toEqual(["toNm must be above fromNm"]);
  });
  it("bounds: 0 ≤ from, to ≤ 5000 N·m, 2 to 201 points", () => {
    expect(SWEEP_MAX_NM).toBe(5000);
    expect(SWEEP_MAX_POINTS).toBe(201);
    expect(SweepRequestSchema.safeParse({ input, fromNm: 0, toNm: 5000, points: 201 }).success).toBe(true);
    expect(messages(SweepRequestSchema.safeParse({ input, fromNm: 0, toNm: 5001 }))).toContain("toNm is at most 5000");
    expect(messages(SweepRequestSchema.safeParse({ input, fromNm: -1, toNm: 100 }))).toContain("fromNm cannot be negative");
    expect(messages(SweepRequestSchema.safeParse({ input, fromNm: 0, toNm: 100, points: 202 }))).toContain("points is at most 201");
    expect(messages(SweepRequestSchema.safeParse({ input, fromNm: 0, toNm: 100, points: 1 }))).toContain("points is at least 2");
  });
});

describe("one list each", () => {
  it("the API's engine statuses are the engine record's", () => {
    expect([...ENGINE_STATUSES]).toEqual([...ENGINE_STATUSES_OF_THE_RECORD]);
  });
  it("a refusal body carries its words and, on a 400, the field problems", () => {
    expect(ErrorBodySchema.parse({ error: "Bad", errors: [{ path: "fromNm", message: "x" }] }).errors).toHaveLength(1);
    expect(ErrorBodySchema.safeParse({ errors: [] }).success).toBe(false);
  });
});
