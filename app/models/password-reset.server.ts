import type { Knex } from "knex";
import { RESET_MINUTES } from "~/lib/mail/messages";
import { db, now, setRowScope, writeTransaction } from "~/utils/db.server";
import { hashPassword } from "~/utils/password.server";
import { hashLinkToken, isLinkToken, newLinkToken } from "~/utils/tokens.server";
import { normalizeEmail } from "./user.server";

const MINUTE_MS = 60_000;

/**
 * A reset token for the account with this address, or null when there is none. Either way it makes a
 * token and writes one row's worth of work, so the two answers cost about the same.
 */
export async function startPasswordReset(email: string): Promise<{ token: string; name: string; email: string } | null> {
  const { token, hash } = newLinkToken();
  const user = await db()("users")
    .where({ email: normalizeEmail(email) })
    .first("id", "name", "email");
  if (!user) return null;
  const at = new Date();
  await db()("password_resets").insert({
    user_id: user.id,
    token_hash: hash,
    created_at: at.toISOString(),
    expires_at: new Date(at.getTime() + RESET_MINUTES * MINUTE_MS).toISOString(),
  });
  return { token, name: user.name, email: user.email };
}

async function usableReset(q: Knex, token: string) {
  return q("password_resets")
    .where({ token_hash: hashLinkToken(token) })
    .whereNull("used_at")
    .where("expires_at", ">", now())
    .first("id", "user_id");
}

/** True when the link's token can still reset a password. */
export async function resetTokenUsable(token: string | undefined): Promise<boolean> {
  return isLinkToken(token) && Boolean(await usableReset(db(), token));
}

/**
 * Sets the new password, uses up every reset token of the account and ends all its sessions.
 * False when the token is unknown, used or expired.
 */
export async function completePasswordReset(token: string | undefined, newPassword: string): Promise<boolean> {
  if (!isLinkToken(token)) return false;
  const passwordHash = await hashPassword(newPassword);
  return writeTransaction(async (trx) => {
    const row = await usableReset(trx, token);
    if (!row) return false;
    // the person is known only now: row security lets this transaction end their sessions, nobody else's
    await setRowScope(trx, { userId: row.user_id });
    await trx("users").where({ id: row.user_id }).update({ password_hash: passwordHash });
    await trx("password_resets").where({ user_id: row.user_id }).whereNull("used_at").update({ used_at: now() });
    await trx("sessions").where({ user_id: row.user_id }).delete();
    return true;
  });
}
