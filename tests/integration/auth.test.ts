import { describe, expect, it } from "vitest";
import * as dashboard from "~/routes/shop/dashboard";
import * as login from "~/routes/auth/login";
import * as logout from "~/routes/auth/logout";
import * as signup from "~/routes/auth/signup";
import { hashSessionId } from "~/utils/session.server";
import { call, cookiePair, get, post, signIn, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";

/** The first message Conform's answer (`result.error`) carries for a sign-up field. */
const fieldError = (body: unknown, name: string) =>
  (body as { result: { error?: Record<string, string[] | null> } }).result.error?.[name]?.[0];

const loginAction = login.action as Handler;

async function sessionRows(): Promise<number> {
  const [row] = await ownerDb()("sessions").count({ n: "*" });
  return Number(row?.n);
}

function sessionIdFromCookie(pair: string): string {
  // Signed cookie: base64(JSON(id)).signature
  const value = decodeURIComponent(pair.split("=").slice(1).join("="));
  return JSON.parse(atob(value.slice(0, value.lastIndexOf("."))));
}

describe("sign-in", () => {
  it("signs the demo builder in and lands on the page asked for", async () => {
    const out = await call(
      loginAction,
      post("/login?redirectTo=%2Fsettings", { email: "builder@example.com", password: "sealwright-demo" }),
    );
    expect(out.status).toBe(302);
    expect(out.location).toBe("/settings");
    expect(out.setCookie).toMatch(/HttpOnly/i);
    expect(out.setCookie).toMatch(/SameSite=Lax/i);
  });

  it("gives the same message for a wrong password and an unknown e-mail", async () => {
    const wrongPassword = await call(loginAction, post("/login", { email: "builder@example.com", password: "not-the-password" }));
    const unknownEmail = await call(loginAction, post("/login", { email: "nobody@example.com", password: "sealwright-demo" }));
    expect(wrongPassword.status).toBe(400);
    expect(unknownEmail.status).toBe(400);
    expect((wrongPassword.body as { error: string }).error).toBe("Wrong e-mail or password.");
    expect((unknownEmail.body as { error: string }).error).toBe((wrongPassword.body as { error: string }).error);
    expect(wrongPassword.setCookie).toBeNull();
  });

  it("never redirects off-site after sign-in", async () => {
    const out = await call(
      loginAction,
      post("/login?redirectTo=%2F%2Fevil.example", { email: "owner@example.com", password: "sealwright-demo" }),
    );
    expect(out.location).toBe("/dashboard");
  });

  it("rotates the session id at sign-in and deletes the old session", async () => {
    const first = await signIn("viewer@example.com");
    const out = await call(loginAction, post("/login", { email: "viewer@example.com", password: "sealwright-demo" }, first));
    const second = cookiePair(out.setCookie);
    const firstId = sessionIdFromCookie(first);
    const secondId = sessionIdFromCookie(second);
    expect(secondId).not.toBe(firstId);
    // 32 random bytes, base64url: 43 characters, 256 bits.
    expect(secondId).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(
      await ownerDb()("sessions")
        .where({ id_hash: hashSessionId(firstId) })
        .first(),
    ).toBeUndefined();
    expect(
      await ownerDb()("sessions")
        .where({ id_hash: hashSessionId(secondId) })
        .first(),
    ).toBeDefined();
  });

  it("stores only the hash of the session id", async () => {
    const pair = await signIn("owner@example.com");
    const id = sessionIdFromCookie(pair);
    expect(await ownerDb()("sessions").where({ id_hash: id }).first()).toBeUndefined();
  });

  it("expires a session idle longer than the idle timeout", async () => {
    const pair = await signIn("builder@example.com");
    const idHash = hashSessionId(sessionIdFromCookie(pair));
    await ownerDb()("sessions")
      .where({ id_hash: idHash })
      .update({ last_seen_at: new Date(Date.now() - 13 * 3_600_000).toISOString() });
    const out = await call(dashboard.loader as Handler, get("/dashboard", pair));
    expect(out.status).toBe(302);
    expect(out.location).toMatch(/^\/login/);
    expect(await ownerDb()("sessions").where({ id_hash: idHash }).first()).toBeUndefined();
  });
});

describe("sign-out", () => {
  it("deletes the session server-side so the old cookie no longer works", async () => {
    const pair = await signIn("builder@example.com");
    expect((await call(dashboard.loader as Handler, get("/dashboard", pair))).status).toBe(200);
    const before = await sessionRows();
    const out = await call(logout.action as Handler, post("/logout", {}, pair));
    expect(out.status).toBe(302);
    expect(await sessionRows()).toBe(before - 1);
    const replay = await call(dashboard.loader as Handler, get("/dashboard", pair));
    expect(replay.status).toBe(302);
    expect(replay.location).toBe("/login?redirectTo=%2Fdashboard");
  });
});

describe("sign-up", () => {
  const action = signup.action as Handler;

  it("creates a person and a team they own, hashed with argon2id", async () => {
    const out = await call(
      action,
      post("/signup", { name: "Pell Dunmore", email: "Pell@Example.com", teamName: "Dunmore Race Heads", password: "long enough pass" }),
    );
    expect(out.status).toBe(302);
    const user = await ownerDb()("users").where({ email: "pell@example.com" }).first();
    expect(user.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,p=1,t=2\$/);
    const membership = await ownerDb()("memberships as m").join("teams as t", "t.id", "m.team_id").where("m.user_id", user.id).first();
    expect(membership.role).toBe("owner");
    expect(membership.name).toBe("Dunmore Race Heads");
  });

  it("accepts a 64-character password", async () => {
    const out = await call(
      action,
      post("/signup", { name: "Long Pass", email: "long@example.com", teamName: "Long Team", password: "x".repeat(64) }),
    );
    expect(out.status).toBe(302);
  });

  it("answers a malformed Conform intent with 400 and a message, not a 500, and writes nothing", async () => {
    const [{ n: before }] = await ownerDb()("users").count({ n: "*" });
    const fields = { name: "Ivo Marsh", email: "ivo@example.com", teamName: "Marsh Heads", password: "long enough pass" };
    for (const intent of ["{oops", '{"type":"explode","payload":{}}', '{"type":"remove","payload":{"name":"email","index":0}}']) {
      const out = await call(action, post("/signup", { ...fields, __intent__: intent }));
      expect(out.status, intent).toBe(400);
      expect(String(out.body)).toMatch(/not one this page knows/);
    }
    expect((await ownerDb()("users").count({ n: "*" }))[0]!.n).toBe(before);
  });

  it("rejects bad input with messages and writes nothing", async () => {
    const [{ n: before }] = await ownerDb()("users").count({ n: "*" });
    const out = await call(action, post("/signup", { name: "", email: "not-an-email", teamName: "", password: "short" }));
    expect(out.status).toBe(400);
    expect(fieldError(out.body, "name")).toBe("Enter your name");
    expect(fieldError(out.body, "email")).toMatch(/e-mail address/);
    expect(fieldError(out.body, "teamName")).toBe("Name your shop or team");
    expect(fieldError(out.body, "password")).toBe("Use at least 8 characters");
    // the password is never echoed back
    expect((out.body as { result: { initialValue: Record<string, unknown> } }).result.initialValue).not.toHaveProperty("password");
    const [{ n: after }] = await ownerDb()("users").count({ n: "*" });
    expect(after).toBe(before);
  });

  it("refuses an e-mail that already has an account", async () => {
    const out = await call(
      action,
      post("/signup", { name: "Again", email: "owner@example.com", teamName: "Again", password: "long enough pass" }),
    );
    expect(out.status).toBe(400);
    // the same words a second sign-up racing the first gets (tests/integration/accounts.test.ts)
    expect(fieldError(out.body, "email")).toBe(signup.EMAIL_NOT_AVAILABLE);
  });
});
