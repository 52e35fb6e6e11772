// The roles and their rank (app/lib/team/roles.ts): viewer < builder < owner.
import { describe, expect, it } from "vitest";
import { roleAtLeast, ROLES } from "../../../../app/lib/team/roles";

describe("roleAtLeast", () => {
  it("lists the roles lowest first", () => {
    expect(ROLES).toEqual(["viewer", "builder", "owner"]);
  });
  it("each role may do what it and the roles below it may, and nothing above", () => {
    for (const [i, role] of ROLES.entries()) {
      for (const [j, needed] of ROLES.entries()) expect(roleAtLeast(role, needed)).toBe(i >= j);
    }
  });
  it("a builder may build but not own; a viewer only view", () => {
    expect(roleAtLeast("builder", "builder")).toBe(true);
    expect(roleAtLeast("builder", "owner")).toBe(false);
    expect(roleAtLeast("viewer", "builder")).toBe(false);
    expect(roleAtLeast("owner", "viewer")).toBe(true);
  });
});
