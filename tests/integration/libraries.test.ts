import { beforeAll, describe, expect, it } from "vitest";
import * as edit from "~/routes/libraries/edit";
import * as index from "~/routes/libraries/index";
import * as layout from "~/routes/libraries/layout";
import * as list from "~/routes/libraries/list";
import { createUserWithTeam } from "~/models/user.server";
import { call, get, post, signIn, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";

const cookies: Record<"viewer" | "builder" | "owner" | "other", string> = { viewer: "", builder: "", owner: "", other: "" };
let teamId = 0;
let otherTeamId = 0;
let studSteelId = 0;
let builderId = 0;

beforeAll(async () => {
  cookies.viewer = await signIn("viewer@example.com");
  cookies.builder = await signIn("builder@example.com");
  cookies.owner = await signIn("owner@example.com");
  cookies.other = await signIn("other-owner@example.com");
  teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  otherTeamId = (await ownerDb()("teams").where({ name: "Saltmarsh Dyno Cell" }).first("id")).id;
  studSteelId = (await ownerDb()("materials").where({ team_id: teamId, name: "Alloy steel stud, ISO 898-1 class 12.9" }).first("id")).id;
  builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
});

const h = (fn: unknown) => fn as Handler;
const listPage = (kind: string, cookie: string, query = "") => call(h(list.loader), get(`/libraries/${kind}${query}`, cookie), { kind });
const newPage = (kind: string, cookie: string) => call(h(edit.loader), get(`/libraries/${kind}/new`, cookie), { kind });
const editPage = (kind: string, id: number, cookie: string) =>
  call(h(edit.loader), get(`/libraries/${kind}/${id}`, cookie), { kind, itemId: String(id) });
const create = (kind: string, fields: Record<string, string>, cookie: string) =>
  call(h(edit.action), post(`/libraries/${kind}/new`, { intent: "save", ...fields }, cookie), { kind });
const update = (kind: string, id: number, fields: Record<string, string>, cookie: string) =>
  call(h(edit.action), post(`/libraries/${kind}/${id}`, fields, cookie), { kind, itemId: String(id) });

const count = async (table: string) => Number((await ownerDb()(table).count<{ n: number }[]>({ n: "*" }))[0]!.n);

const material = (over: Record<string, string> = {}) => ({
  name: "Shop test: 2618-T61 forged aluminium",
  kind: "aluminium",
  modulusMpa: "73.8", // GPa on the form (metric)
  yieldMpa: "372",
  expansionUmPerMC: "22.3",
  limitingSurfacePressureMpa: "",
  ...over,
});

const fastener = (over: Record<string, string> = {}) => ({
  name: "Shop test: M11×1.5 stud",
  threadSystem: "metric",
  diameterMm: "11",
  pitchMm: "1.5",
  reducedShankDiameterMm: "",
  reducedShankLengthMm: "0",
  freeThreadLengthMm: "15",
  engagementMm: "22",
  materialId: String(studSteelId),
  washerOdMm: "20",
  washerHoleMm: "11.5",
  washerThicknessMm: "3",
  makerTorqueNm: "120",
  makerLubricant: "Moly assembly paste",
  makerStages: "40, 80, then 120 N·m",
  makerStretchMm: "",
  threadFriction: "0.11",
  bearingFriction: "0.12",
  ...over,
});

const gasket = (over: Record<string, string> = {}) => ({
  name: "Shop test: MLS 1.0 mm, 84 mm bore",
  type: "mls",
  compressedThicknessMm: "1.0",
  boreMm: "84",
  sealDiameterMm: "88",
  ringWidthMm: "2.5",
  ringModulusMpa: "193",
  sealLineYieldMpa: "1000",
  bodyModulusMpa: "5",
  bodyAreaPerBoreMm2: "3500",
  expansionUmPerMC: "17.3",
  m: "3",
  yMpa: "68.9",
  relaxationPercent: "1",
  finishMinRaUm: "0.5",
  finishMaxRaUm: "1.3",
  ...over,
});

describe("library pages for the builder", () => {
  it("/libraries sends the builder to the fasteners tab", async () => {
    const out = await call(h(index.loader), get("/libraries", cookies.builder));
    expect(out.status).toBe(302);
    expect(out.location).toBe("/libraries/fasteners");
  });

  it("lists the seeded materials with their handbook sources", async () => {
    const out = await listPage("materials", cookies.builder);
    expect(out.status).toBe(200);
    const rows = (out.body as { rows: { name: string; source: string | null; modulusMpa: number }[] }).rows;
    expect(rows).toHaveLength(10);
    const a356 = rows.find((r) => r.name === "A356.0-T6 cast aluminium")!;
    expect(a356.modulusMpa).toBe(72_400);
    expect(a356.source).toMatch(/Aluminum Association data via MatWeb/);
    expect(a356.source).toMatch(/AlSi7Mg/);
    for (const r of rows) expect(r.source).toBeTruthy();
  });

  it("lists the demo fasteners with the maker's figures marked as invented demo data", async () => {
    const out = await listPage("fasteners", cookies.builder);
    const rows = (out.body as { rows: { name: string; source: string; makerTorqueNm: number; materialName: string }[] }).rows;
    expect(rows.length).toBe(6);
    for (const r of rows) expect(r.source).toMatch(/demo data \(invented\)/);
    const m12 = rows.find((r) => r.name.startsWith("M12×1.5"))!;
    expect(m12.makerTorqueNm).toBe(150);
    expect(m12.materialName).toBe("Alloy steel stud, ISO 898-1 class 12.9");
  });

  it("lists the demo gaskets with m and y marked as flange design values", async () => {
    const rows = ((await listPage("gaskets", cookies.builder)).body as { rows: { source: string; m: number }[] }).rows;
    expect(rows.length).toBe(5);
    for (const r of rows) expect(r.source).toMatch(/ASME VIII-1 App. 2 Table 2-5.1.*flange design values/);
  });

  it("an unknown library is a 404", async () => {
    expect((await listPage("washers", cookies.builder)).status).toBe(404);
    expect((await newPage("washers", cookies.builder)).status).toBe(404);
    expect((await create("washers", material(), cookies.builder)).status).toBe(404);
  });

  it("the owner may use the libraries too", async () => {
    expect((await listPage("gaskets", cookies.owner)).status).toBe(200);
    expect((await call(h(layout.loader), get("/libraries/gaskets", cookies.owner))).status).toBe(200);
  });
});

describe("create, edit, archive", () => {
  it("materials: create in display units, edit, archive and bring back", async () => {
    const out = await create("materials", material(), cookies.builder);
    expect(out.status).toBe(302);
    expect(out.location).toBe("/libraries/materials");
    expect(out.setCookie).toMatch(/sw_toast=/);
    const row = await ownerDb()("materials").where({ team_id: teamId, name: "Shop test: 2618-T61 forged aluminium" }).first();
    expect(row.modulus_mpa).toBeCloseTo(73_800, 9);
    expect(row.yield_mpa).toBe(372);
    expect(row.limiting_surface_pressure_mpa).toBeNull();
    expect(row.source).toBeNull();
    expect(row.entered_by).toBe(builderId);
    expect(await ownerDb()("audit_events").where({ team_id: teamId, action: "material.created" }).first()).toBeTruthy();

    const shown = (await listPage("materials", cookies.builder)).body as { rows: { id: number; enteredByName: string; source: null }[] };
    const mine = shown.rows.find((r) => r.id === row.id)!;
    expect(mine.source).toBeNull();
    expect(mine.enteredByName).toBe("Teo Vastrick");

    const page = await editPage("materials", row.id, cookies.builder);
    expect(page.status).toBe(200);
    const loaded = page.body as { values: Record<string, string>; item: { provenance: string } };
    expect(loaded.values.modulusMpa).toBe("73.8");
    expect(loaded.item.provenance).toBe("entered by Teo Vastrick");

    expect((await update("materials", row.id, { intent: "save", ...material({ yieldMpa: "380" }) }, cookies.builder)).status).toBe(302);
    expect((await ownerDb()("materials").where({ id: row.id }).first()).yield_mpa).toBe(380);

    expect((await update("materials", row.id, { intent: "archive" }, cookies.builder)).status).toBe(302);
    expect((await ownerDb()("materials").where({ id: row.id }).first()).archived_at).not.toBeNull();
    const active = (await listPage("materials", cookies.builder)).body as { rows: { id: number }[] };
    expect(active.rows.map((r) => r.id)).not.toContain(row.id);
    const all = (await listPage("materials", cookies.builder, "?archived=1")).body as { rows: { id: number }[]; showArchived: boolean };
    expect(all.showArchived).toBe(true);
    expect(all.rows.map((r) => r.id)).toContain(row.id);

    expect((await update("materials", row.id, { intent: "unarchive" }, cookies.builder)).status).toBe(302);
    expect((await ownerDb()("materials").where({ id: row.id }).first()).archived_at).toBeNull();
    const actions = (await ownerDb()("audit_events").where({ team_id: teamId }).whereLike("action", "material.%")).map(
      (a: { action: string }) => a.action,
    );
    expect(actions).toEqual(expect.arrayContaining(["material.created", "material.updated", "material.archived", "material.unarchived"]));
  });

  it("fasteners: create with the maker's figures, edit, archive", async () => {
    const out = await create("fasteners", fastener(), cookies.builder);
    expect(out.status).toBe(302);
    const row = await ownerDb()("fasteners").where({ team_id: teamId, name: "Shop test: M11×1.5 stud" }).first();
    expect(row).toMatchObject({
      diameter_mm: 11,
      pitch_mm: 1.5,
      maker_torque_nm: 120,
      maker_lubricant: "Moly assembly paste",
      material_id: studSteelId,
    });
    expect(row.reduced_shank_diameter_mm).toBeNull();
    expect((await update("fasteners", row.id, { intent: "save", ...fastener({ makerTorqueNm: "125" }) }, cookies.builder)).status).toBe(
      302,
    );
    expect((await ownerDb()("fasteners").where({ id: row.id }).first()).maker_torque_nm).toBe(125);
    expect((await update("fasteners", row.id, { intent: "archive" }, cookies.builder)).status).toBe(302);
    expect((await ownerDb()("fasteners").where({ id: row.id }).first()).archived_at).not.toBeNull();
    expect(await ownerDb()("audit_events").where({ team_id: teamId, action: "fastener.archived" }).first()).toBeTruthy();
  });

  it("gaskets: create, edit, archive", async () => {
    expect((await create("gaskets", gasket(), cookies.builder)).status).toBe(302);
    const row = await ownerDb()("gaskets").where({ team_id: teamId, name: "Shop test: MLS 1.0 mm, 84 mm bore" }).first();
    expect(row.ring_modulus_mpa).toBeCloseTo(193_000, 9);
    expect(row.body_modulus_mpa).toBeCloseTo(5_000, 9);
    expect(row.finish_max_ra_um).toBe(1.3);
    expect(
      (await update("gaskets", row.id, { intent: "save", ...gasket({ compressedThicknessMm: "1.05" }) }, cookies.builder)).status,
    ).toBe(302);
    expect((await ownerDb()("gaskets").where({ id: row.id }).first()).compressed_thickness_mm).toBe(1.05);
    expect((await update("gaskets", row.id, { intent: "archive" }, cookies.builder)).status).toBe(302);
    expect((await ownerDb()("gaskets").where({ id: row.id }).first()).archived_at).not.toBeNull();
  });

  it("editing a handbook row keeps its source and says who edited it", async () => {
    const row = await ownerDb()("materials").where({ team_id: teamId, name: "6061-T6 wrought aluminium" }).first();
    const page = (await editPage("materials", row.id, cookies.builder)).body as {
      values: Record<string, string>;
      item: { seeded: boolean };
    };
    expect(page.item.seeded).toBe(true);
    expect((await update("materials", row.id, { intent: "save", ...page.values, yieldMpa: "275" }, cookies.builder)).status).toBe(302);
    const after = await ownerDb()("materials").where({ id: row.id }).first();
    expect(after.source).toBe(row.source);
    const listed = ((await listPage("materials", cookies.builder)).body as { rows: { id: number; enteredByName: string }[] }).rows.find(
      (r) => r.id === row.id,
    )!;
    expect(listed.enteredByName).toBe("Teo Vastrick");
  });
});

describe("imperial input is stored as SI", () => {
  it("½ in → 12.7 mm, 20 threads per inch → 1.27 mm, 110 lbf·ft → 149.14 N·m, 7 thou → 0.1778 mm", async () => {
    await ownerDb()("users").where({ id: builderId }).update({ units: "imperial" });
    try {
      const out = await create(
        "fasteners",
        fastener({
          name: "Shop test: ½-20 imperial entry",
          threadSystem: "unified",
          diameterMm: "0.5",
          pitchMm: "20",
          freeThreadLengthMm: "0.75",
          engagementMm: "1",
          washerOdMm: "0.875",
          washerHoleMm: "0.53",
          washerThicknessMm: "0.125",
          makerTorqueNm: "110",
          makerStretchMm: "7",
        }),
        cookies.builder,
      );
      expect(out.status).toBe(302);
      const row = await ownerDb()("fasteners").where({ team_id: teamId, name: "Shop test: ½-20 imperial entry" }).first();
      expect(Math.abs(row.diameter_mm - 12.7)).toBeLessThan(1e-9);
      expect(Math.abs(row.pitch_mm - 1.27)).toBeLessThan(1e-9);
      expect(Math.abs(row.free_thread_length_mm - 19.05)).toBeLessThan(1e-9);
      // 1 lbf·ft = 0.3048 m × 4.4482216152605 N exactly (NIST SP 811)
      expect(Math.abs(row.maker_torque_nm - 110 * 0.3048 * 4.4482216152605)).toBeLessThan(1e-9);
      expect(Math.abs(row.maker_stretch_mm - 0.1778)).toBeLessThan(1e-9);

      // a unit typed after the number wins over the field's unit (display units via convert-units)
      const typed = await create(
        "fasteners",
        fastener({
          name: "Shop test: typed units",
          threadSystem: "unified",
          diameterMm: "11.1125 mm",
          pitchMm: "20",
          reducedShankDiameterMm: "",
          reducedShankLengthMm: "0 mm",
          freeThreadLengthMm: "15 mm",
          engagementMm: "22 mm",
          washerOdMm: "20 mm",
          washerHoleMm: "0.5 in",
          washerThicknessMm: "3 mm",
          makerTorqueNm: "150 N·m",
        }),
        cookies.builder,
      );
      expect(typed.status).toBe(302);
      const t = await ownerDb()("fasteners").where({ team_id: teamId, name: "Shop test: typed units" }).first();
      expect(t.diameter_mm).toBeCloseTo(11.1125, 9);
      expect(t.washer_hole_mm).toBeCloseTo(12.7, 6);
      expect(t.maker_torque_nm).toBeCloseTo(150, 9);

      // and it reads back in the same units
      const page = (await editPage("fasteners", row.id, cookies.builder)).body as { values: Record<string, string> };
      expect(page.values.diameterMm).toBe("0.5");
      expect(page.values.pitchMm).toBe("20");
      expect(page.values.makerTorqueNm).toBe("110");

      expect(
        (
          await create(
            "materials",
            material({ name: "Shop test: imperial steel", kind: "steel", modulusMpa: "29.7", yieldMpa: "130", expansionUmPerMC: "6.7" }),
            cookies.builder,
          )
        ).status,
      ).toBe(302);
      const steel = await ownerDb()("materials").where({ team_id: teamId, name: "Shop test: imperial steel" }).first();
      // 1 ksi = 1000 lbf/in² = 6.894757293168 MPa (NIST SP 811 definitions)
      expect(steel.modulus_mpa).toBeCloseTo(29.7 * 6894.757293168, 6); // Mpsi → MPa
      expect(steel.yield_mpa).toBeCloseTo(130 * 6.894757293168, 9); // ksi → MPa
      expect(steel.expansion_um_per_m_c).toBeCloseTo(6.7 * 1.8, 9); // µin/in·°F → µm/m·°C
    } finally {
      await ownerDb()("users").where({ id: builderId }).update({ units: "metric" });
    }
  });
});

describe("invalid input → 400 with messages, nothing written", () => {
  const cases: { kind: string; fields: Record<string, string>; field: string; message: RegExp; table: string }[] = [
    {
      kind: "fasteners",
      fields: fastener({ diameterMm: "4", pitchMm: "4" }),
      field: "pitchMm",
      message: /smaller than the diameter/,
      table: "fasteners",
    },
    {
      kind: "fasteners",
      fields: fastener({ pitchMm: "3.5" }),
      field: "pitchMm",
      message: /too coarse for a 11 mm thread/,
      table: "fasteners",
    },
    {
      kind: "fasteners",
      fields: fastener({ reducedShankDiameterMm: "11.5", reducedShankLengthMm: "40" }),
      field: "reducedShankDiameterMm",
      message: /narrower than the thread/,
      table: "fasteners",
    },
    {
      kind: "fasteners",
      fields: fastener({ reducedShankLengthMm: "40" }),
      field: "reducedShankDiameterMm",
      message: /Give the reduced shank diameter/,
      table: "fasteners",
    },
    {
      kind: "fasteners",
      fields: fastener({ washerHoleMm: "10" }),
      field: "washerHoleMm",
      message: /at least the stud diameter/,
      table: "fasteners",
    },
    { kind: "fasteners", fields: fastener({ washerOdMm: "11" }), field: "washerOdMm", message: /larger than its hole/, table: "fasteners" },
    { kind: "fasteners", fields: fastener({ materialId: "" }), field: "materialId", message: /Pick the stud material/, table: "fasteners" },
    { kind: "fasteners", fields: fastener({ threadFriction: "0.9" }), field: "threadFriction", message: /at most 0.6/, table: "fasteners" },
    { kind: "fasteners", fields: fastener({ diameterMm: "twelve" }), field: "diameterMm", message: /must be a number/, table: "fasteners" },
    {
      kind: "gaskets",
      fields: gasket({ sealDiameterMm: "85" }),
      field: "sealDiameterMm",
      message: /outside the gasket bore/,
      table: "gaskets",
    },
    {
      kind: "gaskets",
      fields: gasket({ finishMinRaUm: "2", finishMaxRaUm: "1" }),
      field: "finishMaxRaUm",
      message: /at least the smoothest/,
      table: "gaskets",
    },
    { kind: "gaskets", fields: gasket({ type: "cardboard" }), field: "type", message: /Pick the gasket type/, table: "gaskets" },
    { kind: "materials", fields: material({ modulusMpa: "" }), field: "modulusMpa", message: /Enter the modulus/, table: "materials" },
    { kind: "materials", fields: material({ name: "  " }), field: "name", message: /Give it a name/, table: "materials" },
    {
      kind: "materials",
      fields: material({ expansionUmPerMC: "-3" }),
      field: "expansionUmPerMC",
      message: /greater than zero/,
      table: "materials",
    },
  ];
  for (const c of cases) {
    it(`${c.kind}: ${c.field} → ${c.message}`, async () => {
      const before = await count(c.table);
      const out = await create(c.kind, c.fields, cookies.builder);
      expect(out.status).toBe(400);
      const { result } = out.body as { result: { error: Record<string, string[]>; initialValue: Record<string, string> } };
      expect(result.error[c.field]![0]).toMatch(c.message);
      expect(result.initialValue.name).toBe(c.fields.name);
      expect(await count(c.table)).toBe(before);
    });
  }

  it("an invalid edit leaves the row as it was", async () => {
    const row = await ownerDb()("gaskets").where({ team_id: teamId }).first();
    const out = await update("gaskets", row.id, { intent: "save", ...gasket({ ringWidthMm: "0" }) }, cookies.builder);
    expect(out.status).toBe(400);
    expect((out.body as { result: { error: Record<string, string[]> } }).result.error.ringWidthMm![0]).toMatch(/greater than zero/);
    expect(await ownerDb()("gaskets").where({ id: row.id }).first()).toEqual(row);
  });

  it("a fastener cannot use another shop's material", async () => {
    const theirs = await ownerDb()("materials").where({ team_id: otherTeamId }).first("id");
    const before = await count("fasteners");
    const out = await create("fasteners", fastener({ materialId: String(theirs.id) }), cookies.builder);
    expect(out.status).toBe(400);
    expect((out.body as { result: { error: Record<string, string[]> } }).result.error.materialId![0]).toMatch(/this shop's materials/);
    expect(await count("fasteners")).toBe(before);
  });
});

describe("viewers may not use the libraries", () => {
  it("a viewer reads every library page, read-only, but cannot open the new-row form", async () => {
    const someFastener = await ownerDb()("fasteners").where({ team_id: teamId }).first("id");
    expect((await call(h(layout.loader), get("/libraries/fasteners", cookies.viewer))).status).toBe(200);
    for (const kind of ["fasteners", "gaskets", "materials"]) {
      const out = await listPage(kind, cookies.viewer);
      expect(out.status).toBe(200);
      expect((out.body as { canEdit: boolean }).canEdit).toBe(false);
    }
    const item = await editPage("fasteners", someFastener.id, cookies.viewer);
    expect(item.status).toBe(200);
    expect((item.body as { canEdit: boolean }).canEdit).toBe(false);
    expect((await newPage("fasteners", cookies.viewer)).status).toBe(403);
    const builderView = await listPage("fasteners", cookies.builder);
    expect((builderView.body as { canEdit: boolean }).canEdit).toBe(true);
  });

  it("a viewer's writes are 403 and write nothing", async () => {
    const before = { m: await count("materials"), f: await count("fasteners"), g: await count("gaskets") };
    expect((await create("materials", material({ name: "Viewer material" }), cookies.viewer)).status).toBe(403);
    expect((await create("fasteners", fastener({ name: "Viewer fastener" }), cookies.viewer)).status).toBe(403);
    expect((await create("gaskets", gasket({ name: "Viewer gasket" }), cookies.viewer)).status).toBe(403);
    const g = await ownerDb()("gaskets").where({ team_id: teamId }).first();
    expect((await update("gaskets", g.id, { intent: "archive" }, cookies.viewer)).status).toBe(403);
    expect((await update("gaskets", g.id, { intent: "save", ...gasket({ name: "Viewer rename" }) }, cookies.viewer)).status).toBe(403);
    expect(await ownerDb()("gaskets").where({ id: g.id }).first()).toEqual(g);
    expect({ m: await count("materials"), f: await count("fasteners"), g: await count("gaskets") }).toEqual(before);
  });
});

describe("another shop's rows are not found", () => {
  for (const [kind, table, fields] of [
    ["materials", "materials", material({ name: "Hijacked" })],
    ["fasteners", "fasteners", fastener({ name: "Hijacked" })],
    ["gaskets", "gaskets", gasket({ name: "Hijacked" })],
  ] as const) {
    it(`${kind}: the other team's member gets 404 on load, save, archive and unarchive`, async () => {
      const row = await ownerDb()(table).where({ team_id: teamId }).first();
      expect((await editPage(kind, row.id, cookies.other)).status).toBe(404);
      expect((await update(kind, row.id, { intent: "save", ...fields }, cookies.other)).status).toBe(404);
      expect((await update(kind, row.id, { intent: "archive" }, cookies.other)).status).toBe(404);
      expect((await update(kind, row.id, { intent: "unarchive" }, cookies.other)).status).toBe(404);
      expect(await ownerDb()(table).where({ id: row.id }).first()).toEqual(row);
      const theirList = (await listPage(kind, cookies.other, "?archived=1")).body as { rows: { id: number; teamId: number }[] };
      expect(theirList.rows.map((r) => r.id)).not.toContain(row.id);
      for (const r of theirList.rows) expect(r.teamId).toBe(otherTeamId);
    });
  }

  it("a row id that does not exist is a 404 too", async () => {
    expect((await editPage("gaskets", 999_999, cookies.builder)).status).toBe(404);
    expect((await editPage("gaskets", Number.NaN, cookies.builder)).status).toBe(404);
  });
});

describe("a new shop starts with the handbook library", () => {
  it("sign-up seeds materials, fasteners and gaskets for the new team only", async () => {
    const before = await count("materials");
    const { teamId: fresh } = await createUserWithTeam({
      email: "new-shop@example.com",
      name: "Dana Pellow",
      password: "a-long-enough-password",
      teamName: "Fresh Shop",
    });
    expect((await ownerDb()("materials").where({ team_id: fresh })).length).toBe(10);
    expect((await ownerDb()("fasteners").where({ team_id: fresh })).length).toBe(6);
    expect((await ownerDb()("gaskets").where({ team_id: fresh })).length).toBe(5);
    expect(await count("materials")).toBe(before + 10);
    const f = await ownerDb()("fasteners").where({ team_id: fresh });
    const ownMaterials = new Set((await ownerDb()("materials").where({ team_id: fresh })).map((m: { id: number }) => m.id));
    for (const row of f) expect(ownMaterials.has(row.material_id)).toBe(true);
  });
});
