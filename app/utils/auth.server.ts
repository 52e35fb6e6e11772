import { data, redirect } from "react-router";
import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { getUserById, getUserWithHashByEmail, listMemberships, type MembershipRow, type Role, type UserRow } from "~/models/user.server";
import type { Asker } from "~/models/viewer-scope.server";
import { dummyPasswordHash, verifyPassword } from "./password.server";
import { getSession, sessionStorage } from "./session.server";
import { roleAtLeast } from "~/lib/team/roles";

export const SIGN_IN_FAILED = "Wrong e-mail or password.";

export class SignInError extends Error {}

export const authenticator = new Authenticator<UserRow>();

authenticator.use(
  new FormStrategy(async ({ form }) => {
    const email = String(form.get("email") ?? "");
    const password = String(form.get("password") ?? "");
    const user = email && password ? await getUserWithHashByEmail(email) : null;
    // An unknown e-mail still costs one hash check, so timing does not tell which part was wrong.
    const ok = await verifyPassword(user?.password_hash ?? (await dummyPasswordHash()), password);
    if (!user || !ok) throw new SignInError(SIGN_IN_FAILED);
    const { password_hash: _hash, ...plain } = user;
    return plain;
  }),
  "form",
);

export interface Member {
  user: UserRow;
  team: { id: number; name: string };
  role: Role;
  memberships: MembershipRow[];
  /** Who is asking, for the engine queries (a viewer sees only the engines shared with them). */
  who: Asker;
}

// the one role rank lives in app/lib/team/roles.ts; routes import it from here with the guards
export { roleAtLeast };

function signInRedirect(request: Request): never {
  const url = new URL(request.url);
  const back = url.pathname + url.search;
  throw redirect(`/login?redirectTo=${encodeURIComponent(back)}`);
}

/** The signed-in person, or null. */
export async function getUser(request: Request): Promise<UserRow | null> {
  const session = await getSession(request);
  const userId = session.get("userId");
  return userId ? getUserById(userId) : null;
}

/** The signed-in person and their current team; sends a signed-out visitor to sign-in and back. */
export async function requireUser(request: Request): Promise<Member> {
  const session = await getSession(request);
  const userId = session.get("userId");
  const user = userId ? await getUserById(userId) : null;
  if (!user) signInRedirect(request);
  const memberships = await listMemberships(user.id);
  const current = memberships.find((m) => m.teamId === session.get("teamId")) ?? memberships[0];
  if (!current) throw data("You are not a member of any shop.", { status: 403 });
  return {
    user,
    team: { id: current.teamId, name: current.teamName },
    role: current.role,
    memberships,
    who: { teamId: current.teamId, userId: user.id, role: current.role },
  };
}

/** As requireUser, and throws 403 when the person's role in the current team is below `needed`. */
export async function requireRole(request: Request, needed: Role): Promise<Member> {
  const member = await requireUser(request);
  if (!roleAtLeast(member.role, needed)) {
    throw data(`This needs the ${needed} role; you are a ${member.role} in ${member.team.name}.`, { status: 403 });
  }
  return member;
}

/** A new session (new id) for this person; any session the request carried is destroyed. */
export async function startSession(request: Request, userId: number, teamId: number | null, redirectTo: string) {
  const storage = sessionStorage();
  const old = await getSession(request);
  if (old.id) await storage.destroySession(old);
  const fresh = await storage.getSession();
  fresh.set("userId", userId);
  fresh.set("teamId", teamId);
  return redirect(safeRedirect(redirectTo), { headers: { "Set-Cookie": await storage.commitSession(fresh) } });
}

export async function endSession(request: Request) {
  const session = await getSession(request);
  return redirect("/login", { headers: { "Set-Cookie": await sessionStorage().destroySession(session) } });
}

// A stand-in origin to resolve a path against: only where the path lands matters, not this name.
const REDIRECT_BASE = "http://sealwright.invalid";

/**
 * Only paths on this site; anything else goes to the fallback. Browsers drop tabs and newlines from a
 * URL and read "\\" as "/", so "/\t/evil.example" is "//evil.example" to them: control characters and
 * backslashes are refused outright, then the path is resolved as a URL and must stay on our origin.
 * What comes back is the URL's own (percent-encoded) form, always a valid Location header.
 */
export function safeRedirect(to: string | null | undefined, fallback = "/dashboard"): string {
  if (typeof to !== "string" || !to.startsWith("/") || to.startsWith("//")) return fallback;
  // eslint-disable-next-line no-control-regex -- control characters are exactly what this refuses
  if (/[\u0000-\u001f\u007f-\u009f\\]/.test(to)) return fallback;
  let url: URL;
  try {
    url = new URL(to, REDIRECT_BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== REDIRECT_BASE) return fallback;
  return url.pathname + url.search + url.hash;
}

/** For JSON API routes: the signed-in member, or a 401 JSON answer (never a redirect). */
export async function requireApiMember(request: Request): Promise<Member> {
  try {
    return await requireUser(request);
  } catch (thrown) {
    if (thrown instanceof Response && thrown.status === 302) {
      throw Response.json({ error: "Sign in first: this API needs a session." }, { status: 401 });
    }
    throw thrown;
  }
}
