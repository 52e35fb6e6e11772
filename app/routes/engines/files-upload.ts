import { data, redirect } from "react-router";
import type { Route } from "./+types/files-upload";
import { requireEngine } from "~/models/engine.server";
import { receiveUpload } from "~/models/files.server";
import { requireRole } from "~/utils/auth.server";
import { flashToast } from "~/utils/toast.server";

// One file in, streamed (app/models/files.server.ts). The page's uploader sends it with XMLHttpRequest
// for the progress bar and reads JSON back; without JavaScript the form posts here and is sent back.
export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const wantsJson = (request.headers.get("Accept") ?? "").includes("application/json");
  const result = await receiveUpload(request, team.id, user.id, engine.id);
  if (!result.ok) {
    if (wantsJson) return data({ ok: false, message: result.message }, { status: result.status });
    return redirect(`/engines/${engine.id}/files`, {
      headers: { "Set-Cookie": await flashToast(request, { kind: "problem", message: result.message }) },
    });
  }
  if (wantsJson) return data({ ok: true, file: result.file });
  return redirect(result.returnTo ?? `/engines/${engine.id}/files`, {
    headers: { "Set-Cookie": await flashToast(request, { kind: "done", message: `Kept ${result.file.name}.` }) },
  });
}
