import type { Knex } from "knex";
import { db, now, setRowScope, withScope, writeTransaction } from "~/utils/db.server";
import { hashPassword } from "~/utils/password.server";
import { seedTeamLibrary } from "./library-seed.server";

import type { Role } from "~/lib/team/roles";
import type { UnitSystem } from "~/lib/units";
import { recordAudit } from "./audit.server";

export type { Role };

export interface UserRow {
  id: number;
  email: string;
  name: string;
  units: UnitSystem;
}

export interface MembershipRow {
  teamId: number;
  teamName: string;
  role: Role;
}

const USER_COLUMNS = ["id", "email", "name", "units"] as const;

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function getUserById(id: number): Promise<UserRow | null> {
  return (await db()("users").select(USER_COLUMNS).where({ id }).first()) ?? null;
}

export async function getUserWithHashByEmail(email: string): Promise<(UserRow & { password_hash: string }) | null> {
  const row = await db()("users")
    .select([...USER_COLUMNS, "password_hash"])
    .where({ email: normalizeEmail(email) })
    .first();
  return row ?? null;
}

/** The e-mail already has an account (found by the UNIQUE constraint, so two sign-ups at once agree). */
export class EmailTakenError extends Error {
  constructor() {
    super("e-mail already has an account");
  }
}

// SQLite names the column (users.email), PostgreSQL the constraint (23505 on users_email_unique).
function isEmailUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; message?: string; constraint?: string } | null;
  if (!e) return false;
  if (e.code === "23505") return e.constraint === "users_email_unique";
  return e.code === "SQLITE_CONSTRAINT_UNIQUE" && /users\.email/.test(e.message ?? "");
}

// A new person and their own shop, of which they are the owner; one transaction. The password is hashed
// first, whether or not the e-mail turns out to be free, so both answers cost the same.
export async function createUserWithTeam(input: {
  email: string;
  name: string;
  password: string;
  teamName: string;
}): Promise<{ user: UserRow; teamId: number }> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await writeTransaction(async (trx) => {
      const user = await insertUser(trx, { email: input.email, name: input.name, passwordHash });
      const teamId = await insertTeam(trx, input.teamName);
      await setRowScope(trx, { teamId, userId: user.id });
      await trx("memberships").insert({ user_id: user.id, team_id: teamId, role: "owner", created_at: now() });
      await recordAudit(trx, teamId, user.id, "team.created");
      await seedTeamLibrary(trx, teamId);
      return { user, teamId };
    });
  } catch (error) {
    if (isEmailUniqueViolation(error)) throw new EmailTakenError();
    throw error;
  }
}

export async function insertUser(
  trx: Knex,
  input: { email: string; name: string; passwordHash: string; units?: UnitSystem },
): Promise<UserRow> {
  const [row] = await trx("users")
    .insert({
      email: normalizeEmail(input.email),
      name: input.name.trim(),
      password_hash: input.passwordHash,
      units: input.units ?? "metric",
      created_at: now(),
    })
    .returning(USER_COLUMNS);
  return row as UserRow;
}

export async function insertTeam(trx: Knex, name: string): Promise<number> {
  const [row] = await trx("teams").insert({ name: name.trim(), created_at: now() }).returning("id");
  return (row as { id: number }).id;
}

export async function listMemberships(userId: number): Promise<MembershipRow[]> {
  return withScope({ userId }, (k) =>
    k("memberships as m")
      .join("teams as t", "t.id", "m.team_id")
      .where("m.user_id", userId)
      .orderBy(["t.name", "t.id"])
      .select({ teamId: "t.id", teamName: "t.name", role: "m.role" }),
  );
}

export async function updateProfile(userId: number, input: { name: string; units: UnitSystem }): Promise<void> {
  await db()("users").where({ id: userId }).update({ name: input.name.trim(), units: input.units });
}

export async function getPasswordHash(userId: number): Promise<string | null> {
  return (await db()("users").where({ id: userId }).first("password_hash"))?.password_hash ?? null;
}

/** A new password: the hash is replaced and every session of the person ends (the caller starts a fresh one). */
export async function setPassword(userId: number, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await writeTransaction(async (trx) => {
    await setRowScope(trx, { userId });
    await trx("users").where({ id: userId }).update({ password_hash: passwordHash });
    await trx("sessions").where({ user_id: userId }).delete();
    await trx("password_resets").where({ user_id: userId }).whereNull("used_at").update({ used_at: now() });
  });
}
