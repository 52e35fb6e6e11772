import { beforeAll, describe, expect, it } from "vitest";
import * as invite from "~/routes/auth/invite";
import * as team from "~/routes/shop/team";
import * as dashboard from "~/routes/shop/dashboard";
import { hashLinkToken } from "~/utils/tokens.server";
import { call, cookiePair, get, post, signIn, type Handler } from "./helpers";
import { linkPath, startTestSink } from "./mail";
import { ownerDb } from "../setup/db-roles";
import { answerError, answerValues } from "./conform-answer";

// Invites by e-mail (through a real SMTP sink), accepting them, roles and removal (issue 12).

let sink: Awaited<ReturnType<typeof startTestSink>>;
let owner = "";
let otherOwner = "";
let demoTeamId = 0;
const teamAction = team.action as Handler;
const PASSWORD = "a sentence for the bench";

beforeAll(async () => {
  sink = await startTestSink();
  owner = await signIn("owner@example.com");
  otherOwner = await signIn("other-owner@example.com");
  demoTeamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
  return () => sink.close();
});

/** The owner invites this address; returns the path of the link in the mail. */
async function inviteByMail(email: string, role: string, cookie = owner): Promise<string> {
  const before = sink.messagesTo(email).length;
  const out = await call(teamAction, post("/team", { intent: "invite", email, role }, cookie));
  expect(out.status, JSON.stringify(out.body)).toBe(302);
  const [mail] = await sink.waitFor(email, before + 1);
  return linkPath(mail!, "/invite/");
}

const tokenOf = (path: string) => path.split("/").pop()!;
const acceptNew = (path: string, fields: Record<string, string>, cookie?: string) =>
  call(invite.action as Handler, post(path, { intent: "create", ...fields }, cookie), { token: tokenOf(path) });
const page = (path: string, cookie?: string) => call(invite.loader as Handler, get(path, cookie), { token: tokenOf(path) });

describe("inviting by e-mail", () => {
  it("mails a single-use link (plain text and HTML, no remote content); a new person accepts and is in the shop", async () => {
    const path = await inviteByMail("new-viewer@example.com", "viewer");
    const [mail] = sink.messagesTo("new-viewer@example.com");
    expect(mail!.subject).toBe("Mara Quillon invites you to Harrow Lane Boost Works on Sealwright");
    expect(mail!.text).toContain("works once and for 7 days");
    expect(mail!.html).toContain(path);
    // no tracking: nothing in the HTML is fetched from anywhere
    expect(mail!.html).not.toMatch(/<img|src=|url\(/i);
    // only the token's hash is stored
    const row = await ownerDb()("team_invites").where({ email: "new-viewer@example.com" }).first();
    expect(row.token_hash).toBe(hashLinkToken(tokenOf(path)));
    expect(JSON.stringify(row)).not.toContain(tokenOf(path));
    expect(Date.parse(row.expires_at) - Date.parse(row.created_at)).toBe(7 * 86_400_000);

    const shown = await page(path);
    expect(shown.body).toMatchObject({
      invite: { teamName: "Harrow Lane Boost Works", email: "new-viewer@example.com", role: "viewer", accountExists: false },
    });
    const out = await acceptNew(path, { name: "Nia Pellworth", password: PASSWORD });
    expect(out.status).toBe(302);
    expect(out.location).toBe("/dashboard");
    const user = await ownerDb()("users").where({ email: "new-viewer@example.com" }).first("id", "name");
    expect(user.name).toBe("Nia Pellworth");
    expect(await ownerDb()("memberships").where({ user_id: user.id }).select("team_id", "role")).toEqual([
      { team_id: demoTeamId, role: "viewer" },
    ]);
    // the new session is signed in, as a viewer of the shop
    const shell = await call(dashboard.loader as Handler, get("/dashboard", cookiePair(out.setCookie)));
    expect(shell.body).toMatchObject({ role: "viewer", team: { id: demoTeamId } });
  });

  it("refuses the same link a second time (410) and says so on the page", async () => {
    const path = await inviteByMail("twice@example.com", "builder");
    expect((await acceptNew(path, { name: "First", password: PASSWORD })).status).toBe(302);
    const users = await ownerDb()("users").count<{ n: number }[]>({ n: "*" });
    const again = await acceptNew(path, { name: "Second", password: PASSWORD });
    expect(again.status).toBe(410);
    expect((await page(path)).body).toMatchObject({ invite: null, reason: "used" });
    expect(await ownerDb()("users").count({ n: "*" })).toEqual(users);
  });

  it("refuses an expired link (410) and writes nothing", async () => {
    const path = await inviteByMail("late@example.com", "viewer");
    await ownerDb()("team_invites")
      .where({ email: "late@example.com" })
      .update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    expect((await page(path)).body).toMatchObject({ invite: null, reason: "expired" });
    expect((await acceptNew(path, { name: "Late", password: PASSWORD })).status).toBe(410);
    expect(await ownerDb()("users").where({ email: "late@example.com" }).first()).toBeUndefined();
  });

  it("a newer invite to the same address replaces the older link", async () => {
    const first = await inviteByMail("again@example.com", "viewer");
    const second = await inviteByMail("again@example.com", "builder");
    expect((await page(first)).body).toMatchObject({ invite: null, reason: "unknown" });
    expect((await page(second)).body).toMatchObject({ invite: { role: "builder" } });
  });

  it("adds the shop to an existing account once its owner signs in; someone else signed in is refused", async () => {
    const path = await inviteByMail("other-owner@example.com", "builder");
    expect((await page(path, otherOwner)).body).toMatchObject({ invite: { accountExists: true }, signedInAs: "other-owner@example.com" });
    // creating a second account for the address is not possible
    expect((await acceptNew(path, { name: "Copy", password: PASSWORD })).status).toBe(400);
    const stranger = await signIn("builder@example.com");
    const wrong = await call(invite.action as Handler, post(path, { intent: "join" }, stranger), { token: tokenOf(path) });
    expect(wrong.status).toBe(403);
    const out = await call(invite.action as Handler, post(path, { intent: "join" }, otherOwner), { token: tokenOf(path) });
    expect(out.status).toBe(302);
    const user = await ownerDb()("users").where({ email: "other-owner@example.com" }).first("id");
    const roles = await ownerDb()("memberships").where({ user_id: user.id }).orderBy("team_id").select("team_id", "role");
    expect(roles).toContainEqual({ team_id: demoTeamId, role: "builder" });
    expect(roles).toHaveLength(2);
    otherOwner = cookiePair(out.setCookie);
  });

  it("bad input is a 400 with the field's message and writes nothing", async () => {
    const before = await ownerDb()("team_invites").count({ n: "*" });
    for (const [fields, field] of [
      [{ intent: "invite", email: "not-an-address", role: "viewer" }, "email"],
      [{ intent: "invite", email: "x@example.com", role: "king" }, "role"],
      [{ intent: "invite", email: "builder@example.com", role: "viewer" }, "email"],
    ] as const) {
      const out = await call(teamAction, post("/team", fields, owner));
      expect(out.status).toBe(400);
      expect(answerError(out.body, field)).toBeTruthy();
      // the refusal keeps what was typed
      expect(answerValues(out.body)).toMatchObject({ email: fields.email, role: fields.role });
    }
    expect(await ownerDb()("team_invites").count({ n: "*" })).toEqual(before);
    expect(sink.messagesTo("x@example.com")).toEqual([]);
  });
});

describe("roles and removal", () => {
  it("removing a member ends their sessions in the shop; their next request goes to sign-in", async () => {
    const path = await inviteByMail("leaver@example.com", "builder");
    await acceptNew(path, { name: "Lee Ver", password: PASSWORD });
    const cookie = await signIn("leaver@example.com", PASSWORD);
    expect((await call(dashboard.loader as Handler, get("/dashboard", cookie))).status).toBe(200);
    const user = await ownerDb()("users").where({ email: "leaver@example.com" }).first("id");
    expect(await ownerDb()("sessions").where({ user_id: user.id, team_id: demoTeamId }).count({ n: "*" })).toEqual([{ n: 2 }]);
    const out = await call(teamAction, post("/team", { intent: "remove", userId: String(user.id) }, owner));
    expect(out.status).toBe(302);
    expect(await ownerDb()("sessions").where({ user_id: user.id }).count({ n: "*" })).toEqual([{ n: 0 }]);
    expect(await ownerDb()("memberships").where({ user_id: user.id }).first()).toBeUndefined();
    const after = await call(dashboard.loader as Handler, get("/dashboard", cookie));
    expect(after.status).toBe(302);
    expect(after.location).toMatch(/^\/login\?redirectTo=/);
  });

  it("changes a role; the last owner can neither be demoted nor removed", async () => {
    const builder = await ownerDb()("users").where({ email: "builder@example.com" }).first("id");
    expect((await call(teamAction, post("/team", { intent: "role", userId: String(builder.id), role: "viewer" }, owner))).status).toBe(302);
    expect(await ownerDb()("memberships").where({ user_id: builder.id, team_id: demoTeamId }).first("role")).toEqual({ role: "viewer" });
    await call(teamAction, post("/team", { intent: "role", userId: String(builder.id), role: "builder" }, owner));

    const me = await ownerDb()("users").where({ email: "owner@example.com" }).first("id");
    for (const fields of [
      { intent: "role", userId: String(me.id), role: "builder" },
      { intent: "remove", userId: String(me.id) },
    ] as Record<string, string>[]) {
      const out = await call(teamAction, post("/team", fields, owner));
      expect(out.status).toBe(400);
      expect(answerError(out.body, "")).toMatch(/at least one owner/);
    }
    expect(await ownerDb()("memberships").where({ user_id: me.id, team_id: demoTeamId }).first("role")).toEqual({ role: "owner" });
  });

  it("another shop's members and invites are not found (404) and nothing changes", async () => {
    const saltmarsh = await signIn("other-owner@example.com");
    await call(
      (await import("~/routes/shop/team-switch")).action as Handler,
      post(
        "/team/switch",
        { teamId: String((await ownerDb()("teams").where({ name: "Saltmarsh Dyno Cell" }).first("id")).id), returnTo: "/team" },
        saltmarsh,
      ),
    );
    const viewer = await ownerDb()("users").where({ email: "viewer@example.com" }).first("id");
    const pending = await inviteByMail("pending@example.com", "viewer");
    const inviteRow = await ownerDb()("team_invites")
      .where({ token_hash: hashLinkToken(tokenOf(pending)) })
      .first("id");
    const before = JSON.stringify(await ownerDb()("memberships").orderBy(["user_id", "team_id"]));
    for (const fields of [
      { intent: "role", userId: String(viewer.id), role: "owner" },
      { intent: "remove", userId: String(viewer.id) },
      { intent: "revoke", inviteId: String(inviteRow.id) },
    ] as Record<string, string>[]) {
      expect((await call(teamAction, post("/team", fields, saltmarsh))).status).toBe(404);
    }
    expect(JSON.stringify(await ownerDb()("memberships").orderBy(["user_id", "team_id"]))).toBe(before);
    expect((await page(pending)).body).toMatchObject({ invite: { email: "pending@example.com" } });
    // the shop's own owner can withdraw it
    expect((await call(teamAction, post("/team", { intent: "revoke", inviteId: String(inviteRow.id) }, owner))).status).toBe(302);
    expect((await page(pending)).body).toMatchObject({ invite: null });
  });
});
