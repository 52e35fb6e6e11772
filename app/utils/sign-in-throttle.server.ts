import { normalizeEmail } from "~/models/user.server";
import { takeAll, throttle, tooManyHeaders, waitWords } from "./rate-limit.server";

// Sign-in's two throttles: the address the guesses come from, then the account they aim at
// (so guesses spread over many addresses still lock one account, and one address cannot try many).

function accountKey(email: string): string {
  return normalizeEmail(email).slice(0, 254);
}

/** Null when the attempt may go on (it has been counted); else the 429's words and headers. */
export async function signInAttempt(email: string, address: string): Promise<{ message: string; headers: Record<string, string> } | null> {
  const pairs: Parameters<typeof takeAll>[0] = [["signInAddress", address]];
  if (accountKey(email)) pairs.push(["signInAccount", accountKey(email)]);
  const wait = await takeAll(pairs);
  if (wait === 0) return null;
  return { message: `Too many sign-in attempts. Wait ${waitWords(wait)}, then try again.`, headers: tooManyHeaders(wait) };
}

/** A right password: the account's failures are forgotten and the address gets its attempt back. */
export async function signInSucceeded(email: string, address: string): Promise<void> {
  await Promise.all([throttle("signInAccount").clear(accountKey(email)), throttle("signInAddress").refund(address)]);
}
