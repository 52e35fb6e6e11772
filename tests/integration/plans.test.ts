import { beforeAll, describe, expect, it } from "vitest";
import { evaluatePlan, parsePlan } from "~/lib/clamp";
import { assemblePlanInput } from "~/lib/plan/assemble";
import { getEngine } from "~/models/engine.server";
import { listPlans, planParts } from "~/models/plan.server";
import * as estimateApi from "~/routes/api/estimate";
import * as chamber from "~/routes/engines/chamber";
import * as compare from "~/routes/plans/compare";
import * as editor from "~/routes/plans/editor";
import * as planList from "~/routes/plans/list";
import * as newPlan from "~/routes/plans/new";
import { db } from "~/utils/db.server";
import { call, get, ORIGIN, post, signIn, type Handler, teamWide } from "./helpers";

const LBF_FT = 1.3558179; // N·m per lbf·ft, NIST SP 811

let builder = "";
let viewer = "";
let other = "";
let teamId = 0;
let engineId = 0;
let planId = 0;

async function planRow(id: number) {
  return db()("seal_plans").where({ id }).first();
}

function editorForm(overrides: Record<string, string> = {}): Record<string, string> {
  return {
    intent: "save",
    name: "Test plan",
    gasketId: "",
    fastenerId: "",
    lubricant: "Moly paste",
    threadFriction: "0.12",
    bearingFriction: "0.12",
    method: "torque-estimated-friction",
    torque: "150",
    stages: "60, 110, 150",
    wireLocation: "block",
    wireProjection: "0.1",
    receiverGrooveDepth: "0",
    sleeveProtrusion: "",
    targetMargin: "1.5",
    notes: "",
    ...overrides,
  };
}

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  other = await signIn("other-owner@example.com");
  teamId = (await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  const four = await db()("engines").where({ team_id: teamId, cylinders: 4 }).first();
  engineId = four.id;
  planId = (await listPlans(teamId, engineId))[0]!.id;
});

/** Conform's reply in an answer: the first message per field ("" for the form's own), and the values it shows. */
function reply(body: unknown): { errors: Record<string, string>; values: Record<string, unknown> } {
  const result = (body as { result: { error?: Record<string, string[]>; initialValue: Record<string, unknown> } }).result;
  const errors = Object.fromEntries(Object.entries(result.error ?? {}).map(([name, list]) => [name, list[0]!]));
  return { errors, values: result.initialValue };
}

async function currentForm(overrides: Record<string, string> = {}) {
  const row = await planRow(planId);
  return editorForm({ gasketId: String(row.gasket_id), fastenerId: String(row.fastener_id), ...overrides });
}

describe("seeded demo plans", () => {
  it("every plan of the demo shop assembles into a valid model input and evaluates to finite figures", async () => {
    const engines = await db()("engines").where({ team_id: teamId });
    expect(engines).toHaveLength(3);
    for (const e of engines) {
      const engine = (await getEngine(teamWide(teamId), e.id))!;
      const plans = await listPlans(teamId, engine.id);
      expect(plans.length).toBeGreaterThanOrEqual(2);
      for (const plan of plans) {
        const parts = (await planParts(teamId, engine, plan))!;
        const parsed = parsePlan(assemblePlanInput(parts));
        expect(parsed.ok, `${engine.name} / ${plan.name}: ${JSON.stringify(!parsed.ok && parsed.errors)}`).toBe(true);
        if (!parsed.ok) continue;
        const estimate = evaluatePlan(parsed.plan);
        expect(estimate.cylinders).toHaveLength(engine.cylinders);
        expect(Number.isFinite(estimate.weakestMargin)).toBe(true);
        expect(estimate.weakestMargin).toBeGreaterThan(0);
      }
    }
  });
});

describe("estimate API", () => {
  const api = estimateApi.action as Handler;
  const json = (body: string, cookie: string | null, type = "application/json") =>
    new Request(`${ORIGIN}/api/v1/estimate`, {
      method: "POST",
      headers: { "Content-Type": type, Origin: ORIGIN, ...(cookie ? { Cookie: cookie } : {}) },
      body,
    });

  async function seededInput() {
    const engine = (await getEngine(teamWide(teamId), engineId))!;
    const plan = (await listPlans(teamId, engineId))[0]!;
    return assemblePlanInput((await planParts(teamId, engine, plan))!);
  }

  it("answers 401 without a session", async () => {
    const out = await call(api, json(JSON.stringify({ input: await seededInput() }), null));
    expect(out.status).toBe(401);
  });

  it("rejects bad JSON, a body without an input object, a wrong content type and an oversized body", async () => {
    expect((await call(api, json("{ not json", builder))).status).toBe(400);
    const noInput = await call(api, json("[1, 2]", builder));
    expect(noInput.status).toBe(400);
    expect((noInput.body as { error: string }).error).toBe("Send a JSON object.");
    expect((await call(api, json("{}", builder, "text/plain"))).status).toBe(415);
    const big = JSON.stringify({ input: { pad: "x".repeat(70 * 1024) } });
    const out = await call(api, json(big, builder));
    expect(out.status).toBe(413);
  });

  it("rejects an invalid plan with the schema's messages", async () => {
    const input = await seededInput();
    const bad = { ...input, fastener: { ...input.fastener, pitchMm: 20 } };
    const out = await call(api, json(JSON.stringify({ input: bad }), builder));
    expect(out.status).toBe(400);
    const errors = (out.body as { errors: { path: string; message: string }[] }).errors;
    expect(errors).toContainEqual({ path: "input.fastener.pitchMm", message: "Thread pitch must be smaller than the diameter" });
  });

  it("estimates a valid plan the same as the core does", async () => {
    const input = await seededInput();
    const out = await call(api, json(JSON.stringify({ input }), viewer));
    expect(out.status).toBe(200);
    const body = out.body as {
      estimate: { weakestMargin: number; cylinders: unknown[] };
      sweep: unknown[];
      probabilityMarginBelowOne: number;
    };
    const direct = evaluatePlan((parsePlan(input) as { ok: true; plan: never }).plan);
    expect(body.estimate.cylinders).toHaveLength(4);
    expect(body.estimate.weakestMargin).toBeCloseTo(direct.weakestMargin, 9);
    expect(body.sweep).toHaveLength(41);
    expect(body.probabilityMarginBelowOne).toBeGreaterThanOrEqual(0);
    expect(body.probabilityMarginBelowOne).toBeLessThanOrEqual(1);
  });
});

describe("plan editor", () => {
  const act = editor.action as Handler;
  const url = () => `/engines/${engineId}/plans/${planId}`;

  it("shows the plan with its estimate and the maker's fastener figure", async () => {
    const out = await call(editor.loader as Handler, get(url(), viewer), { engineId: String(engineId), planId: String(planId) });
    expect(out.status).toBe(200);
    const body = out.body as { canEdit: boolean; result: { ok: boolean; fastener: { makerTorqueNm: number | null } } };
    expect(body.canEdit).toBe(false);
    expect(body.result.ok).toBe(true);
    expect(body.result.fastener.makerTorqueNm).toBeGreaterThan(0);
  });

  it("rejects bad input with messages and writes nothing", async () => {
    const before = await planRow(planId);
    const out = await call(act, post(url(), await currentForm({ torque: "-5", stages: "10, 5", threadFriction: "abc" }), builder), {
      engineId: String(engineId),
      planId: String(planId),
    });
    expect(out.status).toBe(400);
    const { errors, values } = reply(out.body);
    expect(errors.torque).toBe("Torque must be between 1 N·m and 5,000 N·m");
    expect(errors.stages).toBe("Stages must rise, ending at the final torque");
    expect(errors.threadFriction).toBe("Thread friction is a number like 0.12");
    // what was typed comes back as typed
    expect(values).toMatchObject({ torque: "-5", stages: "10, 5", threadFriction: "abc" });
    expect(await planRow(planId)).toEqual(before);
  });

  it("refuses a viewer's save with 403 and writes nothing", async () => {
    const before = await planRow(planId);
    const out = await call(act, post(url(), await currentForm(), viewer), { engineId: String(engineId), planId: String(planId) });
    expect(out.status).toBe(403);
    expect(await planRow(planId)).toEqual(before);
  });

  it("gives another team's owner 404 for the editor, its actions, the list, compare and chamber", async () => {
    const params = { engineId: String(engineId), planId: String(planId) };
    expect((await call(editor.loader as Handler, get(url(), other), params)).status).toBe(404);
    expect((await call(act, post(url(), await currentForm(), other), params)).status).toBe(404);
    expect((await call(act, post(url(), { intent: "choose" }, other), params)).status).toBe(404);
    expect((await call(planList.loader as Handler, get(`/engines/${engineId}/plans`, other), params)).status).toBe(404);
    expect((await call(compare.loader as Handler, get(`/engines/${engineId}/compare`, other), params)).status).toBe(404);
    expect(
      (await call(compare.action as Handler, post(`/engines/${engineId}/compare`, { planId: String(planId) }, other), params)).status,
    ).toBe(404);
    expect((await call(chamber.loader as Handler, get(`/engines/${engineId}/chamber`, other), params)).status).toBe(404);
    expect((await call(newPlan.action as Handler, post(`/engines/${engineId}/plans/new`, await currentForm(), other), params)).status).toBe(
      404,
    );
  });

  it("stores an imperial torque in N·m", async () => {
    const user = await db()("users").where({ email: "builder@example.com" }).first("id");
    await db()("users").where({ id: user.id }).update({ units: "imperial" });
    try {
      const out = await call(
        act,
        post(url(), await currentForm({ torque: "120", stages: "50, 90, 120", wireProjection: "4", receiverGrooveDepth: "0" }), builder),
        { engineId: String(engineId), planId: String(planId) },
      );
      expect(out.status).toBe(302);
      const row = await planRow(planId);
      // convert-units carries lbf·ft as 1.355818 N·m: within 1e-6 relative of NIST SP 811's 1.3558179
      expect(Math.abs(row.torque_nm / (120 * LBF_FT) - 1)).toBeLessThan(1e-6);
      expect(Math.abs(JSON.parse(row.stages)[0] / (50 * LBF_FT) - 1)).toBeLessThan(1e-6);
      // 4 thou = 0.1016 mm exactly; convert-units carries the thou to 8 significant figures
      expect(row.wire_projection_mm).toBeCloseTo(0.1016, 7);
    } finally {
      await db()("users").where({ id: user.id }).update({ units: "metric" });
    }
  });

  it("words the torque ceiling, the checks and warnings in the person's units", async () => {
    const user = await db()("users").where({ email: "viewer@example.com" }).first("id");
    const params = { engineId: String(engineId), planId: String(planId) };
    type Loaded = {
      result: { view: { ceiling: { explanation: string }; estimate: { warnings: string[]; verdict: { checks: { detail: string }[] } } } };
    };
    const metric = (await call(editor.loader as Handler, get(url(), viewer), params)).body as Loaded;
    expect(metric.result.view.ceiling.explanation).toMatch(/N·m/);
    await db()("users").where({ id: user.id }).update({ units: "imperial" });
    try {
      const imperial = (await call(editor.loader as Handler, get(url(), viewer), params)).body as Loaded;
      expect(imperial.result.view.ceiling.explanation).toMatch(/lbf·ft/);
      expect(imperial.result.view.ceiling.explanation).not.toMatch(/N·m|MPa|kN/);
      for (const w of imperial.result.view.estimate.warnings) expect(w).not.toMatch(/ N·m| kN| MPa/);
      for (const c of imperial.result.view.estimate.verdict.checks) expect(c.detail).not.toMatch(/ N·m| kN| MPa| mm\b/);
    } finally {
      await db()("users").where({ id: user.id }).update({ units: "metric" });
    }
  });

  it("recalculates without saving when asked (no JavaScript), and a higher torque raises the clamp", async () => {
    const before = await planRow(planId);
    const params = { engineId: String(engineId), planId: String(planId) };
    const low = await call(act, post(url(), await currentForm({ intent: "estimate", torque: "120", stages: "" }), builder), params);
    const high = await call(act, post(url(), await currentForm({ intent: "estimate", torque: "180", stages: "" }), builder), params);
    type Preview = { preview: { estimate: { cylinders: { clampN: number }[]; tightening: { preload: { nominalN: number } } } } };
    const lowClamp = (low.body as Preview).preview.estimate.cylinders[0]!.clampN;
    const highClamp = (high.body as Preview).preview.estimate.cylinders[0]!.clampN;
    expect(highClamp).toBeGreaterThan(lowClamp);
    // Preload is linear in torque (ISO 16047 long form): 180/120 of the preload
    const pl = (low.body as Preview).preview.estimate.tightening.preload.nominalN;
    const ph = (high.body as Preview).preview.estimate.tightening.preload.nominalN;
    expect(ph / pl).toBeCloseTo(1.5, 9);
    expect(await planRow(planId)).toEqual(before);
  });

  it("suggests a torque, applies it to a new plan, and marks a plan chosen", async () => {
    const params = { engineId: String(engineId), planId: String(planId) };
    const out = await call(act, post(url(), await currentForm({ intent: "suggest", targetMargin: "1.2" }), builder), params);
    expect(out.status).toBe(200);
    const suggestion = (out.body as { suggestion: { reachable: boolean; torqueNm: number | null; summary: string } }).suggestion;
    expect(suggestion.summary.length).toBeGreaterThan(10);
    if (suggestion.reachable) {
      const made = await call(act, post(url(), { intent: "new-with-torque", torqueNm: String(suggestion.torqueNm) }, builder), params);
      expect(made.status).toBe(302);
      const newId = Number(made.location!.split("/").pop());
      expect((await planRow(newId)).torque_nm).toBeCloseTo(suggestion.torqueNm!, 6);
    }
    const chosen = await call(act, post(url(), { intent: "choose" }, builder), params);
    expect(chosen.status).toBe(302);
    expect((await db()("engines").where({ id: engineId }).first()).chosen_plan_id).toBe(planId);
  });
});

describe("gasket fit", () => {
  it("refuses a plan whose gasket bore does not suit the engine, and writes nothing", async () => {
    const params = { engineId: String(engineId) };
    const big = await db()("gaskets").where({ team_id: teamId }).where("bore_mm", ">", 100).first();
    const count = async () => Number((await db()("seal_plans").where({ engine_id: engineId }).count({ n: "*" }))[0]!.n);
    const before = await count();
    const out = await call(
      newPlan.action as Handler,
      post(
        `/engines/${engineId}/plans/new`,
        await currentForm({ intent: "create", name: "Wrong gasket", gasketId: String(big.id) }),
        builder,
      ),
      params,
    );
    expect(out.status).toBe(400);
    // filed under the gasket, the field the builder changes
    const { errors, values } = reply(out.body);
    expect(errors.gasketId).toMatch(/far larger than the 86\.00 mm cylinder bore/);
    expect(errors[""]).toBeUndefined();
    expect(values).toMatchObject({ name: "Wrong gasket", gasketId: String(big.id) });
    expect(await count()).toBe(before);
  });
});

describe("archiving a plan", () => {
  it("hides it from the engine's plans and clears it as the chosen plan", async () => {
    const params = { engineId: String(engineId) };
    const made = await call(
      newPlan.action as Handler,
      post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "create", name: "To be archived" }), builder),
      params,
    );
    const id = Number(made.location!.split("/").pop());
    const planParams = { engineId: String(engineId), planId: String(id) };
    await call(editor.action as Handler, post(`/engines/${engineId}/plans/${id}`, { intent: "choose" }, builder), planParams);
    expect((await db()("engines").where({ id: engineId }).first()).chosen_plan_id).toBe(id);
    expect(
      (await call(editor.action as Handler, post(`/engines/${engineId}/plans/${id}`, { intent: "archive" }, viewer), planParams)).status,
    ).toBe(403);
    const out = await call(editor.action as Handler, post(`/engines/${engineId}/plans/${id}`, { intent: "archive" }, builder), planParams);
    expect(out.status).toBe(302);
    expect((await listPlans(teamId, engineId)).map((p) => p.id)).not.toContain(id);
    expect((await db()("engines").where({ id: engineId }).first()).chosen_plan_id).toBeNull();
    expect((await call(editor.loader as Handler, get(`/engines/${engineId}/plans/${id}`, builder), planParams)).status).toBe(404);
  });
});

describe("button words", () => {
  it("an unknown intent on the editor or the new-plan page is a 400 with a message, and writes nothing", async () => {
    const before = await planRow(planId);
    const planParams = { engineId: String(engineId), planId: String(planId) };
    const out = await call(
      editor.action as Handler,
      post(`/engines/${engineId}/plans/${planId}`, { intent: "delete-all" }, builder),
      planParams,
    );
    expect(out.status).toBe(400);
    expect(String(out.body)).toMatch(/not one this page knows/);
    const made = await call(
      newPlan.action as Handler,
      post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "save-everything" }), builder),
      { engineId: String(engineId) },
    );
    expect(made.status).toBe(400);
    expect(await planRow(planId)).toEqual(before);
  });
});

describe("the plan form's answers (Conform)", () => {
  const params = () => ({ engineId: String(engineId), planId: String(planId) });
  const editorPost = async (fields: Record<string, string>, cookie = builder) =>
    call(editor.action as Handler, post(`/engines/${engineId}/plans/${planId}`, fields, cookie), params());

  it("a malformed or misaimed __intent__ on the editor or the new-plan page is a 400 with a message, and writes nothing", async () => {
    const before = await planRow(planId);
    const count = Number((await db()("seal_plans").count({ n: "*" }))[0]!.n);
    for (const __intent__ of [
      "{not json",
      '{"type":"explode","payload":{}}',
      JSON.stringify({ type: "remove", payload: { name: "torque", index: 0 } }),
    ]) {
      const out = await editorPost(await currentForm({ __intent__ }));
      expect(out.status, __intent__).toBe(400);
      expect(String(out.body)).toMatch(/not one this page knows/);
      const made = await call(
        newPlan.action as Handler,
        post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "create", name: "Never", __intent__ }), builder),
        { engineId: String(engineId) },
      );
      expect(made.status, __intent__).toBe(400);
    }
    expect(await planRow(planId)).toEqual(before);
    expect(Number((await db()("seal_plans").count({ n: "*" }))[0]!.n)).toBe(count);
  });

  it("an imperial builder's refusal speaks lbf·ft and thou, and keeps what was typed", async () => {
    const user = await db()("users").where({ email: "builder@example.com" }).first("id");
    await db()("users").where({ id: user.id }).update({ units: "imperial" });
    try {
      const before = await planRow(planId);
      const out = await editorPost(await currentForm({ torque: "4000", stages: "", wireProjection: "90" }));
      expect(out.status).toBe(400);
      const { errors, values } = reply(out.body);
      // 5000 N·m = 3688 lbf·ft; 2 mm = 78.7 thou (NIST SP 811: 1 lbf·ft = 1.3558179 N·m, 1 thou = 0.0254 mm)
      expect(errors.torque).toBe("Torque must be between 1 lbf·ft and 3,688 lbf·ft");
      expect(errors.wireProjection).toBe("Wire projection must be between 0.0 thou and 78.7 thou");
      expect(values).toMatchObject({ torque: "4000", wireProjection: "90" });
      expect(await planRow(planId)).toEqual(before);
    } finally {
      await db()("users").where({ id: user.id }).update({ units: "metric" });
    }
  });

  it("a successful Recalculate answers with no messages and the values as typed", async () => {
    const out = await editorPost(await currentForm({ intent: "estimate", torque: "140", stages: "60, 100, 140" }));
    expect(out.status).toBe(200);
    const body = out.body as { result: { status: string; error?: Record<string, string[]> }; preview: unknown };
    expect(body.result.status).toBe("success");
    expect(body.result.error).toBeUndefined();
    expect(reply(out.body).values).toMatchObject({ torque: "140", stages: "60, 100, 140" });
    expect(body.preview).not.toBeNull();
  });
});

describe("new plan", () => {
  it("creates a plan, and refuses bad input writing nothing", async () => {
    const params = { engineId: String(engineId) };
    const count = async () => Number((await db()("seal_plans").where({ engine_id: engineId }).count({ n: "*" }))[0]!.n);
    const before = await count();
    const bad = await call(
      newPlan.action as Handler,
      post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "create", name: "" }), builder),
      params,
    );
    expect(bad.status).toBe(400);
    expect(reply(bad.body).errors.name).toBe("Name the plan");
    expect(await count()).toBe(before);
    const good = await call(
      newPlan.action as Handler,
      post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "create", name: "Fresh plan" }), builder),
      params,
    );
    expect(good.status).toBe(302);
    expect(await count()).toBe(before + 1);
    const viewerTry = await call(
      newPlan.action as Handler,
      post(`/engines/${engineId}/plans/new`, await currentForm({ intent: "create", name: "Viewer plan" }), viewer),
      params,
    );
    expect(viewerTry.status).toBe(403);
    expect(await count()).toBe(before + 1);
  });
});

describe("chamber", () => {
  it("works out the compression ratio from the engine and the chosen gasket (docs/references.md §8 formula, computed here)", async () => {
    const out = await call(chamber.loader as Handler, get(`/engines/${engineId}/chamber`, builder), { engineId: String(engineId) });
    const body = out.body as { result: { before: { compressionRatio: number } }; gasketId: number };
    const e = await db()("engines").where({ id: engineId }).first();
    const g = await db()("gaskets").where({ id: body.gasketId }).first();
    const cc = (d: number, h: number) => ((Math.PI / 4) * d * d * h) / 1000;
    const vc = e.chamber_cc + cc(g.bore_mm, g.compressed_thickness_mm) + cc(e.bore_mm, e.deck_clearance_mm) + e.piston_volume_cc;
    const expected = (cc(e.bore_mm, e.stroke_mm) + vc) / vc;
    expect(body.result.before.compressionRatio).toBeCloseTo(expected, 9);
  });
});
