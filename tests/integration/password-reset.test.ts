import { beforeAll, describe, expect, it } from "vitest";
import * as forgot from "~/routes/auth/forgot-password";
import * as reset from "~/routes/auth/reset-password";
import * as settings from "~/routes/shop/settings";
import * as dashboard from "~/routes/shop/dashboard";
import { resetThrottles } from "~/utils/rate-limit.server";
import { hashLinkToken } from "~/utils/tokens.server";
import { call, cookiePair, get, post, signIn, type Handler } from "./helpers";
import { linkPath, startTestSink } from "./mail";
import { ownerDb } from "../setup/db-roles";
import { answerError, answerValues } from "./conform-answer";

// Password reset by e-mail and the settings page's password change (issue 12).

let sink: Awaited<ReturnType<typeof startTestSink>>;
const NEW_PASSWORD = "gaskets hold when studs stretch";

beforeAll(async () => {
  sink = await startTestSink();
  return () => sink.close();
});

const ask = (email: string) => call(forgot.action as Handler, post("/forgot-password", { email }));
const tokenOf = (path: string) => path.split("/").pop()!;
const choose = (path: string, password: string, confirm = password) =>
  call(reset.action as Handler, post(path, { password, confirm }), { token: tokenOf(path) });
const usable = async (path: string) =>
  ((await call(reset.loader as Handler, get(path), { token: tokenOf(path) })).body as { usable: boolean }).usable;

describe("asking for a reset", () => {
  it("answers a known and an unknown address with the same status and body; only the known one gets mail", async () => {
    const known = await ask("builder@example.com");
    const unknown = await ask("nobody-here@example.com");
    expect(known.status).toBe(200);
    expect(unknown.status).toBe(known.status);
    expect(JSON.stringify(unknown.body)).toBe(JSON.stringify(known.body));
    expect(known.setCookie).toBe(unknown.setCookie);
    const [mail] = await sink.waitFor("builder@example.com");
    expect(mail!.subject).toBe("Reset your Sealwright password");
    expect(mail!.html).toContain(linkPath(mail!, "/reset-password/"));
    // a moment for any stray mail, then none to the unknown address
    await new Promise((r) => setTimeout(r, 200));
    expect(sink.messagesTo("nobody-here@example.com")).toEqual([]);
  });

  it("sends at most three mails an hour to one address, answering the fourth request the same", async () => {
    const known = "viewer@example.com";
    const answers = [];
    // the address in other letter cases is the same address
    for (const email of [known, "Viewer@example.com", known, "VIEWER@EXAMPLE.COM"]) answers.push(await ask(email));
    expect(new Set(answers.map((a) => `${a.status} ${JSON.stringify(a.body)}`)).size).toBe(1);
    const mails = await sink.waitFor(known, 3);
    await new Promise((r) => setTimeout(r, 300));
    expect(sink.messagesTo(known)).toHaveLength(3);
    expect(mails).toHaveLength(3);
    resetThrottles();
  });

  it("refuses a malformed address with a 400 and writes nothing", async () => {
    const before = await ownerDb()("password_resets").count({ n: "*" });
    const out = await ask("not an address");
    expect(out.status).toBe(400);
    expect(answerError(out.body, "email")).toMatch(/e-mail address/);
    expect(await ownerDb()("password_resets").count({ n: "*" })).toEqual(before);
  });
});

describe("choosing the new password", () => {
  it("sets it, ends every session of the account, and the link then works no more", async () => {
    const old = await signIn("owner@example.com");
    const other = await signIn("owner@example.com");
    await ask("owner@example.com");
    const [mail] = await sink.waitFor("owner@example.com");
    const path = linkPath(mail!, "/reset-password/");
    const row = await ownerDb()("password_resets").orderBy("id", "desc").first();
    expect(row.token_hash).toBe(hashLinkToken(tokenOf(path)));
    expect(Date.parse(row.expires_at) - Date.parse(row.created_at)).toBe(60 * 60_000);
    expect(await usable(path)).toBe(true);

    // the two fields must agree; nothing changes until they do
    const hash = (await ownerDb()("users").where({ email: "owner@example.com" }).first("password_hash")).password_hash;
    expect((await choose(path, NEW_PASSWORD, "something else")).status).toBe(400);
    expect((await choose(path, "short")).status).toBe(400);
    expect((await ownerDb()("users").where({ email: "owner@example.com" }).first("password_hash")).password_hash).toBe(hash);

    const out = await choose(path, NEW_PASSWORD);
    expect(out.status).toBe(302);
    expect(out.location).toBe("/login");
    for (const cookie of [old, other]) expect((await call(dashboard.loader as Handler, get("/dashboard", cookie))).status).toBe(302);
    const user = await ownerDb()("users").where({ email: "owner@example.com" }).first("id");
    expect(await ownerDb()("sessions").where({ user_id: user.id }).count({ n: "*" })).toEqual([{ n: 0 }]);
    await expect(signIn("owner@example.com")).rejects.toThrow(/failed: 400/);
    await signIn("owner@example.com", NEW_PASSWORD);

    expect(await usable(path)).toBe(false);
    expect((await choose(path, "yet another long sentence")).status).toBe(410);
  });

  it("an expired or unknown link is refused", async () => {
    await ask("viewer@example.com");
    const [mail] = await sink.waitFor("viewer@example.com");
    const path = linkPath(mail!, "/reset-password/");
    await ownerDb()("password_resets")
      .where({ token_hash: hashLinkToken(tokenOf(path)) })
      .update({ expires_at: new Date(Date.now() - 1).toISOString() });
    expect(await usable(path)).toBe(false);
    expect((await choose(path, NEW_PASSWORD)).status).toBe(410);
    expect((await choose("/reset-password/x".padEnd(59, "x"), NEW_PASSWORD)).status).toBe(410);
    await signIn("viewer@example.com");
  });
});

describe("settings", () => {
  it("saves the name and units; a blank name is a 400 that writes nothing", async () => {
    const cookie = await signIn("builder@example.com");
    expect(
      (await call(settings.action as Handler, post("/settings", { intent: "profile", name: "Teo V.", units: "imperial" }, cookie))).status,
    ).toBe(302);
    expect(await ownerDb()("users").where({ email: "builder@example.com" }).first("name", "units")).toEqual({
      name: "Teo V.",
      units: "imperial",
    });
    const bad = await call(settings.action as Handler, post("/settings", { intent: "profile", name: "  ", units: "metric" }, cookie));
    expect(bad.status).toBe(400);
    expect(await ownerDb()("users").where({ email: "builder@example.com" }).first("name", "units")).toEqual({
      name: "Teo V.",
      units: "imperial",
    });
  });

  it("changes the password only with the current one, and signs out the other devices", async () => {
    const here = await signIn("builder@example.com");
    const elsewhere = await signIn("builder@example.com");
    const wrong = await call(
      settings.action as Handler,
      post("/settings", { intent: "password", current: "not it", password: NEW_PASSWORD, confirm: NEW_PASSWORD }, here),
    );
    expect(wrong.status).toBe(400);
    expect(answerError(wrong.body, "current")).toBe("That is not your current password");
    expect(answerValues(wrong.body)).not.toHaveProperty("current");
    const out = await call(
      settings.action as Handler,
      post("/settings", { intent: "password", current: "sealwright-demo", password: NEW_PASSWORD, confirm: NEW_PASSWORD }, here),
    );
    expect(out.status).toBe(302);
    expect((await call(dashboard.loader as Handler, get("/dashboard", elsewhere))).status).toBe(302);
    expect((await call(dashboard.loader as Handler, get("/dashboard", here))).status).toBe(302);
    // this browser carries on with the fresh session it was handed
    expect((await call(dashboard.loader as Handler, get("/dashboard", cookiePair(out.setCookie)))).status).toBe(200);
  });
});
