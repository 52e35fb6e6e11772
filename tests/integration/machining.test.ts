import { unit } from "mathjs";
import { beforeAll, describe, expect, it } from "vitest";
import * as assembly from "~/routes/engines/assembly";
import * as machining from "~/routes/engines/machining";
import * as runsPage from "~/routes/engines/runs";
import { evaluatePlan, parsePlan } from "~/lib/clamp";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import { call, get, post, signIn, teamWide } from "./helpers";
import { ownerDb } from "../setup/db-roles";
import { answerError, answerFields, answerValues } from "./conform-answer";

// The machining and measurement record through its route, on the demo shop's four (wet sleeves planned
// 0.10 mm proud, copper + wire: wire 0.11 mm over a 0.05 mm receiver groove); and the record forms in
// the person's units.

type Page = Awaited<ReturnType<typeof machining.loader>>;
let builder = "";
let viewer = "";
let teamId = 0;
let four = 0;
let builderId = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  four = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 4 }).first("id")).id;
  builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
});

const count = async (table: string) => Number((await ownerDb()(table).count({ n: "*" }).first())!.n);
const tables = async () => ({ machining: await count("machining_records"), audit: await count("audit_events") });
const chosenPlan = async () => (await listPlans(teamId, four)).find((p) => p.name === "Copper + wire at the maker's 125 lbf·ft")!;
const page = async (cookie = builder) =>
  (await call(machining.loader, get(`/engines/${four}/machining`, cookie), { engineId: String(four) })).body as Page;
const sheet = async () => ({
  planId: String((await chosenPlan()).id),
  measuredOn: "2026-11-28",
  measuredBy: "Teo Vastrick",
  notes: "",
});
const record = async (fields: Record<string, string>, cookie = builder) =>
  call(machining.action, post(`/engines/${four}/machining`, { ...(await sheet()), ...fields }, cookie), { engineId: String(four) });
/** The newest sheet on the page (the one just recorded, dated after the demo's). */
const newest = async () => (await page()).sheets[0]!;

describe("machining record", () => {
  it("shows the demo's sheet: bore 1's sleeve under the deck reads thin against the plan's holds", async () => {
    const d = await page();
    expect(d.sheets).toHaveLength(1);
    const e = d.sheets[0]!.estimate;
    expect(e.ok).toBe(true);
    if (!e.ok) return;
    expect(e.compare.planned.status).toBe("holds");
    expect(e.compare.measured.status).toBe("thin");
    expect(e.compare.measured.cylinder).toBe(1);
    expect(e.compare.cylinders[0]!.measured).toBeGreaterThan(1);
    expect(e.compare.cylinders[0]!.measured).toBeLessThan(1.5);
    // flatness and finish are recorded only; the protrusion and the gasket enter the estimate
    expect(e.uses.filter((u) => !u.enters).map((u) => u.name)).toEqual([
      "headFlatnessMm",
      "deckFlatnessMm",
      "headFinishUm",
      "deckFinishUm",
    ]);
  });

  it.each([
    [{ measuredBy: "" }, "measuredBy"],
    [{ measuredOn: "28/11/2026" }, "measuredOn"],
    [{ planId: "999999" }, "planId"],
    [{ "protrusion-0": "5" }, "protrusion-0"],
    [{ headFlatnessMm: "flat" }, "headFlatnessMm"],
    [{ gasketCompressedMm: "0" }, "gasketCompressedMm"],
    // nothing measured at all
    [{ "protrusion-1": "" }, "headFlatnessMm"],
  ])("refuses %j with 400 on the field, and writes nothing", async (change, field) => {
    const before = await tables();
    const out = await record({ "protrusion-1": "0.1", ...change });
    expect(out.status).toBe(400);
    expect(answerFields(out.body)).toContain(field);
    expect(await tables()).toEqual(before);
  });

  it("another team's engine is not found, to read or to write", async () => {
    const other = await signIn("other-owner@example.com");
    expect((await call(machining.loader, get(`/engines/${four}/machining`, other), { engineId: String(four) })).status).toBe(404);
    const before = await tables();
    expect((await record({ headFlatnessMm: "0.02" }, other)).status).toBe(404);
    expect(await tables()).toEqual(before);
  });

  it("a viewer the engine is shared with reads the sheet but may not write one", async () => {
    const d = await page(viewer);
    expect(d.sheets).toHaveLength(1);
    expect(d.canEdit).toBe(false);
    const before = await tables();
    expect((await record({ headFlatnessMm: "0.02" }, viewer)).status).toBe(403);
    expect(await tables()).toEqual(before);
  });

  // Why the margin moves as it does (app/lib/clamp): the effective gap g = sleeve protrusion + the wire's
  // projection over its groove (seal.ts effectiveGapMm) is how far the seal line closes before the gasket
  // body takes any clamp (model.ts: the body path engages at g). A sleeve standing lower shortens that
  // head start, so the body picks up its share of the same clamp sooner and the seal line carries less:
  // the seating and fired seal-line loads, and with them the seal margin, fall. Prouder than planned,
  // the copper ring already sits at its yield limit (lineLimitN), so more gap gives the seal line nothing.
  it("a sleeve measured lower than planned lowers that bore's seal margin, and only that bore's", async () => {
    const out = await record({ "protrusion-1": "-0.04" });
    expect(out.status).toBe(302);
    const e = (await newest()).estimate;
    if (!e.ok) throw new Error(e.problems.join(" "));
    const [c1, c2, c3, c4] = e.compare.cylinders;
    // g = −0.04 + (0.11 − 0.05) = 0.02 mm on bore 2, against the plan's 0.16 mm
    expect(c2!.measured).toBeLessThan(c2!.planned * 0.7);
    for (const c of [c1!, c3!, c4!]) expect(c.measured).toBeCloseTo(c.planned, 9);
    // the same figure through the clamp core directly: the plan's parts with bore 2's protrusion
    const engine = (await getEngine(teamWide(teamId), four))!;
    const plan = await chosenPlan();
    const parts = (await planParts(teamId, engine, plan))!;
    const parsed = parsePlan(assemblePlanInput({ ...parts, plan: { ...plan, sleeveProtrusionMm: -0.04 } }));
    if (!parsed.ok) throw new Error("plan did not parse");
    expect(c2!.measured).toBeCloseTo(evaluatePlan(parsed.plan).cylinders[1]!.sealMargin, 9);
  });

  it("a sleeve prouder than planned leaves the margin at the copper ring's limit", async () => {
    expect(
      (
        await record({
          measuredOn: "2026-11-29",
          "protrusion-0": "0.3",
          "protrusion-1": "0.3",
          "protrusion-2": "0.3",
          "protrusion-3": "0.3",
        })
      ).status,
    ).toBe(302);
    const e = (await newest()).estimate;
    if (!e.ok) throw new Error(e.problems.join(" "));
    for (const c of e.compare.cylinders) expect(c.measured).toBeCloseTo(c.planned, 9);
    expect(e.compare.measured.status).toBe("holds");
  });

  it("a thinner gasket as compressed and a cut head shorten the grip: the estimate changes though no protrusion was measured", async () => {
    expect((await record({ measuredOn: "2026-11-30", gasketCompressedMm: "0.9", headRemovedMm: "0.5" })).status).toBe(302);
    const s = await newest();
    expect(s.gasketCompressedMm).toBe(0.9);
    const e = s.estimate;
    if (!e.ok) throw new Error(e.problems.join(" "));
    expect(e.planned.gasketMm).toBe(1.1);
    const moved = e.compare.cylinders.map((c) => Math.abs(c.measured - c.planned));
    expect(Math.max(...moved)).toBeGreaterThan(0);
  });
});

describe("record forms in the person's units", () => {
  const asImperial = async (run: () => Promise<void>) => {
    await ownerDb()("users").where({ id: builderId }).update({ units: "imperial" });
    try {
      await run();
    } finally {
      await ownerDb()("users").where({ id: builderId }).update({ units: "metric" });
    }
  };
  // independent reference for the conversions: mathjs's unit system, agreeing to a part in 10⁹ (its psi
  // is built from its own pound and gravity, a few parts in 10¹¹ off NIST's)
  const mm = (thou: number) => unit(thou, "mil").toNumber("mm");
  const near = (ours: number, theirs: number) => expect(Math.abs(ours / theirs - 1)).toBeLessThan(1e-9);

  it("stores an imperial machining sheet in SI, and labels the fields in thou and µin", async () => {
    await asImperial(async () => {
      const d = await page();
      expect(d.units).toBe("imperial");
      const out = await record({ measuredOn: "2026-12-01", "protrusion-0": "4.7", gasketCompressedMm: "42.1", headFinishUm: "32" });
      expect(out.status).toBe(302);
      const row = await ownerDb()("machining_records").orderBy("id", "desc").first();
      near(JSON.parse(row.sleeve_protrusion_mm)[0], mm(4.7));
      near(row.gasket_compressed_mm, mm(42.1));
      near(row.head_finish_um, unit(32e-6, "inch").toNumber("um"));
    });
  });

  it("a refused imperial sheet echoes what was typed and words the bounds in thou", async () => {
    await asImperial(async () => {
      const before = await tables();
      const out = await record({ "protrusion-0": "4.7", "protrusion-1": "60" });
      expect(out.status).toBe(400);
      expect(answerError(out.body, "protrusion-1")).toBe("Protrusion of bore 2 must be between -19.7 thou and 39.4 thou");
      expect(answerValues(out.body)["protrusion-0"]).toBe("4.7");
      expect(answerValues(out.body)["protrusion-1"]).toBe("60");
      expect(await tables()).toEqual(before);
    });
  });

  it("stores an imperial assembly's torque and stretch in N·m and mm", async () => {
    await asImperial(async () => {
      const plan = await chosenPlan();
      const out = await call(
        assembly.action,
        post(
          `/engines/${four}/assembly`,
          {
            planId: String(plan.id),
            assembledOn: "2026-12-01",
            assembledBy: "Teo",
            lubricant: "",
            notes: "",
            "stage-0-reached": "90",
            "stretch-0": "14.2",
          },
          builder,
        ),
        { engineId: String(four) },
      );
      expect(out.status).toBe(302);
      const row = await ownerDb()("assemblies").orderBy("id", "desc").first();
      near(JSON.parse(row.stages_done)[0].reachedNm, unit(90, "lbf ft").toNumber("N m"));
      near(JSON.parse(row.stud_stretch)[0].stretchMm, mm(14.2));
    });
  });

  it("stores an imperial run's boost and peak pressure as kPa absolute and MPa; a refused run echoes it", async () => {
    await asImperial(async () => {
      const run = {
        ranOn: "2026-12-01",
        kind: "dyno",
        fuel: "E85",
        outcome: "held",
        cylindersAffected: "",
        notes: "",
        teardownFindings: "",
      };
      const out = await call(
        runsPage.action,
        post(`/engines/${four}/runs`, { ...run, manifoldPressureKpa: "20 psi g", peakCylinderPressureMpa: "2000" }, builder),
        { engineId: String(four) },
      );
      expect(out.status).toBe(302);
      const row = await ownerDb()("runs").orderBy("id", "desc").first();
      // gauge boost plus the standard atmosphere (ISO 2533, 101.325 kPa)
      near(row.manifold_pressure_kpa, unit(20, "psi").toNumber("kPa") + 101.325);
      near(row.peak_cylinder_pressure_mpa, unit(2000, "psi").toNumber("MPa"));
      const refused = await call(
        runsPage.action,
        post(`/engines/${four}/runs`, { ...run, manifoldPressureKpa: "45", peakCylinderPressureMpa: "20000" }, builder),
        { engineId: String(four) },
      );
      expect(refused.status).toBe(400);
      expect(answerError(refused.body, "peakCylinderPressureMpa")).toBe("Peak cylinder pressure must be between 145 psi and 14,504 psi");
      expect(answerValues(refused.body).manifoldPressureKpa).toBe("45");
    });
  });
});
