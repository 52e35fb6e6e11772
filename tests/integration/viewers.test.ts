import { beforeAll, describe, expect, it } from "vitest";
import * as list from "~/routes/engines/list";
import * as layout from "~/routes/engines/layout";
import * as overview from "~/routes/engines/overview";
import * as plans from "~/routes/plans/list";
import * as editor from "~/routes/plans/editor";
import * as chamber from "~/routes/engines/chamber";
import * as sheet from "~/routes/engines/build-sheet";
import * as sharing from "~/routes/engines/sharing";
import * as dashboard from "~/routes/shop/dashboard";
import * as mailbox from "~/routes/dev/mailbox";
import { getEnv, mailboxOpen } from "~/utils/env.server";
import { call, get, post, signIn, type Handler } from "./helpers";
import { linkPath, startTestSink } from "./mail";
import { ownerDb } from "../setup/db-roles";
import { answerFields } from "./conform-answer";

// Viewers see only the engines shared with them, enforced in the engine model (issue 12); sharing is
// a builder's; the build sheet and its e-mail.

let sink: Awaited<ReturnType<typeof startTestSink>>;
const cookies = { viewer: "", builder: "", owner: "", other: "" };
let shared = 0;
let unshared = 0;
let viewerId = 0;
const h = (f: unknown) => f as Handler;

beforeAll(async () => {
  sink = await startTestSink();
  for (const [k, email] of [
    ["viewer", "viewer@example.com"],
    ["builder", "builder@example.com"],
    ["owner", "owner@example.com"],
    ["other", "other-owner@example.com"],
  ] as const)
    cookies[k] = await signIn(email);
  const team = await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
  shared = (await ownerDb()("engines").where({ team_id: team.id, name: "Fenwick-Oddy 2.0 four" }).first("id")).id;
  unshared = (await ownerDb()("engines").where({ team_id: team.id, cylinders: 6 }).first("id")).id;
  viewerId = (await ownerDb()("users").where({ email: "viewer@example.com" }).first("id")).id;
  return () => sink.close();
});

const engineNames = async (cookie: string) =>
  ((await call(h(list.loader), get("/engines", cookie))).body as { rows: { name: string }[] }).rows.map((r) => r.name).sort();

describe("what a viewer sees", () => {
  it("lists only the engines shared with them; builders and owners list all three", async () => {
    expect(await engineNames(cookies.viewer)).toEqual(["Fenwick-Oddy 2.0 four"]);
    expect(await engineNames(cookies.builder)).toHaveLength(3);
    expect(await engineNames(cookies.owner)).toHaveLength(3);
    const dash = (await call(h(dashboard.loader), get("/dashboard", cookies.viewer))).body as {
      counts: Record<string, number>;
      recent: unknown[];
      events: unknown[];
      atRisk: { engineId: number }[];
    };
    expect(Object.values(dash.counts).reduce((a, b) => a + b, 0)).toBe(1);
    expect(dash.recent).toHaveLength(1);
    expect(dash.events).toEqual([]);
    expect(dash.atRisk.every((v) => v.engineId === shared)).toBe(true);
  });

  it("gets 404 for every page of an unshared engine, and 200 for the shared one", async () => {
    const plan = await ownerDb()("seal_plans").where({ engine_id: unshared }).first("id");
    const sharedPlan = await ownerDb()("seal_plans").where({ engine_id: shared }).first("id");
    for (const [loader, path, params] of [
      [layout.loader, `/engines/${unshared}`, {}],
      [overview.loader, `/engines/${unshared}`, {}],
      [plans.loader, `/engines/${unshared}/plans`, {}],
      [editor.loader, `/engines/${unshared}/plans/${plan.id}`, { planId: String(plan.id) }],
      [chamber.loader, `/engines/${unshared}/chamber`, {}],
      [sheet.loader, `/engines/${unshared}/build-sheet`, {}],
    ] as const) {
      expect((await call(h(loader), get(path, cookies.viewer), { engineId: String(unshared), ...params })).status, path).toBe(404);
    }
    expect(
      (await call(h(editor.loader), get("/", cookies.viewer), { engineId: String(shared), planId: String(sharedPlan.id) })).status,
    ).toBe(200);
    expect((await call(h(overview.loader), get("/", cookies.viewer), { engineId: String(shared) })).status).toBe(200);
  });
});

describe("sharing an engine", () => {
  it("is a builder's: sharing the six makes it appear for the viewer, stopping hides it again", async () => {
    const share = (value: string, cookie: string, engineId = unshared, id = viewerId) =>
      call(h(sharing.action), post("/", { viewerId: String(id), shared: value }, cookie), { engineId: String(engineId) });
    expect((await share("true", cookies.viewer)).status).toBe(403);
    expect(await engineNames(cookies.viewer)).toEqual(["Fenwick-Oddy 2.0 four"]);
    expect((await share("true", cookies.builder)).status).toBe(302);
    expect(await engineNames(cookies.viewer)).toHaveLength(2);
    const page = (await call(h(sharing.loader), get("/", cookies.builder), { engineId: String(unshared) })).body as {
      viewers: { userId: number; shared: boolean }[];
    };
    expect(page.viewers).toEqual([expect.objectContaining({ userId: viewerId, shared: true })]);
    expect((await share("false", cookies.builder)).status).toBe(302);
    expect(await engineNames(cookies.viewer)).toEqual(["Fenwick-Oddy 2.0 four"]);
  });

  it("refuses a non-viewer, another shop's engine (404) and bad input (400), writing nothing", async () => {
    const before = JSON.stringify(await ownerDb()("engine_shares").orderBy(["engine_id", "user_id"]));
    const builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
    const otherEngine =
      (
        await ownerDb()("engines")
          .whereNot({ team_id: (await ownerDb()("engines").where({ id: shared }).first("team_id")).team_id })
          .first("id")
      )?.id ?? 999_999;
    expect(
      (
        await call(h(sharing.action), post("/", { viewerId: String(builderId), shared: "true" }, cookies.builder), {
          engineId: String(unshared),
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await call(h(sharing.action), post("/", { viewerId: String(viewerId), shared: "true" }, cookies.other), {
          engineId: String(shared),
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await call(h(sharing.action), post("/", { viewerId: String(viewerId), shared: "true" }, cookies.builder), {
          engineId: String(otherEngine),
        })
      ).status,
    ).toBe(404);
    const bad = await call(h(sharing.action), post("/", { viewerId: "x", shared: "maybe" }, cookies.builder), {
      engineId: String(unshared),
    });
    expect(bad.status).toBe(400);
    expect(answerFields(bad.body)).toEqual(["shared", "viewerId"]);
    expect(JSON.stringify(await ownerDb()("engine_shares").orderBy(["engine_id", "user_id"]))).toBe(before);
  });
});

describe("the build sheet", () => {
  it("shows the chosen plan with the estimate, the maker's figures and the chamber", async () => {
    const out = await call(h(sheet.loader), get("/", cookies.viewer), { engineId: String(shared) });
    expect(out.status).toBe(200);
    const body = out.body as {
      canSend: boolean;
      sheet: {
        ok: true;
        plan: { id: number };
        view: { estimate: { cylinders: { clampN: number; sealMargin: number }[]; verdict: { status: string } } };
        chamber: { compressionRatio: number } | null;
        fastener: { makerTorqueNm: number | null };
      };
    };
    const engine = await ownerDb()("engines").where({ id: shared }).first("chosen_plan_id");
    expect(body.canSend).toBe(false);
    expect(body.sheet.ok).toBe(true);
    expect(body.sheet.plan.id).toBe(engine.chosen_plan_id);
    expect(body.sheet.view.estimate.cylinders).toHaveLength(4);
    for (const c of body.sheet.view.estimate.cylinders) expect(c.clampN).toBeGreaterThan(50_000);
    expect(body.sheet.chamber!.compressionRatio).toBeGreaterThan(7);
    expect(body.sheet.chamber!.compressionRatio).toBeLessThan(14);
    // the maker's 125 lbf·ft (169.5 N·m) is on the sheet beside ours
    expect(body.sheet.fastener.makerTorqueNm).toBeCloseTo(169.5, 0);
  });

  it("is e-mailed by a builder to a viewer it is shared with: a summary and a sign-in link", async () => {
    const out = await call(
      h(sheet.action),
      post("/", { viewerId: String(viewerId), note: "Here is the plan we settled on." }, cookies.builder),
      { engineId: String(shared) },
    );
    expect(out.status).toBe(302);
    const [mail] = await sink.waitFor("viewer@example.com");
    expect(mail!.subject).toBe("Build sheet: Fenwick-Oddy 2.0 four — Harrow Lane Boost Works");
    expect(linkPath(mail!, "/engines/")).toBe(`/engines/${shared}/build-sheet`);
    expect(mail!.text).toContain("Here is the plan we settled on.");
    expect(mail!.text).toMatch(/Weakest seal margin: \d\.\d\d on cylinder \d/);
    expect(mail!.text).toContain("Maker's torque: 169 N·m (stages: 45, 90, then 125 lbf·ft, centre outward)");
    expect(mail!.html).toContain("Open the build sheet");
    expect(mail!.html).not.toMatch(/<img|src=/i);
  });

  it("is not sent to a viewer the engine is not shared with (404), nor by a viewer (403), nor with bad input (400)", async () => {
    const before = sink.messagesTo("viewer@example.com").length;
    expect(
      (await call(h(sheet.action), post("/", { viewerId: String(viewerId) }, cookies.builder), { engineId: String(unshared) })).status,
    ).toBe(404);
    expect(
      (await call(h(sheet.action), post("/", { viewerId: String(viewerId) }, cookies.viewer), { engineId: String(shared) })).status,
    ).toBe(403);
    const bad = await call(h(sheet.action), post("/", { viewerId: "", note: "x".repeat(1001) }, cookies.builder), {
      engineId: String(shared),
    });
    expect(bad.status).toBe(400);
    expect(answerFields(bad.body)).toEqual(["note", "viewerId"]);
    await new Promise((r) => setTimeout(r, 100));
    expect(sink.messagesTo("viewer@example.com")).toHaveLength(before);
  });
});

describe("the development mailbox", () => {
  it("lists what the sink caught and shows one message's HTML; a production build has none", async () => {
    const out = await call(h(mailbox.loader), get("/dev/mailbox"));
    const body = out.body as { messages: { id: string; subject: string }[] };
    expect(body.messages.length).toBeGreaterThan(0);
    const first = body.messages[0]!;
    const open = await call(h(mailbox.loader), get(`/dev/mailbox?id=${first.id}`));
    expect((open.body as { open: { html: string } }).open.html).toContain("<html");
    expect(mailboxOpen({ ...getEnv(), NODE_ENV: "production" })).toBe(false);
    expect(mailboxOpen({ ...getEnv(), NODE_ENV: "production", DEV_MAILBOX: "true" })).toBe(true);
  });
});
