import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import * as assembly from "~/routes/engines/assembly";
import * as runsPage from "~/routes/engines/runs";
import * as runsCsv from "~/routes/engines/runs-csv";
import * as evidence from "~/routes/shop/evidence";
import * as checklist from "~/routes/plans/checklist";
import * as newPlan from "~/routes/plans/new";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { studStiffnessFor } from "~/lib/plan/stretch";
import { RUN_CSV_COLUMNS, runCsvRows } from "~/lib/records/run";
import { getEngine } from "~/models/engine.server";
import { evaluateAtFiring } from "~/models/plan-at-pressure.server";
import { listPlans, planParts } from "~/models/plan.server";
import { listRuns } from "~/models/records.server";
import { call, get, post, signIn, teamWide } from "./helpers";
import { ownerDb } from "../setup/db-roles";
import { answerFields } from "./conform-answer";

// Assemblies, runs and the evidence view through their route loaders and actions, on the demo shop.

let builder = "";
let viewer = "";
let teamId = 0;
let six = 0;
let four = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  six = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 6 }).first("id")).id;
  four = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 4 }).first("id")).id;
});

const count = async (table: string) => Number((await ownerDb()(table).count({ n: "*" }).first())!.n);
const tables = async () => ({ assemblies: await count("assemblies"), runs: await count("runs"), audit: await count("audit_events") });

describe("assembly record", () => {
  it("each measured stretch implies F = k·δ with the model's stud stiffness for the plan", async () => {
    const out = await call(assembly.loader, get(`/engines/${six}/assembly`, builder), { engineId: String(six) });
    expect(out.status).toBe(200);
    const d = out.body as Awaited<ReturnType<typeof assembly.loader>>;
    const withStretch = d.assemblies.filter((a) => a.studStretch.length > 0);
    expect(withStretch.length).toBe(3);
    const engine = (await getEngine(teamWide(teamId), six))!;
    for (const a of withStretch) {
      const plan = (await listPlans(teamId, six)).find((p) => p.id === a.planId)!;
      const k = studStiffnessFor(assemblePlanInput((await planParts(teamId, engine, plan))!))!;
      expect(k).toBeGreaterThan(100_000);
      expect(a.reading.studStiffnessNPerMm).toBeCloseTo(k, 6);
      for (const s of a.reading.studs) expect(s.impliedPreloadN).toBeCloseTo(k * s.stretchMm, 6);
      // the torque's prediction is the model's preload at the torque reached (handbook friction 0.12)
      expect(a.reading.predictedPreloadN!).toBeGreaterThan(55_000);
      expect(a.reading.predictedPreloadN!).toBeLessThan(62_000);
    }
  });

  it("learns the six's friction from its three ½ stud assemblies, and refuses the four's one", async () => {
    const d = (await call(assembly.loader, get(`/engines/${six}/assembly`, builder), { engineId: String(six) })).body as Awaited<
      ReturnType<typeof assembly.loader>
    >;
    const half = d.learned.find((l) => l.fastenerName.startsWith("½-20"))!;
    expect(half.learned.ok).toBe(true);
    if (half.learned.ok) {
      expect(half.learned.count).toBe(3);
      expect(half.learned.friction).toBeGreaterThan(0.125);
      expect(half.learned.friction).toBeLessThan(0.135);
    }
    expect(half.shift!.fromMaker).toBe(true);
    expect(half.shift!.change).toBeLessThan(0);
    const d4 = (await call(assembly.loader, get(`/engines/${four}/assembly`, builder), { engineId: String(four) })).body as Awaited<
      ReturnType<typeof assembly.loader>
    >;
    expect(d4.learned.every((l) => !l.learned.ok && l.learned.count < 3)).toBe(true);
  });

  it("offers the learned friction to a new plan, labelled with its count, without changing the plan's friction", async () => {
    const d = (await call(newPlan.loader, get(`/engines/${six}/plans/new`, builder), { engineId: String(six) })).body as Awaited<
      ReturnType<typeof newPlan.loader>
    >;
    expect(d.learned).toHaveLength(1);
    expect(d.learned[0]!.count).toBe(3);
    expect(d.values.threadFriction).toBe("0.12");
  });

  const plansOfFour = async () => (await listPlans(teamId, four))[0]!;
  const good = async () => ({
    planId: String((await plansOfFour()).id),
    assembledOn: "2026-11-30",
    assembledBy: "Teo Vastrick",
    lubricant: "moly",
    measuredProtrusionMm: "0.09",
    gasketCompressedMm: "",
    notes: "",
    "stage-0-reached": "61",
    "stage-1-reached": "122",
    "stage-2-reached": "169.5",
    "stretch-0": "0.36",
  });

  it.each([
    [{ assembledBy: "" }, "assembledBy"],
    [{ assembledOn: "30/11/2026" }, "assembledOn"],
    [{ planId: "999999" }, "planId"],
    [{ "stage-1-reached": "lots" }, "stage-1-reached"],
    [{ "stretch-0": "5" }, "stretch-0"],
    [{ "stage-0-reached": "", "stage-1-reached": "", "stage-2-reached": "" }, "stage-0-reached"],
  ])("refuses %j with 400 on the field, and writes nothing", async (change, field) => {
    const before = await tables();
    const out = await call(assembly.action, post(`/engines/${four}/assembly`, { ...(await good()), ...change }, builder), {
      engineId: String(four),
    });
    expect(out.status).toBe(400);
    expect(answerFields(out.body)).toContain(field);
    expect(await tables()).toEqual(before);
  });

  it("records a good assembly, with its audit row; a viewer may not", async () => {
    const before = await tables();
    expect((await call(assembly.action, post(`/engines/${four}/assembly`, await good(), viewer), { engineId: String(four) })).status).toBe(
      403,
    );
    const out = await call(assembly.action, post(`/engines/${four}/assembly`, await good(), builder), { engineId: String(four) });
    expect(out.status).toBe(302);
    expect(await tables()).toEqual({ ...before, assemblies: before.assemblies + 1, audit: before.audit + 1 });
    const row = await ownerDb()("assemblies").orderBy("id", "desc").first();
    expect(row.final_torque_nm).toBe(169.5);
    expect(JSON.parse(row.stud_stretch)).toEqual([{ label: "A1", stretchMm: 0.36 }]);
  });

  it("the checklist numbers every stud once per bank and lists the plan's stages", async () => {
    const plan = await plansOfFour();
    const out = await call(checklist.loader, get(`/engines/${four}/plans/${plan.id}/checklist`, viewer), {
      engineId: String(four),
      planId: String(plan.id),
    });
    const d = out.body as Awaited<ReturnType<typeof checklist.loader>>;
    expect(d.layout.studs).toHaveLength(14);
    expect(d.layout.studs.map((s) => s.order).sort((a, b) => a - b)).toEqual(Array.from({ length: 14 }, (_, i) => i + 1));
    expect(d.plan.stagesNm).toEqual([61, 122, 169.5]);
    expect(d.fastener!.makerTorqueNm).toBeCloseTo(169.5, 0);
  });
});

describe("run log", () => {
  const good = {
    ranOn: "2026-11-29",
    kind: "dyno",
    manifoldPressureKpa: "240",
    fuel: "Pump fuel + methanol injection",
    peakCylinderPressureMpa: "",
    outcome: "held",
    cylindersAffected: "",
    notes: 'Pull 3, "lean" on 4, then fine',
    teardownFindings: "",
  };

  it.each([
    [{ ranOn: "yesterday" }, "ranOn"],
    [{ kind: "track" }, "kind"],
    [{ outcome: "lifted-head" }, "cylindersAffected"],
    [{ cylindersAffected: "9", outcome: "seeping" }, "cylindersAffected"],
    [{ manifoldPressureKpa: "" }, "manifoldPressureKpa"],
  ])("refuses %j with 400 on the field, and writes nothing", async (change, field) => {
    const before = await tables();
    const out = await call(runsPage.action, post(`/engines/${six}/runs`, { ...good, ...change }, builder), { engineId: String(six) });
    expect(out.status).toBe(400);
    expect(answerFields(out.body)).toContain(field);
    expect(await tables()).toEqual(before);
  });

  it("logs a run without a measured peak: the model estimates it at that manifold pressure, marked estimated", async () => {
    const out = await call(runsPage.action, post(`/engines/${six}/runs`, good, builder), { engineId: String(six) });
    expect(out.status).toBe(302);
    const row = await ownerDb()("runs").orderBy("id", "desc").first();
    expect(row.peak_pressure_source).toBe("estimated");
    const engine = (await getEngine(teamWide(teamId), six))!;
    // the plan on the engine that day is its latest assembly's (the ½ studs)
    const plan = (await listPlans(teamId, six)).find((p) => p.id === row.plan_id)!;
    expect(plan.name).toBe("MLS, ½ studs at the maker's 85 lbf·ft");
    const at = await evaluateAtFiring(teamId, engine, plan, { manifoldKpa: 240 });
    expect(at.ok && row.peak_cylinder_pressure_mpa).toBeCloseTo(at.ok ? at.estimate.firing.peakPressureMpa : NaN, 9);
    expect(row.peak_cylinder_pressure_mpa).toBeGreaterThan(9.5);
    expect(row.peak_cylinder_pressure_mpa).toBeLessThan(12.5);
  });

  it("the CSV export parses back to the same rows, quotes, commas and line breaks intact", async () => {
    await call(
      runsPage.action,
      post(
        `/engines/${six}/runs`,
        {
          ...good,
          ranOn: "2026-11-30",
          outcome: "seeping",
          cylindersAffected: "2 3",
          notes: "coolant, a little\nat the 2–3 bridge",
          teardownFindings: 'said "damp"',
        },
        builder,
      ),
      { engineId: String(six) },
    );
    const out = await call(runsCsv.loader, get(`/engines/${six}/runs.csv`, builder), { engineId: String(six) });
    expect(out.status).toBe(200);
    const rows = parse(out.body as string) as string[][];
    expect(rows[0]).toEqual([...RUN_CSV_COLUMNS]);
    const runs = await listRuns(teamId, six);
    expect(rows.slice(1)).toEqual(runCsvRows(runs));
    expect(rows.length - 1).toBe(runs.length);
    expect(rows.some((r) => r[8] === "coolant, a little\nat the 2–3 bridge")).toBe(true);
    // filters apply to the export as to the table
    const failed = parse(
      (await call(runsCsv.loader, get(`/engines/${six}/runs.csv?outcome=failed`, builder), { engineId: String(six) })).body as string,
    ) as string[][];
    expect(
      failed
        .slice(1)
        .map((r) => r[6])
        .sort(),
    ).toEqual(["blown-gasket", "seeping"]);
  });

  it("another team's engine has no run log", async () => {
    const other = await signIn("other-owner@example.com");
    expect((await call(runsPage.loader, get(`/engines/${six}/runs`, other), { engineId: String(six) })).status).toBe(404);
    expect((await call(runsCsv.loader, get(`/engines/${six}/runs.csv`, other), { engineId: String(six) })).status).toBe(404);
  });
});

describe("evidence", () => {
  it("plots the demo history with the blown gasket below margin 1 and says how few the points are", async () => {
    const out = await call(evidence.loader, get("/evidence", builder));
    const d = out.body as Awaited<ReturnType<typeof evidence.loader>>;
    expect(d.summary.points).toBeGreaterThanOrEqual(8);
    expect(d.summary.sealFailures).toBeGreaterThanOrEqual(1);
    const blown = d.points.find((p) => p.outcome === "blown-gasket")!;
    expect(blown.margin).toBeLessThan(1);
    expect(blown.margin).toBeGreaterThan(0.5);
    expect(d.summary.honesty).toMatch(/too few|rests on very little/);
    // every plotted margin is the clamp model's at that run's pressure
    const engine = (await getEngine(teamWide(teamId), six))!;
    const plan = (await listPlans(teamId, six)).find((p) => p.name === "MLS, the old 7/16 studs on engine oil")!;
    const at = await evaluateAtFiring(teamId, engine, plan, { peakMpa: blown.peakMpa });
    expect(at.ok && blown.margin).toBeCloseTo(at.ok ? at.estimate.weakestMargin : NaN, 9);
    const held = d.points.filter((p) => p.outcome === "held");
    expect(Math.min(...held.map((p) => p.margin))).toBeGreaterThan(blown.margin);
  });

  it("filters by fuel and gasket type", async () => {
    const none = (await call(evidence.loader, get("/evidence?fuel=Diesel", builder))).body as Awaited<ReturnType<typeof evidence.loader>>;
    expect(none.summary.points).toBe(0);
    expect(none.summary.honesty).toMatch(/No runs/);
    const mls = (await call(evidence.loader, get("/evidence?gasketType=mls", builder))).body as Awaited<ReturnType<typeof evidence.loader>>;
    expect(mls.points.every((p) => p.gasketType === "mls")).toBe(true);
  });
});
