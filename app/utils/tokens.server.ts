import crypto from "node:crypto";

// Links in e-mails (invites, password resets) carry a random token; only its SHA-256 is stored, so a
// copy of the database cannot be used to accept an invite or reset a password.

/** 256 random bits, URL-safe, and the hash to store. */
export function newLinkToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString("base64url");
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return crypto.createHash("sha256").update(token).digest("hex");
}

/** A token as we hand them out: 43 URL-safe characters. Anything else is not looked up at all. */
export function isLinkToken(s: unknown): s is string {
  return typeof s === "string" && /^[A-Za-z0-9_-]{43}$/.test(s);
}
