import { createCookieSessionStorage } from "react-router";
import { cookieIsSecure } from "./env.server";

export interface Toast {
  kind: "done" | "problem";
  message: string;
}

// A short-lived, flash-only cookie: shown once on the next page, then gone.
const toastStorage = createCookieSessionStorage<{ toast: Toast }, { toast: Toast }>({
  cookie: { name: "sw_toast", httpOnly: true, sameSite: "lax", path: "/", maxAge: 60, secure: cookieIsSecure(), secrets: ["toast-not-secret"] },
});

export async function flashToast(request: Request, toast: Toast): Promise<string> {
  const session = await toastStorage.getSession(request.headers.get("Cookie"));
  session.flash("toast", toast);
  return toastStorage.commitSession(session);
}

export async function readToast(request: Request): Promise<{ toast: Toast | null; setCookie: string | null }> {
  const session = await toastStorage.getSession(request.headers.get("Cookie"));
  const toast = session.get("toast") ?? null;
  return { toast, setCookie: toast ? await toastStorage.destroySession(session) : null };
}
