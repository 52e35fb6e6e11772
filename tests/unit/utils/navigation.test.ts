// The main navigation by role (app/utils/navigation.ts).
import { describe, expect, it } from "vitest";
import { navFor } from "../../../app/utils/navigation";

describe("navFor", () => {
  it("a viewer sees the shop's pages but not the evidence or the team", () => {
    expect(navFor("viewer").map((l) => l.label)).toEqual(["Dashboard", "Engines", "Libraries", "Settings"]);
  });
  it("a builder adds the evidence; an owner adds the team", () => {
    expect(navFor("builder").map((l) => l.to)).toEqual(["/dashboard", "/engines", "/libraries", "/evidence", "/settings"]);
    expect(navFor("owner").map((l) => l.to)).toEqual(["/dashboard", "/engines", "/libraries", "/evidence", "/team", "/settings"]);
  });
});
