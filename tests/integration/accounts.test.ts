import argon2 from "argon2";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { createUserWithTeam, EmailTakenError } from "~/models/user.server";
import * as signup from "~/routes/auth/signup";
import { isCommonPassword } from "~/utils/password.server";
import { resetThrottles } from "~/utils/rate-limit.server";
import { call, post, type Handler } from "./helpers";
import { ownerDb } from "../setup/db-roles";

/** The first message Conform's answer (`result.error`) carries for a sign-up field. */
const fieldError = (body: unknown, name: string) =>
  (body as { result: { error?: Record<string, string[] | null> } }).result.error?.[name]?.[0];

const action = signup.action as Handler;
const form = (over: Record<string, string> = {}) => ({
  name: "Wren Ashdown",
  email: "wren@example.com",
  teamName: "Ashdown Heads",
  password: "a sentence for the bench",
  ...over,
});
const count = async (table: string) => Number((await ownerDb()(table).count({ n: "*" }))[0]!.n);

beforeEach(() => resetThrottles());

describe("defect 4: weak passwords are refused", () => {
  for (const password of ["password", "12345678", "Password", "qwertyuiop", "iloveyou"]) {
    it(`refuses ${JSON.stringify(password)} as a common password`, async () => {
      const out = await call(action, post("/signup", form({ email: `weak-${password}@example.com`, password })));
      expect(out.status).toBe(400);
      expect(fieldError(out.body, "password")).toBe(
        "That password is on a public list of common passwords; pick another (a short sentence works well)",
      );
    });
  }

  it("refuses eight spaces, and a tab-and-space password", async () => {
    for (const password of ["        ", " \t \t \t \t "]) {
      const out = await call(action, post("/signup", form({ email: "spaces@example.com", password })));
      expect(fieldError(out.body, "password")).toBe("Use letters, digits or symbols, not only spaces");
    }
    expect(await ownerDb()("users").where({ email: "spaces@example.com" }).first()).toBeUndefined();
  });

  it("the list is the public one (tens of thousands of entries), and a sentence is not on it", () => {
    expect(isCommonPassword("letmein")).toBe(true);
    expect(isCommonPassword("trustno1")).toBe(true);
    expect(isCommonPassword("a sentence for the bench")).toBe(false);
    expect(isCommonPassword("sealwright-demo")).toBe(false);
  });
});

describe("defect 5: sign-up does not tell who has an account", () => {
  let hash: ReturnType<typeof vi.spyOn>;
  beforeEach(() => {
    hash = vi.spyOn(argon2, "hash");
  });
  afterEach(() => hash.mockRestore());

  it("a taken e-mail costs the same hash as a new one, and the words do not say it has an account", async () => {
    const fresh = await call(action, post("/signup", form({ email: "fresh-one@example.com" })));
    expect(fresh.status).toBe(302);
    expect(hash).toHaveBeenCalledTimes(1);
    const taken = await call(action, post("/signup", form({ email: "owner@example.com" })));
    expect(hash).toHaveBeenCalledTimes(2);
    expect(taken.status).toBe(400);
    const message = fieldError(taken.body, "email");
    expect(message).toBe(signup.EMAIL_NOT_AVAILABLE);
    expect(message).not.toMatch(/already has an account/);
  });

  it("a taken e-mail writes nothing", async () => {
    const before = await Promise.all(["users", "teams", "memberships", "materials", "audit_events"].map(count));
    await call(action, post("/signup", form({ email: "OWNER@example.com" })));
    expect(await Promise.all(["users", "teams", "memberships", "materials", "audit_events"].map(count))).toEqual(before);
  });
});

describe("defect 10: two sign-ups of one e-mail at once", () => {
  it("one shop is made; the others get the taken-e-mail answer, none a 500", async () => {
    const teams = await count("teams");
    const outs = await Promise.all(
      Array.from({ length: 4 }, (_, i) => call(action, post("/signup", form({ email: "race@example.com", teamName: `Race ${i}` })))),
    );
    expect(outs.map((o) => o.status).sort()).toEqual([302, 400, 400, 400]);
    for (const o of outs.filter((o) => o.status === 400)) expect(fieldError(o.body, "email")).toBe(signup.EMAIL_NOT_AVAILABLE);
    expect(await count("teams")).toBe(teams + 1);
  });

  it("the model names the UNIQUE conflict instead of passing SQLite's error up", async () => {
    await expect(
      createUserWithTeam({ email: "builder@example.com", name: "Twin", password: "a sentence for the bench", teamName: "Twin" }),
    ).rejects.toBeInstanceOf(EmailTakenError);
  });
});
