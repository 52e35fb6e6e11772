import { createRequire } from "node:module";
import argon2 from "argon2";

// argon2id at the OWASP Password Storage Cheat Sheet minimum (m = 19 MiB, t = 2, p = 1).
const HASH_OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, HASH_OPTIONS);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

// Verified against when the e-mail is unknown, so both failures take the same time.
let dummyHash: Promise<string> | undefined;
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword("not-a-real-password-used-for-timing");
  return dummyHash;
}

// A public list of the most common passwords (zxcvbn's frequency list from leaked-password corpora,
// 49,233 entries, shipped as data by @zxcvbn-ts/language-common). Loaded once, on first use.
let common: Set<string> | undefined;
function commonPasswords(): Set<string> {
  common ??= new Set(createRequire(import.meta.url)("@zxcvbn-ts/language-common/src/passwords.json") as string[]);
  return common;
}

/** True when the password, ignoring case, is on the common-password list. */
export function isCommonPassword(password: string): boolean {
  return commonPasswords().has(password.toLowerCase());
}
