import { data } from "react-router";
import { redirectWithToast } from "./toast.server";

// The answer to an upload, for every upload route: JSON for the page's uploader (XMLHttpRequest, for the
// progress bar), or without JavaScript a redirect back with the outcome as a toast.
type Outcome = { ok: true; file: { name: string }; returnTo: string | null } | { ok: false; status: number; message: string };

export async function answerUpload(request: Request, result: Outcome, back: string) {
  const wantsJson = (request.headers.get("Accept") ?? "").includes("application/json");
  if (!result.ok) {
    if (wantsJson) return data({ ok: false, message: result.message }, { status: result.status });
    return redirectWithToast(request, back, result.message, "problem");
  }
  if (wantsJson) return data({ ok: true, file: result.file });
  return redirectWithToast(request, result.returnTo ?? back, `Kept ${result.file.name}.`);
}
