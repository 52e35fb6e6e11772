import { beforeAll, describe, expect, it } from "vitest";
import * as layout from "~/routes/shop/layout";
import * as team from "~/routes/shop/team";
import * as teamSwitch from "~/routes/shop/team-switch";
import { call, EMAIL, get, post, signIn, WHO, type Handler, type Who } from "./helpers";
import { ownerDb } from "../setup/db-roles";

let demoTeamId = 0;
const cookies: Partial<Record<Who, string>> = {};

beforeAll(async () => {
  for (const who of WHO) if (who !== "anonymous") cookies[who] = await signIn(EMAIL[who]);
  demoTeamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
});

// The role matrix (every route × method × person) is generated from app/routes.ts in
// route-matrix.test.ts; these are the isolation and switching stories in detail.

describe("tenant isolation", () => {
  it("a rename by the other team's owner changes only their own team", async () => {
    await call(team.action as Handler, post("/team", { name: "Saltmarsh Renamed" }, cookies.otherTeam));
    const other = await ownerDb()("teams").whereNot({ id: demoTeamId }).first("name");
    expect(other.name).toBe("Saltmarsh Renamed");
    const demo = await ownerDb()("teams").where({ id: demoTeamId }).first("name");
    expect(demo.name).not.toBe("Saltmarsh Renamed");
  });

  it("the other team's member list never shows the demo shop's people", async () => {
    const out = await call(team.loader as Handler, get("/team", cookies.otherTeam));
    const emails = (out.body as { members: { email: string }[] }).members.map((m) => m.email);
    expect(emails).toEqual(["other-owner@example.com"]);
  });

  it("a viewer's rename is refused and writes nothing", async () => {
    const before = await ownerDb()("teams").where({ id: demoTeamId }).first("name");
    const out = await call(team.action as Handler, post("/team", { name: "Viewer Was Here" }, cookies.viewer));
    expect(out.status).toBe(403);
    expect(await ownerDb()("teams").where({ id: demoTeamId }).first("name")).toEqual(before);
  });
});

describe("team switching", () => {
  it("a person in two teams can switch, and pages then show the other team", async () => {
    const user = await ownerDb()("users").where({ email: "builder@example.com" }).first("id");
    const other = await ownerDb()("teams").whereNot({ id: demoTeamId }).first("id");
    await ownerDb()("memberships").insert({ user_id: user.id, team_id: other.id, role: "viewer", created_at: new Date().toISOString() });
    const cookie = await signIn("builder@example.com");
    const out = await call(
      teamSwitch.action as Handler,
      post("/team/switch", { teamId: String(other.id), returnTo: "/dashboard" }, cookie),
    );
    expect(out.status).toBe(302);
    const shell = await call(layout.loader as Handler, get("/dashboard", cookie));
    const body = shell.body as { team: { id: number }; role: string; nav: { to: string }[] };
    expect(body.team.id).toBe(other.id);
    expect(body.role).toBe("viewer");
    expect(body.nav.map((n) => n.to)).toEqual(["/dashboard", "/engines", "/libraries", "/settings"]);
  });
});
