// The planner as a builder meets it (issue 8): a new fastener's figures, plans by stretch, numbers as
// typed, gaskets by bore, duplicating an engine and copying a plan — through the real loaders and actions.
import { beforeAll, describe, expect, it } from "vitest";
import { parsePlan, prepare } from "~/lib/clamp";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import * as duplicate from "~/routes/engines/duplicate";
import * as newEngine from "~/routes/engines/new";
import * as copy from "~/routes/plans/copy";
import * as editor from "~/routes/plans/editor";
import * as newPlan from "~/routes/plans/new";
import { db } from "~/utils/db.server";
import { call, get, post, signIn, type Handler, teamWide } from "./helpers";

const LBF_FT = 1.3558179; // N·m per lbf·ft, NIST SP 811

let builder = "";
let viewer = "";
let other = "";
let teamId = 0;
let otherTeamId = 0;
let four = 0; // Fenwick-Oddy 2.0 four, 86 mm bore
let six = 0; // the straight six, 86 mm bore too
let v8 = 0; // 106 mm bore
let planId = 0;
const fastener: Record<string, number> = {};

const planRow = (id: number) => db()("seal_plans").where({ id }).first();
const plansOn = async (engineId: number) => Number((await db()("seal_plans").where({ engine_id: engineId }).count({ n: "*" }))[0]!.n);

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  other = await signIn("other-owner@example.com");
  teamId = (await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  otherTeamId = (await db()("teams").whereNot({ id: teamId }).first("id")).id;
  const engines = await db()("engines").where({ team_id: teamId }).select("id", "cylinders");
  four = engines.find((e) => e.cylinders === 4)!.id;
  six = engines.find((e) => e.cylinders === 6)!.id;
  v8 = engines.find((e) => e.cylinders === 8)!.id;
  planId = (await listPlans(teamId, four))[0]!.id;
  for (const f of await db()("fasteners").where({ team_id: teamId }).select("id", "name")) fastener[f.name] = f.id;
});

type Loaded = { values: Record<string, string>; stretch: { mode: string; stretchMm: number; preloadN: number; torqueNm: number } | null };

async function editorValues(id = planId, engineId = four): Promise<Record<string, string>> {
  const out = await call(editor.loader as Handler, get(`/engines/${engineId}/plans/${id}`, builder), {
    engineId: String(engineId),
    planId: String(id),
  });
  return (out.body as Loaded).values;
}

/** The values a Conform reply shows (blank fields left out), and the answer's note. */
function answered(body: unknown): { values: Record<string, string>; note: string | null } {
  const b = body as { result: { initialValue: Record<string, string> }; note: string | null };
  return { values: b.result.initialValue, note: b.note };
}

const editorPost = (fields: Record<string, string>, cookie = builder, id = planId) =>
  call(editor.action as Handler, post(`/engines/${four}/plans/${id}`, fields, cookie), { engineId: String(four), planId: String(id) });

describe("choosing another fastener", () => {
  const M12 = "M12×1.5 head stud, reduced shank";

  it("without JavaScript: the post comes back with the new maker's figures and the line that says so, and saves nothing", async () => {
    const before = await planRow(planId);
    const shown = await editorValues();
    expect(shown.figuresFastenerId).toBe(shown.fastenerId);
    const out = await editorPost({ ...shown, intent: "save", fastenerId: String(fastener[M12]) });
    expect(out.status).toBe(200);
    const body = answered(out.body);
    // the M12 maker's sheet (demo): 40, 90, then 150 N·m with moly assembly paste; the library's friction 0.11 / 0.12
    expect(body.values).toMatchObject({
      torque: "150",
      stages: "40, 90, 150",
      lubricant: "Moly assembly paste",
      threadFriction: "0.11",
      bearingFriction: "0.12",
      targetStretch: "0.15",
    });
    expect(body.note).toBe(`Torque, stages and lubricant now follow the maker's figures for ${M12}; change them if you mean to.`);
    expect(await planRow(planId)).toEqual(before);

    // the builder has seen them: the next save stores them
    const saved = await editorPost({ ...body.values, intent: "save" });
    expect(saved.status).toBe(302);
    const row = await planRow(planId);
    expect(row).toMatchObject({
      fastener_id: fastener[M12],
      torque_nm: 150,
      lubricant: "Moly assembly paste",
      thread_friction: 0.11,
      bearing_friction: 0.12,
    });
    expect(JSON.parse(row.stages)).toEqual([40, 90, 150]);
  });

  it("figures the builder typed with the new fastener stand (an override), and a Recalculate shows the followed estimate", async () => {
    const shown = await editorValues();
    const half = "½-20 chromoly head stud, reduced shank";
    const overridden = await editorPost({
      ...shown,
      intent: "save",
      fastenerId: String(fastener[half]),
      torque: "140",
      stages: "60, 100, 140",
    });
    expect(overridden.status).toBe(302);
    expect(await planRow(planId)).toMatchObject({ fastener_id: fastener[half], torque_nm: 140 });

    const again = await editorValues();
    const recalc = await editorPost({ ...again, intent: "estimate", fastenerId: String(fastener[M12]) });
    expect(recalc.status).toBe(200);
    const body = { ...answered(recalc.body), preview: (recalc.body as { preview: { torqueNm: number } | null }).preview };
    expect(body.note).toMatch(/follow the maker's figures for M12/);
    expect(body.values.torque).toBe("150");
    // the estimate shown is for the followed figures; the stretch-gauge plan follows the M12 maker's 0.15 mm
    expect(body.preview).not.toBeNull();
    expect(await planRow(planId)).toMatchObject({ torque_nm: 140 });
  });

  it("on a new plan, too: the changed fastener's figures come back before anything is created", async () => {
    const params = { engineId: String(four) };
    const loaded = (await call(newPlan.loader as Handler, get(`/engines/${four}/plans/new`, builder), params)).body as Loaded;
    const count = await plansOn(four);
    const seven = "7/16-20 chromoly head stud, full shank";
    const out = await call(
      newPlan.action as Handler,
      post(
        `/engines/${four}/plans/new`,
        { ...loaded.values, name: "Seven-sixteenths", intent: "create", fastenerId: String(fastener[seven]) },
        builder,
      ),
      params,
    );
    expect(out.status).toBe(200);
    const body = answered(out.body);
    // 35, 65, then 85 lbf·ft, shown to a metric builder at whole N·m
    expect(body.values).toMatchObject({
      torque: "115",
      stages: "47, 88, 115",
      lubricant: "Clean engine oil on threads and washer face",
      threadFriction: "0.15",
      bearingFriction: "0.16",
    });
    expect(await plansOn(four)).toBe(count);
    const made = await call(
      newPlan.action as Handler,
      post(`/engines/${four}/plans/new`, { ...body.values, intent: "create" }, builder),
      params,
    );
    expect(made.status).toBe(302);
    const row = await planRow(Number(made.location!.split("/").pop()));
    expect(row).toMatchObject({ name: "Seven-sixteenths", fastener_id: fastener[seven], torque_nm: 115, thread_friction: 0.15 });
  });
});

describe("planning by stretch", () => {
  async function studStiffness(id: number) {
    const engine = (await getEngine(teamWide(teamId), four))!;
    const plan = (await listPlans(teamId, four)).find((p) => p.id === id)!;
    const parts = (await planParts(teamId, engine, { ...plan, method: "torque-estimated-friction" }))!;
    const parsed = parsePlan(assemblePlanInput(parts));
    if (!parsed.ok) throw new Error("plan does not parse");
    return prepare(parsed.plan).stud.stiffnessNPerMm;
  }

  it("stores the target stretch and estimates the preload that stretch gives through the stud's stiffness", async () => {
    const shown = await editorValues();
    const saved = await editorPost({ ...shown, intent: "save", method: "stretch-measured", targetStretch: "0,2" });
    expect(saved.status).toBe(302);
    expect((await planRow(planId)).target_stretch_mm).toBeCloseTo(0.2, 12);
    const k = await studStiffness(planId);
    const out = await call(editor.loader as Handler, get(`/engines/${four}/plans/${planId}`, builder), {
      engineId: String(four),
      planId: String(planId),
    });
    const body = out.body as Loaded & {
      result: { ok: true; view: { torqueNm: number; estimate: { tightening: { preload: { nominalN: number } } } } };
    };
    expect(body.result.view.estimate.tightening.preload.nominalN).toBeCloseTo(0.2 * k, 6);
    expect(body.stretch).toMatchObject({ mode: "stretch" });
    expect(body.stretch!.stretchMm).toBeCloseTo(0.2, 9);
    expect(body.stretch!.torqueNm).toBeCloseTo(body.result.view.torqueNm, 9);
    expect(body.values.targetStretch).toBe("0.2");
  });

  it("a suggested torque applied to a stretch plan becomes the stretch it gives", async () => {
    const k = await studStiffness(planId);
    const out = await editorPost({ intent: "apply-torque", torqueNm: "120" });
    expect(out.status).toBe(302);
    const row = await planRow(planId);
    expect(row.torque_nm).toBe(120);
    const byTorque = await call(editor.loader as Handler, get(`/engines/${four}/plans/${planId}`, builder), {
      engineId: String(four),
      planId: String(planId),
    });
    const preloadN = (byTorque.body as { stretch: { preloadN: number } }).stretch.preloadN;
    expect(row.target_stretch_mm * k).toBeCloseTo(preloadN, 0);
    expect(JSON.parse(row.stages)[JSON.parse(row.stages).length - 1]).toBe(120);
  });

  it("by torque, the page says the stretch that torque gives", async () => {
    const shown = await editorValues();
    await editorPost({ ...shown, intent: "save", method: "torque-estimated-friction", targetStretch: "0.2" });
    expect((await planRow(planId)).target_stretch_mm).toBeNull();
    const k = await studStiffness(planId);
    const loaded = (
      await call(editor.loader as Handler, get(`/engines/${four}/plans/${planId}`, builder), {
        engineId: String(four),
        planId: String(planId),
      })
    ).body as Loaded;
    expect(loaded.stretch!.mode).toBe("torque");
    expect(loaded.stretch!.stretchMm * k).toBeCloseTo(loaded.stretch!.preloadN, 6);
    expect(loaded.stretch!.torqueNm).toBe((await planRow(planId)).torque_nm);
  });
});

describe("numbers as typed", () => {
  it("decimal commas in friction, margin and stages (semicolons between them)", async () => {
    const shown = await editorValues();
    const out = await editorPost({
      ...shown,
      intent: "save",
      threadFriction: "0,13",
      bearingFriction: "0,14",
      targetMargin: "1,4",
      torque: "156",
      stages: "54,5; 108; 156",
    });
    expect(out.status).toBe(302);
    const row = await planRow(planId);
    expect(row).toMatchObject({ thread_friction: 0.13, bearing_friction: 0.14, target_margin: 1.4, torque_nm: 156 });
    expect(JSON.parse(row.stages)).toEqual([54.5, 108, 156]);
  });

  it("stages go with the unit typed with the torque", async () => {
    const shown = await editorValues();
    const out = await editorPost({ ...shown, intent: "save", torque: "115 lbf·ft", stages: "40, 80, 115" });
    expect(out.status).toBe(302);
    const row = await planRow(planId);
    expect(Math.abs(row.torque_nm / (115 * LBF_FT) - 1)).toBeLessThan(1e-6);
    const stages = JSON.parse(row.stages) as number[];
    expect(Math.abs(stages[0]! / (40 * LBF_FT) - 1)).toBeLessThan(1e-6);
    expect(stages[2]).toBe(row.torque_nm);
  });

  it("a new plan with nothing to start from gets stages a torque wrench can be set to, in the person's units", async () => {
    const engineId = await freshEngine("Stage test four");
    const params = { engineId: String(engineId) };
    const metric = (await call(newPlan.loader as Handler, get(`/engines/${engineId}/plans/new`, builder), params)).body as Loaded;
    for (const s of metric.values.stages!.split(", ")) expect(s).toMatch(/^\d+$/);
    const user = await db()("users").where({ email: "builder@example.com" }).first("id");
    await db()("users").where({ id: user.id }).update({ units: "imperial" });
    try {
      const imperial = (await call(newPlan.loader as Handler, get(`/engines/${engineId}/plans/new`, builder), params)).body as Loaded;
      for (const s of imperial.values.stages!.split(", ")) expect(s).toMatch(/^\d+$/);
      expect(imperial.values.torque).toMatch(/^\d+$/);
    } finally {
      await db()("users").where({ id: user.id }).update({ units: "metric" });
    }
  });

  it("units typed into engine fields win over the field's, and boost gets the atmosphere added", async () => {
    const out = await call(
      newEngine.action as Handler,
      post(
        "/engines/new",
        {
          ...(await engineForm("Typed units four")),
          boreMm: "3.386 in",
          strokeMm: "86,0",
          sleeveProtrusionMm: "2 thou",
          targetManifoldKpa: "2 bar boost",
          runningHeadC: "230 °F",
        },
        builder,
      ),
    );
    expect(out.status).toBe(302);
    const row = await db()("engines")
      .where({ id: Number(out.location!.split("/").pop()) })
      .first();
    expect(row.bore_mm).toBeCloseTo(86.0044, 4);
    expect(row.stroke_mm).toBe(86);
    expect(row.sleeve_protrusion_mm).toBeCloseTo(0.0508, 6);
    expect(row.target_manifold_kpa).toBeCloseTo(301.325, 9);
    expect(row.running_head_c).toBeCloseTo(110, 9);
  });
});

describe("gaskets by bore", () => {
  it("'Show all gaskets' without JavaScript answers the form as typed, with all gaskets offered, and writes nothing", async () => {
    const before = await planRow(planId);
    const shown = await editorValues();
    const out = await editorPost({ ...shown, intent: "show-all-gaskets", torque: "133" });
    expect(out.status).toBe(200);
    expect(answered(out.body).values).toMatchObject({ showAllGaskets: "1", torque: "133" });
    expect(await planRow(planId)).toEqual(before);
  });
});

async function engineForm(name: string): Promise<Record<string, string>> {
  const mats = await db()("materials").where({ team_id: teamId }).select("id", "name");
  const id = (start: string) => String(mats.find((m) => m.name.startsWith(start))!.id);
  const form: Record<string, string> = {
    intent: "save",
    name,
    customer: "",
    status: "quoted",
    cylinders: "4",
    layout: "inline",
    boreMm: "86",
    strokeMm: "86",
    headThicknessAtStudMm: "100",
    blockDepthToThreadMm: "0",
    blockMaterialId: id("Ductile iron"),
    headMaterialId: id("A356.0"),
    sleeveKind: "none",
    sleeveProtrusionMm: "0",
    fuel: "E85",
    targetManifoldKpa: "300",
    peakPressureSource: "estimated",
    pressureRiseFactor: "3",
    runningHeadC: "110",
    runningBlockC: "95",
    pistonVolumeCc: "0",
    deckClearanceMm: "0",
    notes: "",
  };
  const studs: [string, string][] = [
    ["1", "1"],
    ["1 2", "0.5 0.5"],
    ["2 3", "0.5 0.5"],
    ["3 4", "0.5 0.5"],
    ["4", "1"],
  ];
  studs.forEach(([c, s], i) => {
    form[`studs[${i}].label`] = "";
    form[`studs[${i}].cylinders`] = c;
    form[`studs[${i}].shares`] = s;
  });
  return form;
}

async function freshEngine(name: string): Promise<number> {
  const out = await call(newEngine.action as Handler, post("/engines/new", await engineForm(name), builder));
  if (out.status !== 302) throw new Error(`engine not made: ${JSON.stringify(out.body)}`);
  return Number(out.location!.split("/").pop());
}

describe("duplicating an engine", () => {
  const dup = (engineId: number, cookie: string) =>
    call(duplicate.action as Handler, post(`/engines/${engineId}/duplicate`, {}, cookie), { engineId: String(engineId) });

  it("copies the record and the stud pattern, not the plans, as “… (copy)”", async () => {
    const original = await db()("engines").where({ id: six }).first();
    expect(await plansOn(six)).toBeGreaterThan(0);
    const out = await dup(six, builder);
    expect(out.status).toBe(302);
    const id = Number(out.location!.split("/").pop());
    expect(out.location).toBe(`/engines/${id}`);
    const copyRow = await db()("engines").where({ id }).first();
    const { id: _a, name, chosen_plan_id, created_at: _c, updated_at: _u, ...rest } = copyRow;
    const { id: _b, name: originalName, chosen_plan_id: _ch, created_at: _c2, updated_at: _u2, ...originalRest } = original;
    expect(name).toBe(`${originalName} (copy)`);
    expect(chosen_plan_id).toBeNull();
    expect(rest).toEqual(originalRest);
    expect(JSON.parse(copyRow.studs)).toEqual(JSON.parse(original.studs));
    expect(await plansOn(id)).toBe(0);
    const audit = await db()("audit_events").where({ team_id: teamId, action: "engine.duplicated" }).orderBy("id", "desc").first();
    expect(JSON.parse(audit.detail)).toMatchObject({ engineId: id, fromEngineId: six });
  });

  it("is refused to a viewer (403) and not found for another shop (404), writing nothing", async () => {
    const count = async () => Number((await db()("engines").count({ n: "*" }))[0]!.n);
    const before = await count();
    expect((await dup(six, viewer)).status).toBe(403);
    expect((await dup(six, other)).status).toBe(404);
    expect(await count()).toBe(before);
  });

  it("a GET of the address lands on the engine page (for a viewer, only an engine shared with them)", async () => {
    const out = await call(duplicate.loader as Handler, get(`/engines/${four}/duplicate`, viewer), { engineId: String(four) });
    expect(out.status).toBe(302);
    expect(out.location).toBe(`/engines/${four}`);
    const unshared = await call(duplicate.loader as Handler, get(`/engines/${six}/duplicate`, viewer), { engineId: String(six) });
    expect(unshared.status).toBe(404);
  });
});

/** The copy form's one message (Conform's reply: the form's own, or the engine field's). */
function copyRefusal(body: unknown): string | undefined {
  const error = (body as { result: { error?: Record<string, string[]> } }).result.error ?? {};
  return (error[""] ?? error.targetEngineId)?.[0];
}

describe("copying a plan to another engine", () => {
  const url = (id: number) => `/engines/${four}/plans/${id}/copy`;
  const params = (id: number) => ({ engineId: String(four), planId: String(id) });
  const cp = (id: number, target: number, cookie = builder) =>
    call(copy.action as Handler, post(url(id), { targetEngineId: String(target) }, cookie), params(id));

  it("lists the shop's other engines with whether the gasket fits each", async () => {
    const out = await call(copy.loader as Handler, get(url(planId), builder), params(planId));
    expect(out.status).toBe(200);
    const targets = (out.body as { targets: { id: number; misfit: string | null }[] }).targets;
    expect(targets.map((t) => t.id)).not.toContain(four);
    expect(targets.find((t) => t.id === six)!.misfit).toBeNull();
    expect(targets.find((t) => t.id === v8)!.misfit).toMatch(/smaller than the 106\.00 mm cylinder bore/);
  });

  it("copies the plan's figures to an engine whose bore the gasket fits", async () => {
    const source = await planRow(planId);
    const before = await plansOn(six);
    const out = await cp(planId, six);
    expect(out.status).toBe(302);
    const id = Number(out.location!.split("/").pop());
    expect(out.location).toBe(`/engines/${six}/plans/${id}`);
    expect(await plansOn(six)).toBe(before + 1);
    const { id: _i, engine_id, created_at: _c, updated_at: _u, ...copied } = await planRow(id);
    const { id: _j, engine_id: _e, created_at: _c2, updated_at: _u2, ...original } = source;
    expect(engine_id).toBe(six);
    expect(copied).toEqual(original);
  });

  it("refuses, in words, an engine whose bore the gasket does not fit", async () => {
    const before = await plansOn(v8);
    const out = await cp(planId, v8);
    expect(out.status).toBe(400);
    expect(copyRefusal(out.body)).toBe(
      "Not copied to “Saltings 6.5 V8”: The gasket's 87.00 mm bore is smaller than the 106.00 mm cylinder bore: it would hang into the bore.",
    );
    expect(await plansOn(v8)).toBe(before);
  });

  it("is refused to a viewer (403), and another shop's plans and engines are not found (404)", async () => {
    expect((await call(copy.loader as Handler, get(url(planId), viewer), params(planId))).status).toBe(403);
    expect((await cp(planId, six, viewer)).status).toBe(403);
    expect((await call(copy.loader as Handler, get(url(planId), other), params(planId))).status).toBe(404);
    expect((await cp(planId, six, other)).status).toBe(404);
    // a target engine of another shop is simply not found either
    const theirs = await db()("engines")
      .insert({ ...(await db()("engines").where({ id: six }).first()), id: undefined, team_id: otherTeamId, name: "Another shop's engine" })
      .returning("id");
    const before = await plansOn(theirs[0].id);
    expect((await cp(planId, theirs[0].id)).status).toBe(404);
    expect(await plansOn(theirs[0].id)).toBe(before);
  });
});

describe("copying a plan: the form", () => {
  it("asks for an engine when none is picked, and writes nothing", async () => {
    const count = Number((await db()("seal_plans").count({ n: "*" }))[0]!.n);
    const out = await call(copy.action as Handler, post(`/engines/${four}/plans/${planId}/copy`, {}, builder), {
      engineId: String(four),
      planId: String(planId),
    });
    expect(out.status).toBe(400);
    expect(copyRefusal(out.body)).toBe("Pick the engine to copy the plan to.");
    expect(Number((await db()("seal_plans").count({ n: "*" }))[0]!.n)).toBe(count);
  });
});
