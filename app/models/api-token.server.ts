import crypto from "node:crypto";
import { lowerRole } from "~/lib/team/roles";
import { now, withScope, withTeam, writeTransaction, type DbRow } from "~/utils/db.server";
import type { Role } from "./user.server";
import { recordAudit } from "./audit.server";

// Personal API tokens. A token is 32 random bytes (256 bits) shown once; the database keeps only its
// SHA-256. A slow password hash (argon2) is for secrets a person chose and an attacker can guess; 256
// random bits cannot be guessed, so one fast hash is enough and lets each request find its token by an
// indexed lookup. Sessions are kept the same way (migrations/20261201000000_foundation.ts).

export const TOKEN_PREFIX = "swt_";
/** A person's live tokens per team: enough for a dyno laptop, a spreadsheet and a few scripts. */
export const MAX_TOKENS_PER_TEAM = 20;

export interface ApiTokenRow {
  id: number;
  name: string;
  prefix: string;
  role: Role;
  createdAt: string;
  lastUsedAt: string | null;
}

export interface TokenCaller {
  tokenId: number;
  userId: number;
  teamId: number;
  teamName: string;
  /** The lower of the token's role and the person's role in the team today. */
  role: Role;
}

export function hashToken(token: string): string {
  return crypto.createHash("sha256").update(token, "utf8").digest("hex");
}

export class TokenLimitError extends Error {}

/** A new token for the person in the team at `role` (the caller checks it is within theirs); its text once. */
export async function createToken(teamId: number, userId: number, name: string, role: Role): Promise<{ id: number; token: string }> {
  const token = TOKEN_PREFIX + crypto.randomBytes(32).toString("base64url");
  return writeTransaction(
    async (trx) => {
      const live = await trx("api_tokens").where({ team_id: teamId, user_id: userId }).whereNull("revoked_at").count({ n: "*" }).first();
      if (Number(live?.n ?? 0) >= MAX_TOKENS_PER_TEAM)
        throw new TokenLimitError(`You have ${MAX_TOKENS_PER_TEAM} live tokens in this shop; revoke one first.`);
      const [row] = await trx("api_tokens")
        .insert({
          team_id: teamId,
          user_id: userId,
          name,
          token_hash: hashToken(token),
          prefix: token.slice(0, 10),
          role,
          created_at: now(),
        })
        .returning("id");
      const id = typeof row === "object" ? row.id : row;
      await recordAudit(trx, teamId, userId, "api-token.created", { tokenId: id, name, role });
      return { id, token };
    },
    { teamId },
  );
}

/** The person's live tokens in the team, newest first. */
function toToken(r: DbRow): ApiTokenRow {
  return { id: r.id, name: r.name, prefix: r.prefix, role: r.role, createdAt: r.created_at, lastUsedAt: r.last_used_at };
}

export async function listTokens(teamId: number, userId: number): Promise<ApiTokenRow[]> {
  const rows = await withTeam(teamId, (k) =>
    k("api_tokens").where({ team_id: teamId, user_id: userId }).whereNull("revoked_at").orderBy("id", "desc"),
  );
  return rows.map(toToken);
}

/** Revokes one of the person's own tokens in the team; false when there is no such live token. */
export async function revokeToken(teamId: number, userId: number, tokenId: number): Promise<boolean> {
  return writeTransaction(
    async (trx) => {
      const n = await trx("api_tokens")
        .where({ id: tokenId, team_id: teamId, user_id: userId })
        .whereNull("revoked_at")
        .update({ revoked_at: now() });
      if (n === 0) return false;
      await recordAudit(trx, teamId, userId, "api-token.revoked", { tokenId });
      return true;
    },
    { teamId },
  );
}

// last_used_at is written at most once a minute per token, so a busy script is not a write per request.
const TOUCH_EVERY_MS = 60_000;

/**
 * The caller a bearer token stands for, or null: unknown, revoked, or its person no longer in the team.
 * Read on every request (no cache), so a revoked token or a removed member is refused at once.
 */
export async function callerForToken(token: string): Promise<TokenCaller | null> {
  if (!token.startsWith(TOKEN_PREFIX) || token.length > 200) return null;
  // Row security: the token is found by its hash alone (api_tokens_by_hash), then read with its person's
  // membership in the token's team
  const tokenHash = hashToken(token);
  const found = await withScope({ tokenHash }, (k) => k("api_tokens").where({ token_hash: tokenHash }).first("team_id"));
  if (!found) return null;
  const row = await withTeam(found.team_id, (k) =>
    k("api_tokens as t")
      .join("memberships as m", function () {
        this.on("m.user_id", "=", "t.user_id").andOn("m.team_id", "=", "t.team_id");
      })
      .join("teams as tm", "tm.id", "t.team_id")
      .where("t.token_hash", hashToken(token))
      .whereNull("t.revoked_at")
      .first("t.id", "t.user_id", "t.team_id", "t.role", "t.last_used_at", "m.role as member_role", "tm.name as team_name"),
  );
  if (!row) return null;
  const at = now();
  if (!row.last_used_at || Date.parse(at) - Date.parse(row.last_used_at) >= TOUCH_EVERY_MS) {
    await withTeam(row.team_id, (k) => k("api_tokens").where({ id: row.id }).update({ last_used_at: at }));
  }
  return { tokenId: row.id, userId: row.user_id, teamId: row.team_id, teamName: row.team_name, role: lowerRole(row.role, row.member_role) };
}
