import { createCookieSessionStorage, redirect } from "react-router";
import { cookieIsSecure } from "./env.server";
import { sessionSecret } from "./session.server";

export interface Toast {
  kind: "done" | "problem";
  message: string;
}

// A short-lived, flash-only cookie: shown once on the next page, then gone. Signed with the session
// secret, so nobody can forge a message that appears to come from the app.
let toastStorage: ReturnType<typeof build> | undefined;

function build() {
  return createCookieSessionStorage<{ toast: Toast }, { toast: Toast }>({
    cookie: {
      name: "sw_toast",
      httpOnly: true,
      sameSite: "lax",
      path: "/",
      maxAge: 60,
      secure: cookieIsSecure(),
      secrets: [sessionSecret()],
    },
  });
}

function storage() {
  toastStorage ??= build();
  return toastStorage;
}

export async function flashToast(request: Request, toast: Toast): Promise<string> {
  const session = await storage().getSession(request.headers.get("Cookie"));
  session.flash("toast", toast);
  return storage().commitSession(session);
}

export async function readToast(request: Request): Promise<{ toast: Toast | null; setCookie: string | null }> {
  const session = await storage().getSession(request.headers.get("Cookie"));
  const toast = session.get("toast") ?? null;
  return { toast, setCookie: toast ? await storage().destroySession(session) : null };
}

/** A redirect that leaves a "done" (or "problem") line for the next page: the one way actions say so. */
export async function redirectWithToast(
  request: Request,
  to: string,
  message: string,
  kind: Toast["kind"] = "done",
  init: ResponseInit = {},
): Promise<Response> {
  const headers = new Headers(init.headers);
  headers.append("Set-Cookie", await flashToast(request, { kind, message }));
  return redirect(to, { ...init, headers });
}
