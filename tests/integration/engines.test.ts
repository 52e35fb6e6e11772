import { beforeAll, describe, expect, it } from "vitest";
import { defaultStudPattern } from "~/lib/clamp/pattern";
import { EngineSchema, studToRow, type EngineInput } from "~/lib/engine";
import { createEngine, listEngines } from "~/models/engine.server";
import * as edit from "~/routes/engines/edit";
import * as layout from "~/routes/engines/layout";
import * as list from "~/routes/engines/list";
import * as create from "~/routes/engines/new";
import * as overview from "~/routes/engines/overview";
import { call, get, post, signIn, type Handler, teamWide } from "./helpers";
import { ownerDb } from "../setup/db-roles";

const h = (fn: unknown) => fn as Handler;
let builder = "";
let viewer = "";
let other = "";
let demoTeamId = 0;
let otherTeamId = 0;
let builderId = 0;
let iron = 0;
let alu = 0;
let otherTeamMaterial = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  other = await signIn("other-owner@example.com");
  demoTeamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  otherTeamId = (await ownerDb()("teams").where({ name: "Saltmarsh Dyno Cell" }).first("id")).id;
  builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
  iron = (await ownerDb()("materials").where({ team_id: demoTeamId, kind: "iron" }).first("id")).id;
  alu = (await ownerDb()("materials").where({ team_id: demoTeamId, kind: "aluminium" }).first("id")).id;
  otherTeamMaterial = (await ownerDb()("materials").where({ team_id: otherTeamId }).first("id")).id;
});

/** A valid inline-four form as the builder would post it (metric). */
function fourForm(over: Record<string, string> = {}): Record<string, string> {
  const fields: Record<string, string> = {
    intent: "save",
    name: "Test four",
    customer: "Bench customer",
    status: "quoted",
    cylinders: "4",
    layout: "inline",
    boreMm: "86",
    strokeMm: "86",
    rodLengthMm: "145",
    headThicknessAtStudMm: "100",
    blockDepthToThreadMm: "15",
    blockMaterialId: String(iron),
    headMaterialId: String(alu),
    sleeveKind: "none",
    sleeveProtrusionMm: "0",
    fuel: "E85",
    targetManifoldKpa: "350",
    peakPressureMpa: "",
    peakPressureSource: "estimated",
    pressureRiseFactor: "3",
    runningHeadC: "110",
    runningBlockC: "95",
    chamberCc: "48",
    pistonVolumeCc: "6",
    deckClearanceMm: "0.2",
    notes: "",
  };
  defaultStudPattern("inline", 4).forEach((s, i) => {
    const row = studToRow(s);
    fields[`studs[${i}].label`] = row.label;
    fields[`studs[${i}].cylinders`] = row.cylinders;
    fields[`studs[${i}].shares`] = row.shares;
  });
  return { ...fields, ...over };
}

/** Conform's reply in an answer: the first message per field, and the values as posted. */
function refusal(body: unknown): {
  errors: Record<string, string>;
  values: Record<string, unknown> & { studs?: Record<string, string>[] };
} {
  const result = (body as { result: { error?: Record<string, string[]>; initialValue: Record<string, unknown> } }).result;
  const errors = Object.fromEntries(Object.entries(result.error ?? {}).map(([name, list]) => [name, list[0]!]));
  return { errors, values: result.initialValue };
}

const engineCount = async () => Number((await ownerDb()("engines").count({ n: "*" }))[0]!.n);
const demoEngineIds = async (): Promise<number[]> =>
  ownerDb()("engines").where({ team_id: demoTeamId }).whereNull("archived_at").pluck("id");

describe("creating an engine", () => {
  it("saves the record in SI, audits it and sends the builder to the engine page with a toast", async () => {
    const out = await call(h(create.action), post("/engines/new", fourForm({ name: "Created four" }), builder));
    expect(out.status).toBe(302);
    const id = Number(out.location!.split("/").pop());
    expect(out.location).toBe(`/engines/${id}`);
    expect(out.setCookie).toMatch(/^sw_toast=/);
    const row = await ownerDb()("engines").where({ id }).first();
    expect(row).toMatchObject({
      team_id: demoTeamId,
      name: "Created four",
      cylinders: 4,
      layout: "inline",
      bore_mm: 86,
      block_material_id: iron,
      head_material_id: alu,
      sleeve_kind: "none",
      sleeve_material_id: null,
      target_manifold_kpa: 350,
      peak_pressure_mpa: null,
      deck_clearance_mm: 0.2,
      status: "quoted",
    });
    expect(JSON.parse(row.studs)).toEqual(defaultStudPattern("inline", 4));
    const audit = await ownerDb()("audit_events").where({ team_id: demoTeamId, action: "engine.created" }).orderBy("id", "desc").first();
    expect(audit.user_id).toBe(builderId);
    expect(JSON.parse(audit.detail)).toEqual({ engineId: id, name: "Created four" });

    const page = await call(h(overview.loader), get(`/engines/${id}`, builder), { engineId: String(id) });
    const body = page.body as { engine: { name: string; boreMm: number }; materials: Record<number, string>; canEdit: boolean };
    expect(body.engine.name).toBe("Created four");
    expect(body.materials[iron]).toBeTruthy();
    expect(body.canEdit).toBe(true);
  });

  it("reads imperial input and stores millimetres and kPa", async () => {
    await ownerDb()("users").where({ id: builderId }).update({ units: "imperial" });
    try {
      const form = fourForm({
        name: "Imperial four",
        boreMm: "3.386",
        strokeMm: "3.386",
        rodLengthMm: "5.7",
        headThicknessAtStudMm: "3.937",
        blockDepthToThreadMm: "0.6",
        deckClearanceMm: "8", // thou
        targetManifoldKpa: "50", // psi abs
        runningHeadC: "230", // °F
        runningBlockC: "203",
      });
      const out = await call(h(create.action), post("/engines/new", form, builder));
      expect(out.status).toBe(302);
      const row = await ownerDb()("engines").where({ name: "Imperial four" }).first();
      expect(row.bore_mm).toBeCloseTo(86.0044, 3);
      expect(row.deck_clearance_mm).toBeCloseTo(0.2032, 4);
      expect(row.target_manifold_kpa).toBeCloseTo(344.738, 2);
      expect(row.running_head_c).toBeCloseTo(110, 6);
      expect(row.running_block_c).toBeCloseTo(95, 6);
    } finally {
      await ownerDb()("users").where({ id: builderId }).update({ units: "metric" });
    }
  });

  it("refuses invalid input with 400, the builder's messages, the values back, and writes nothing", async () => {
    const before = await engineCount();
    const form = fourForm({
      name: " ",
      cylinders: "5",
      layout: "V",
      boreMm: "abc",
      strokeMm: "-2",
      headMaterialId: "",
      sleeveKind: "wet-mid",
      sleeveProtrusionMm: "1.5",
      targetManifoldKpa: "0",
      peakPressureSource: "measured",
      status: "sold",
      notes: "x".repeat(4001),
    });
    const out = await call(h(create.action), post("/engines/new", form, builder));
    expect(out.status).toBe(400);
    const { errors, values } = refusal(out.body);
    expect(errors).toMatchObject({
      name: "Name the engine",
      cylinders: "A V engine needs an even number of cylinders",
      boreMm: "Bore must be a number",
      strokeMm: "Stroke must be greater than zero",
      headMaterialId: "Choose the head material",
      sleeveMaterialId: "Choose the sleeve material",
      sleeveWallMm: "Give the sleeve wall thickness",
      sleeveSupportLengthMm: "A wet sleeve with mid support needs the support length (sleeve top to the seat)",
      sleeveProtrusionMm: "Sleeve protrusion must be at most 1 mm",
      targetManifoldKpa: "Target manifold pressure must be greater than zero",
      peakPressureMpa: "A measured peak pressure needs its value",
      status: "Pick a status",
      notes: "Keep the notes under 4000 characters",
    });
    expect(values.boreMm).toBe("abc");
    expect(await engineCount()).toBe(before);
  });

  it("refuses a rod no longer than half the stroke", async () => {
    const out = await call(h(create.action), post("/engines/new", fourForm({ strokeMm: "90", rodLengthMm: "45" }), builder));
    expect(out.status).toBe(400);
    expect(refusal(out.body).errors.rodLengthMm).toBe("The rod must be longer than half the stroke (45 mm)");
  });

  it("refuses stud shares that do not add up to 1, naming the stud", async () => {
    const before = await engineCount();
    const out = await call(h(create.action), post("/engines/new", fourForm({ "studs[2].shares": "0.5 0.4" }), builder));
    expect(out.status).toBe(400);
    const { errors } = refusal(out.body);
    expect(errors["studs[2]"]).toBe("Stud shares for stud A3 add up to 0.9; they must add up to 1");
    expect(await engineCount()).toBe(before);
  });

  it("refuses studs that name a cylinder the engine lacks, and cylinders no stud serves", async () => {
    const out = await call(
      h(create.action),
      post(
        "/engines/new",
        fourForm({
          "studs[3].cylinders": "3",
          "studs[3].shares": "1",
          "studs[8].cylinders": "3",
          "studs[8].shares": "1",
          "studs[4].cylinders": "5",
          "studs[9].cylinders": "5",
        }),
        builder,
      ),
    );
    expect(out.status).toBe(400);
    const { errors } = refusal(out.body);
    expect(errors["studs[4]"]).toBe("Stud A5 serves cylinder 5, but the engine has 4 cylinders");
    expect(errors.studs).toBe("No stud serves cylinder 4");
  });

  it("accepts shares typed as fractions and an extra stud", async () => {
    const out = await call(
      h(create.action),
      post(
        "/engines/new",
        fourForm({
          name: "Extra stud four",
          "studs[1].shares": "1/2 1/2",
          "studs[10].label": "X1",
          "studs[10].cylinders": "2 3",
          "studs[10].shares": "½ ½",
        }),
        builder,
      ),
    );
    expect(out.status).toBe(302);
    const row = await ownerDb()("engines").where({ name: "Extra stud four" }).first("studs");
    const studs = JSON.parse(row.studs);
    expect(studs).toHaveLength(11);
    expect(studs[10]).toEqual({
      label: "X1",
      serves: [
        { cylinder: 2, share: 0.5 },
        { cylinder: 3, share: 0.5 },
      ],
    });
  });

  it("refuses another shop's material", async () => {
    const before = await engineCount();
    const out = await call(h(create.action), post("/engines/new", fourForm({ blockMaterialId: String(otherTeamMaterial) }), builder));
    expect(out.status).toBe(400);
    expect(refusal(out.body).errors.blockMaterialId).toBe("Choose the block (deck) material from this shop's materials");
    expect(await engineCount()).toBe(before);
  });

  it("regenerates the stud pattern without JavaScript and writes nothing", async () => {
    const before = await engineCount();
    const out = await call(h(create.action), post("/engines/new", fourForm({ intent: "pattern", layout: "V", cylinders: "8" }), builder));
    expect(out.status).toBe(200);
    const { values } = refusal(out.body);
    expect(values.studs).toHaveLength(20); // 5 per side, 2 sides, 2 banks
    expect(values.studs![0]).toMatchObject({ label: "LA1", cylinders: "1" });
    // Add and Remove are Conform's list intents, posted as __intent__ by the buttons without JavaScript
    const { intent: _, ...typed } = fourForm();
    const list = (intent: object) => post("/engines/new", { ...typed, __intent__: JSON.stringify(intent) }, builder);
    const added = await call(h(create.action), list({ type: "insert", payload: { name: "studs", defaultValue: { label: "" } } }));
    expect(added.status).toBe(200);
    expect(refusal(added.body).values.studs).toHaveLength(11);
    const removed = await call(h(create.action), list({ type: "remove", payload: { name: "studs", index: 0 } }));
    expect(refusal(removed.body).values.studs![0]!.label).toBe("A2");
    expect(await engineCount()).toBe(before);
  });

  it("answers a pattern it cannot make beside Studs per side, and a malformed button word 400", async () => {
    const before = await engineCount();
    const out = await call(h(create.action), post("/engines/new", fourForm({ intent: "pattern", studsPerSide: "1" }), builder));
    expect(out.status).toBe(200);
    expect(refusal(out.body).errors).toEqual({ studsPerSide: "Studs per side is a whole number from 2 to 20" });
    const malformed: Record<string, string>[] = [
      { intent: "remove-stud:0" },
      { __intent__: "{not json" },
      { __intent__: '{"type":"explode","payload":{}}' },
    ];
    for (const bad of malformed) {
      const answer = await call(h(create.action), post("/engines/new", { ...fourForm(), ...bad }, builder));
      expect(answer.status, JSON.stringify(bad)).toBe(400);
      expect(String(answer.body)).toMatch(/not one this page knows/);
    }
    // a list intent aimed at a plain field
    const { intent: _, ...typed } = fourForm();
    const misaimed = { ...typed, __intent__: JSON.stringify({ type: "remove", payload: { name: "name", index: 0 } }) };
    expect((await call(h(create.action), post("/engines/new", misaimed, builder))).status).toBe(400);
    expect(await engineCount()).toBe(before);
  });
});

describe("editing and archiving", () => {
  it("shows the stored engine in the form and saves a change", async () => {
    const id = (await demoEngineIds())[0]!;
    const loaded = await call(h(edit.loader), get(`/engines/${id}/edit`, builder), { engineId: String(id) });
    expect(loaded.status).toBe(200);
    const { values } = loaded.body as { values: Record<string, string> & { studs: Record<string, string>[] } };
    const { studs, ...fields } = values;
    const form: Record<string, string> = { ...fields, intent: "save", name: "Renamed engine", status: "running" };
    studs.forEach((r, i) => {
      form[`studs[${i}].label`] = r.label!;
      form[`studs[${i}].cylinders`] = r.cylinders!;
      form[`studs[${i}].shares`] = r.shares!;
    });
    const before = await ownerDb()("engines").where({ id }).first();
    const out = await call(h(edit.action), post(`/engines/${id}/edit`, form, builder), { engineId: String(id) });
    expect(out.status).toBe(302);
    expect(out.location).toBe(`/engines/${id}`);
    const after = await ownerDb()("engines").where({ id }).first();
    expect(after.name).toBe("Renamed engine");
    expect(after.status).toBe("running");
    // everything else survives the round trip through the form
    expect(after.bore_mm).toBeCloseTo(before.bore_mm, 6);
    expect(after.sleeve_protrusion_mm).toBeCloseTo(before.sleeve_protrusion_mm, 6);
    expect(JSON.parse(after.studs)).toEqual(JSON.parse(before.studs));
    expect(after.chosen_plan_id).toBe(before.chosen_plan_id);
    expect(await ownerDb()("audit_events").where({ action: "engine.updated" }).count({ n: "*" })).toEqual([{ n: 1 }]);
  });

  it("an invalid edit is 400 and leaves the row alone", async () => {
    const id = (await demoEngineIds())[0]!;
    const before = await ownerDb()("engines").where({ id }).first();
    const out = await call(h(edit.action), post(`/engines/${id}/edit`, fourForm({ boreMm: "0" }), builder), { engineId: String(id) });
    expect(out.status).toBe(400);
    expect(refusal(out.body).errors.boreMm).toBe("Bore must be greater than zero");
    expect(await ownerDb()("engines").where({ id }).first()).toEqual(before);
  });

  it("archives: gone from the table and from every engine URL", async () => {
    const made = await call(h(create.action), post("/engines/new", fourForm({ name: "To archive" }), builder));
    const id = Number(made.location!.split("/").pop());
    const out = await call(h(edit.action), post(`/engines/${id}/edit`, { intent: "archive" }, builder), { engineId: String(id) });
    expect(out.status).toBe(302);
    expect(out.location).toBe("/engines");
    expect((await ownerDb()("engines").where({ id }).first()).archived_at).toBeTruthy();
    const table = await call(h(list.loader), get("/engines?q=To%20archive", builder));
    expect((table.body as { total: number }).total).toBe(0);
    const page = await call(h(layout.loader), get(`/engines/${id}`, builder), { engineId: String(id) });
    expect(page.status).toBe(404);
    expect(await ownerDb()("audit_events").where({ action: "engine.archived" }).count({ n: "*" })).toEqual([{ n: 1 }]);
  });
});

describe("roles and tenancy", () => {
  it("a viewer reads an engine shared with them but every write is 403 and writes nothing", async () => {
    // the demo viewer is shown the four-cylinder (migrations/seeds/04-demo-shares.ts); viewers.test.ts covers the rest
    const viewerId = (await ownerDb()("users").where({ email: "viewer@example.com" }).first("id")).id;
    const id = (await ownerDb()("engine_shares").where({ user_id: viewerId }).first("engine_id")).engine_id as number;
    const page = await call(h(layout.loader), get(`/engines/${id}`, viewer), { engineId: String(id) });
    expect(page.status).toBe(200);
    expect((page.body as { canEdit: boolean }).canEdit).toBe(false);
    const table = await call(h(list.loader), get("/engines", viewer));
    expect((table.body as { canEdit: boolean }).canEdit).toBe(false);
    const before = await engineCount();
    const row = await ownerDb()("engines").where({ id }).first();
    expect((await call(h(create.loader), get("/engines/new", viewer))).status).toBe(403);
    expect((await call(h(create.action), post("/engines/new", fourForm(), viewer))).status).toBe(403);
    expect((await call(h(edit.loader), get(`/engines/${id}/edit`, viewer), { engineId: String(id) })).status).toBe(403);
    for (const intent of ["save", "archive"]) {
      const out = await call(h(edit.action), post(`/engines/${id}/edit`, fourForm({ intent }), viewer), { engineId: String(id) });
      expect(out.status).toBe(403);
    }
    expect(await engineCount()).toBe(before);
    expect(await ownerDb()("engines").where({ id }).first()).toEqual(row);
  });

  it("the other shop's member gets 404 for every URL of this shop's engines", async () => {
    const ids = await demoEngineIds();
    expect(ids.length).toBeGreaterThanOrEqual(3);
    for (const id of ids) {
      const params = { engineId: String(id) };
      const before = await ownerDb()("engines").where({ id }).first();
      expect((await call(h(layout.loader), get(`/engines/${id}`, other), params)).status).toBe(404);
      expect((await call(h(overview.loader), get(`/engines/${id}`, other), params)).status).toBe(404);
      expect((await call(h(edit.loader), get(`/engines/${id}/edit`, other), params)).status).toBe(404);
      expect((await call(h(edit.action), post(`/engines/${id}/edit`, fourForm(), other), params)).status).toBe(404);
      expect((await call(h(edit.action), post(`/engines/${id}/edit`, { intent: "archive" }, other), params)).status).toBe(404);
      expect(await ownerDb()("engines").where({ id }).first()).toEqual(before);
    }
    const theirs = await call(h(list.loader), get("/engines", other));
    expect((theirs.body as { rows: { id: number }[] }).rows.map((r) => r.id).filter((id) => ids.includes(id))).toEqual([]);
  });

  it("a made-up engine id is 404", async () => {
    for (const engineId of ["999999", "abc", "1.5"]) {
      expect((await call(h(layout.loader), get(`/engines/${engineId}`, builder), { engineId })).status).toBe(404);
    }
  });
});

describe("the engine table: search, sort, filter, paging", () => {
  const STATUSES = ["quoted", "in-build", "running", "retired"] as const;
  let material = 0;

  beforeAll(async () => {
    // 30 engines in the other shop, so the demo engines do not disturb the counts
    material = (await ownerDb()("materials").where({ team_id: otherTeamId }).first("id")).id;
    const otherOwner = (await ownerDb()("users").where({ email: "other-owner@example.com" }).first("id")).id;
    for (let i = 0; i < 30; i++) {
      const input: EngineInput = EngineSchema.parse({
        name: `Bench engine ${String(i + 1).padStart(2, "0")}`,
        customer: i % 3 === 0 ? "Marsh racing club" : "Private",
        cylinders: 4,
        layout: "inline",
        boreMm: 70 + i,
        strokeMm: 80,
        blockMaterialId: material,
        headMaterialId: material,
        headThicknessAtStudMm: 90,
        sleeveKind: "none",
        studs: defaultStudPattern("inline", 4),
        fuel: i % 2 === 0 ? "Methanol" : "E85",
        targetManifoldKpa: 200 + i,
        peakPressureSource: "estimated",
        status: STATUSES[i % 4],
      });
      await createEngine(otherTeamId, otherOwner, input);
    }
  });

  const table = async (query: string) =>
    (await call(h(list.loader), get(`/engines${query}`, other))).body as {
      rows: { name: string; boreMm: number; status: string; fuel: string; customer: string }[];
      total: number;
      page: number;
    };

  it("pages past 25 rows: page 2 has the last 5", async () => {
    const one = await table("");
    expect(one.total).toBe(30);
    expect(one.rows).toHaveLength(25);
    const two = await table("?page=2");
    expect(two.rows).toHaveLength(5);
    expect(two.page).toBe(2);
    const names = new Set([...one.rows, ...two.rows].map((r) => r.name));
    expect(names.size).toBe(30);
    expect((await table("?page=9")).rows).toHaveLength(0);
    expect((await table("?page=-3")).page).toBe(1);
  });

  it("sorts by bore both ways", async () => {
    const asc = await table("?sort=bore&dir=asc");
    expect(asc.rows.slice(0, 3).map((r) => r.boreMm)).toEqual([70, 71, 72]);
    const desc = await table("?sort=bore&dir=desc");
    expect(desc.rows.slice(0, 3).map((r) => r.boreMm)).toEqual([99, 98, 97]);
    const descPage2 = await table("?sort=bore&dir=desc&page=2");
    expect(descPage2.rows.map((r) => r.boreMm)).toEqual([74, 73, 72, 71, 70]);
  });

  it("sorts by name and ignores a column it does not know", async () => {
    const byName = await table("?sort=name&dir=desc");
    expect(byName.rows[0]!.name).toBe("Bench engine 30");
    const odd = await table("?sort=bore_mm;drop%20table%20engines&dir=sideways");
    expect(odd.total).toBe(30);
  });

  it("filters by status", async () => {
    const running = await table("?status=running");
    expect(running.total).toBe(7); // i = 2, 6, …, 26
    expect(running.rows.every((r) => r.status === "running")).toBe(true);
    const both = await table("?status=retired&q=methanol");
    expect(both.total).toBe(0); // retired are odd i, methanol even i
    expect((await table("?status=nonsense")).total).toBe(30);
  });

  it("searches name, customer and fuel", async () => {
    expect((await table("?q=methanol")).total).toBe(15);
    expect((await table("?q=marsh%20racing")).total).toBe(10);
    expect((await table("?q=engine%2007")).rows.map((r) => r.name)).toEqual(["Bench engine 07"]);
    expect((await table("?q=%25")).total).toBe(0); // a literal %, not a wildcard
  });

  it("listEngines never returns another team's rows", async () => {
    const demo = await listEngines(teamWide(demoTeamId), { q: "Bench engine", pageSize: 100 });
    expect(demo.total).toBe(0);
  });
});
