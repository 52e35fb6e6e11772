// The engine statuses (app/lib/engine/status.ts), in the order a build goes through them.
import { describe, expect, it } from "vitest";
import { ENGINE_STATUSES } from "../../../../app/lib/engine/status";

describe("ENGINE_STATUSES", () => {
  it("quoted → in build → running → retired", () => {
    expect(ENGINE_STATUSES).toEqual(["quoted", "in-build", "running", "retired"]);
  });
});
