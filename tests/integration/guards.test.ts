import { beforeAll, describe, expect, it } from "vitest";
import * as dashboard from "~/routes/app/dashboard";
import * as engineList from "~/routes/engines/list";
import * as evidence from "~/routes/app/evidence";
import * as layout from "~/routes/app/layout";
import * as libraries from "~/routes/libraries/list";
import * as settings from "~/routes/app/settings";
import * as team from "~/routes/app/team";
import * as teamSwitch from "~/routes/app/team-switch";
import { db } from "~/utils/db.server";
import { call, get, post, signIn, type Handler, type Outcome } from "./helpers";

type Who = "anonymous" | "viewer" | "builder" | "owner" | "otherTeam";
const WHO: Who[] = ["anonymous", "viewer", "builder", "owner", "otherTeam"];
const EMAIL: Record<Exclude<Who, "anonymous">, string> = {
  viewer: "viewer@example.com",
  builder: "builder@example.com",
  owner: "owner@example.com",
  otherTeam: "other-owner@example.com",
};

let demoTeamId = 0;
const cookies: Partial<Record<Who, string>> = {};

beforeAll(async () => {
  for (const who of WHO) if (who !== "anonymous") cookies[who] = await signIn(EMAIL[who]);
  demoTeamId = (await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
});

interface Cell {
  name: string;
  run: (cookie?: string) => Promise<Outcome>;
  // Expected status per person: 200 page, 302 redirect (to sign-in for anonymous), 403 refused.
  expect: Record<Who, number>;
}

const page = (handler: unknown, path: string) => (cookie?: string) => call(handler as Handler, get(path, cookie));

// Every cell of the matrix, for the routes that exist now.
const MATRIX: Cell[] = [
  { name: "GET app shell", run: page(layout.loader, "/dashboard"), expect: { anonymous: 302, viewer: 200, builder: 200, owner: 200, otherTeam: 200 } },
  { name: "GET /dashboard", run: page(dashboard.loader, "/dashboard"), expect: { anonymous: 302, viewer: 200, builder: 200, owner: 200, otherTeam: 200 } },
  { name: "GET /engines", run: page(engineList.loader, "/engines"), expect: { anonymous: 302, viewer: 200, builder: 200, owner: 200, otherTeam: 200 } },
  { name: "GET /libraries", run: (cookie) => call(libraries.loader as unknown as Handler, get("/libraries/fasteners", cookie), { kind: "fasteners" }), expect: { anonymous: 302, viewer: 200, builder: 200, owner: 200, otherTeam: 200 } },
  { name: "GET /evidence", run: page(evidence.loader, "/evidence"), expect: { anonymous: 302, viewer: 403, builder: 200, owner: 200, otherTeam: 200 } },
  { name: "GET /team", run: page(team.loader, "/team"), expect: { anonymous: 302, viewer: 403, builder: 403, owner: 200, otherTeam: 200 } },
  {
    name: "POST /team (rename)",
    run: (cookie) => call(team.action as Handler, post("/team", { name: "Renamed Shop" }, cookie)),
    expect: { anonymous: 302, viewer: 403, builder: 403, owner: 302, otherTeam: 302 },
  },
  { name: "GET /settings", run: page(settings.loader, "/settings"), expect: { anonymous: 302, viewer: 200, builder: 200, owner: 200, otherTeam: 200 } },
  {
    name: "POST /settings (units)",
    run: (cookie) => call(settings.action as Handler, post("/settings", { units: "metric" }, cookie)),
    expect: { anonymous: 302, viewer: 302, builder: 302, owner: 302, otherTeam: 302 },
  },
  {
    name: "POST /team/switch to the demo shop",
    run: (cookie) => call(teamSwitch.action as Handler, post("/team/switch", { teamId: String(demoTeamId), returnTo: "/dashboard" }, cookie)),
    expect: { anonymous: 302, viewer: 302, builder: 302, owner: 302, otherTeam: 403 },
  },
];

describe("role guard matrix", () => {
  for (const cell of MATRIX) {
    for (const who of WHO) {
      it(`${cell.name} as ${who} → ${cell.expect[who]}`, async () => {
        const out = await cell.run(cookies[who]);
        expect(out.status).toBe(cell.expect[who]);
        if (who === "anonymous") expect(out.location).toMatch(/^\/login\?redirectTo=/);
      });
    }
  }
});

describe("tenant isolation", () => {
  it("a rename by the other team's owner changes only their own team", async () => {
    await call(team.action as Handler, post("/team", { name: "Saltmarsh Renamed" }, cookies.otherTeam));
    const other = await db()("teams").whereNot({ id: demoTeamId }).first("name");
    expect(other.name).toBe("Saltmarsh Renamed");
    const demo = await db()("teams").where({ id: demoTeamId }).first("name");
    expect(demo.name).not.toBe("Saltmarsh Renamed");
  });

  it("the other team's member list never shows the demo shop's people", async () => {
    const out = await call(team.loader as Handler, get("/team", cookies.otherTeam));
    const emails = (out.body as { members: { email: string }[] }).members.map((m) => m.email);
    expect(emails).toEqual(["other-owner@example.com"]);
  });

  it("a viewer's rename is refused and writes nothing", async () => {
    const before = await db()("teams").where({ id: demoTeamId }).first("name");
    const out = await call(team.action as Handler, post("/team", { name: "Viewer Was Here" }, cookies.viewer));
    expect(out.status).toBe(403);
    expect(await db()("teams").where({ id: demoTeamId }).first("name")).toEqual(before);
  });
});

describe("team switching", () => {
  it("a person in two teams can switch, and pages then show the other team", async () => {
    const user = await db()("users").where({ email: "builder@example.com" }).first("id");
    const other = await db()("teams").whereNot({ id: demoTeamId }).first("id");
    await db()("memberships").insert({ user_id: user.id, team_id: other.id, role: "viewer", created_at: new Date().toISOString() });
    const cookie = await signIn("builder@example.com");
    const out = await call(teamSwitch.action as Handler, post("/team/switch", { teamId: String(other.id), returnTo: "/dashboard" }, cookie));
    expect(out.status).toBe(302);
    const shell = await call(layout.loader as Handler, get("/dashboard", cookie));
    const body = shell.body as { team: { id: number }; role: string; nav: { to: string }[] };
    expect(body.team.id).toBe(other.id);
    expect(body.role).toBe("viewer");
    expect(body.nav.map((n) => n.to)).toEqual(["/dashboard", "/engines", "/libraries", "/settings"]);
  });
});
