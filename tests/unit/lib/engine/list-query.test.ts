import { describe, expect, it } from "vitest";
import { ENGINE_MAX_PAGE, readEngineListQuery } from "../../../../app/lib/engine/list-query";

type Sort = "updated" | "name" | "bore";
const isSort = (s: string): s is Sort => ["updated", "name", "bore"].includes(s);
const read = (qs: string) => readEngineListQuery(new URLSearchParams(qs), isSort, "updated");

describe("the engine table's query", () => {
  it("defaults: everything, newest first, page 1", () => {
    expect(read("")).toEqual({ q: "", status: "", sort: "updated", dir: "desc", page: 1 });
  });
  it("a column sorts ascending unless asked; an unknown column or status falls back", () => {
    expect(read("sort=bore")).toMatchObject({ sort: "bore", dir: "asc" });
    expect(read("sort=bore&dir=desc")).toMatchObject({ sort: "bore", dir: "desc" });
    expect(read("sort=drop%20table&status=sold&dir=sideways")).toMatchObject({ sort: "updated", status: "", dir: "desc" });
    expect(read("status=running").status).toBe("running");
  });
  it("pages are whole, at least 1 and at most the cap; the search is cut at 120 characters", () => {
    expect(read("page=2.7").page).toBe(2);
    expect(read("page=-3").page).toBe(1);
    expect(read("page=abc").page).toBe(1);
    expect(read("page=1e300").page).toBe(ENGINE_MAX_PAGE);
    expect(read(`q=${"x".repeat(200)}`).q).toHaveLength(120);
  });
});
