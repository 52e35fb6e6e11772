import { beforeAll, describe, expect, it } from "vitest";
import * as dashboard from "~/routes/shop/dashboard";
import { chosenPlanVerdicts, VERDICT_CACHE } from "~/models/dashboard.server";
import { db } from "~/utils/db.server";
import { call, get, signIn, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";
import { chosenPlanVerdictsOneByOne } from "./one-by-one-verdicts";

// The dashboard puts at-risk engines first (a chosen plan that is short, or one its stud limits) and
// names the plan each activity row touched, with a link while the plan is still there.

type Loaded = {
  atRisk: { engineName: string; planName: string; status: string; headline: string; planId: number; engineId: number }[];
  events: { action: string; plan: { name: string; href: string } | null }[];
};

let builder: string;
let other: string;
beforeAll(async () => {
  builder = await signIn("builder@example.com");
  other = await signIn("other-owner@example.com");
});

const load = async (cookie: string) => (await call(dashboard.loader as Handler, get("/dashboard", cookie))).body as Loaded;

describe("dashboard", () => {
  it("lists no engine as at risk while every chosen demo plan holds", async () => {
    expect((await load(builder)).atRisk).toEqual([]);
  });

  it("puts an engine first whose chosen plan is limited by its stud, with the verdict in words", async () => {
    const six = await ownerDb()("engines").where({ name: "Number 47 crew straight six" }).first();
    const slick = await ownerDb()("seal_plans").where({ engine_id: six.id, name: "MLS, ½ studs at 85 lbf·ft on a slicker lube" }).first();
    const before = six.chosen_plan_id;
    await ownerDb()("engines").where({ id: six.id }).update({ chosen_plan_id: slick.id });
    try {
      const d = await load(builder);
      expect(d.atRisk).toHaveLength(1);
      expect(d.atRisk[0]).toMatchObject({
        engineName: "Number 47 crew straight six",
        planName: slick.name,
        status: "short",
        planId: slick.id,
        engineId: six.id,
      });
      expect(d.atRisk[0]!.headline).toMatch(/^Stud past yield/);
      // another shop never sees it
      expect((await load(other)).atRisk).toEqual([]);
    } finally {
      await ownerDb()("engines").where({ id: six.id }).update({ chosen_plan_id: before });
    }
  });

  it("names the plan an activity row touched and links to it, and drops the link once the plan is archived", async () => {
    const plan = await ownerDb()("seal_plans").orderBy("id").first();
    const team = plan.team_id;
    const [{ id }] = await ownerDb()("audit_events")
      .insert({
        team_id: team,
        action: "plan.updated",
        detail: JSON.stringify({ engineId: plan.engine_id, planId: plan.id, name: plan.name }),
        created_at: new Date().toISOString(),
      })
      .returning("id");
    try {
      const row = (await load(builder)).events.find((e) => e.action === "plan.updated");
      expect(row?.plan).toEqual({ name: plan.name, href: `/engines/${plan.engine_id}/plans/${plan.id}` });
      await ownerDb()("seal_plans").where({ id: plan.id }).update({ archived_at: new Date().toISOString() });
      const after = (await load(builder)).events.find((e) => e.action === "plan.updated");
      expect(after?.plan).toBeNull();
    } finally {
      await ownerDb()("seal_plans").where({ id: plan.id }).update({ archived_at: null });
      await ownerDb()("audit_events").where({ id }).delete();
    }
  });

  it("reads the chosen plans in a fixed handful of queries and gives the one-by-one verdicts, also from its cache", async () => {
    const who = { teamId: (await ownerDb()("teams").orderBy("id").first()).id as number, userId: 0, role: "owner" as const };
    const oneByOne = await chosenPlanVerdictsOneByOne(who, "metric");
    expect(oneByOne.length).toBeGreaterThan(1);
    let queries = 0;
    // statements that read rows: on PostgreSQL withTeam adds its own BEGIN, set_config and COMMIT
    const count = (q: { sql: string }) => void (/^\s*(begin|commit|rollback|select set_config)\b/i.test(q.sql) || queries++);
    db().on("query", count);
    try {
      VERDICT_CACHE.clear();
      expect(await chosenPlanVerdicts(who, "metric")).toEqual(oneByOne);
      expect(queries).toBe(5);
      expect(VERDICT_CACHE.size).toBe(oneByOne.length);
      expect(await chosenPlanVerdicts(who, "imperial")).toEqual(oneByOne);
    } finally {
      db().removeListener("query", count);
    }
  });
});
