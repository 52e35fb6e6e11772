import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import * as teamSwitch from "~/routes/shop/team-switch";
import * as login from "~/routes/auth/login";
import { safeRedirect } from "~/utils/auth.server";
import { call, post, signIn, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";

// Defect 8 of issue 9: "/\t/evil.example" passed the filter (browsers drop the tab and go off-site),
// and "/%0A/x" (a newline once decoded) made the sign-in redirect a 500.

const BASE = "http://sealwright.invalid";

describe("safeRedirect", () => {
  const refused = [
    "//evil.example",
    "/\\evil.example",
    "/\t/evil.example",
    "/\n/evil.example",
    "/\r\n/evil.example",
    "\t//evil.example",
    "/\u0000/x",
    "/\u007f/x",
    "/\u0085/x",
    "https://evil.example/",
    "evil.example",
    "javascript:alert(1)",
    "/\\/evil.example",
    "",
  ];
  for (const to of refused) it(`refuses ${JSON.stringify(to)}`, () => expect(safeRedirect(to)).toBe("/dashboard"));

  it("keeps our own paths, query and hash", () => {
    expect(safeRedirect("/engines/3/plans?x=1#top")).toBe("/engines/3/plans?x=1#top");
    expect(safeRedirect("/settings")).toBe("/settings");
  });

  it("returns a percent-encoded path that is always a valid Location on our origin", () => {
    expect(safeRedirect("/ünits")).toBe("/%C3%BCnits");
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 40 }), (tail) => {
        const out = safeRedirect(`/${tail}`);
        expect(() => new Headers({ Location: out })).not.toThrow();
        expect(out.startsWith("/") && !out.startsWith("//")).toBe(true);
        // eslint-disable-next-line no-control-regex -- no control character may reach a Location header
        expect(/[\u0000-\u001f\u007f\\]/.test(out)).toBe(false);
        expect(new URL(out, BASE).origin).toBe(BASE);
      }),
      { numRuns: 2000 },
    );
  });
});

describe("the redirects that use it", () => {
  let builder = "";
  let teamId = 0;
  beforeAll(async () => {
    builder = await signIn("builder@example.com");
    teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  });

  it("sign-in with redirectTo=/%0A/x lands on the dashboard (was a 500)", async () => {
    const out = await call(
      login.action as Handler,
      post("/login?redirectTo=%2F%0A%2Fx", { email: "owner@example.com", password: "sealwright-demo" }),
    );
    expect(out.status).toBe(302);
    expect(out.location).toBe("/dashboard");
  });

  it("sign-in with redirectTo=/\\t/evil.example lands on the dashboard", async () => {
    const out = await call(
      login.action as Handler,
      post("/login?redirectTo=%2F%09%2Fevil.example", { email: "owner@example.com", password: "sealwright-demo" }),
    );
    expect(out.location).toBe("/dashboard");
  });

  it("the team switch's returnTo goes through the same filter", async () => {
    for (const returnTo of ["/\t/evil.example", "/\n/x", "//evil.example"]) {
      const out = await call(teamSwitch.action as Handler, post("/team/switch", { teamId: String(teamId), returnTo }, builder));
      expect(out.status).toBe(302);
      expect(out.location).toBe("/dashboard");
    }
  });

  it("the team switch reads the team id as a decimal integer only", async () => {
    const out = await call(
      teamSwitch.action as Handler,
      post("/team/switch", { teamId: `0x${teamId.toString(16)}`, returnTo: "/engines" }, builder),
    );
    expect(out.status).toBe(403);
  });
});
