import { readSubmission } from "../read-submission";
import { describe, expect, it } from "vitest";
import { InviteSchema, RoleSchema, TeamNameSchema, TokenCreateSchema } from "~/lib/team/forms";

// The forms are read through Conform, which reads a blank field as missing: each field's own words must still come.
const post = (fields: Record<string, string>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  return fd;
};

describe("the team and token forms", () => {
  it("word a blank field with its own message, not zod's", () => {
    expect(readSubmission(post({ name: "" }), { schema: TeamNameSchema }).error).toEqual({ name: ["Name the shop"] });
    expect(readSubmission(post({ name: "   " }), { schema: TeamNameSchema }).error).toEqual({ name: ["Name the shop"] });
    expect(readSubmission(post({ email: "", role: "" }), { schema: InviteSchema }).error).toEqual({
      email: ["Enter an e-mail address like name@shop.example"],
      role: ["Pick owner, builder or viewer"],
    });
    expect(readSubmission(post({ name: "", role: "viewer" }), { schema: TokenCreateSchema }).error).toEqual({
      name: ["Name the token (what will use it: “dyno laptop”)"],
    });
  });

  it("refuse a member id that is not a positive whole number, and a role that is not one of ours", () => {
    for (const userId of ["", "x", "1.5", "-3", "0"])
      expect(readSubmission(post({ userId, role: "viewer" }), { schema: RoleSchema }).error).toEqual({ userId: ["No such member"] });
    expect(readSubmission(post({ userId: "7", role: "king" }), { schema: RoleSchema }).error).toEqual({
      role: ["Pick owner, builder or viewer"],
    });
  });

  it("give the trimmed values of a good post", () => {
    expect(readSubmission(post({ name: "  Harrow Lane  " }), { schema: TeamNameSchema }).value).toEqual({ name: "Harrow Lane" });
    expect(readSubmission(post({ userId: "7", role: "builder" }), { schema: RoleSchema }).value).toEqual({ userId: 7, role: "builder" });
    expect(readSubmission(post({ name: "x".repeat(81), role: "viewer" }), { schema: TokenCreateSchema }).error).toEqual({
      name: ["At most 80 characters"],
    });
  });
});
