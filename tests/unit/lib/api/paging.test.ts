// The API lists' paging limits (app/lib/api/paging.ts).
import { describe, expect, it } from "vitest";
import { PAGE_LIMIT_DEFAULT, PAGE_LIMIT_MAX } from "../../../../app/lib/api/paging";

describe("paging", () => {
  it("25 a page by default, at most 100", () => {
    expect(PAGE_LIMIT_DEFAULT).toBe(25);
    expect(PAGE_LIMIT_MAX).toBe(100);
  });
});
