import type { Route } from "./+types/files-upload";
import { requireEngine } from "~/models/engine.server";
import { receiveUpload } from "~/models/files.server";
import { requireRole } from "~/utils/auth.server";
import { answerUpload } from "~/utils/upload-answer.server";

// One file in, streamed (app/models/files.server.ts). The page's uploader sends it with XMLHttpRequest
// for the progress bar and reads JSON back; without JavaScript the form posts here and is sent back.
export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  return answerUpload(request, await receiveUpload(request, team.id, user.id, { engineId: engine.id }), `/engines/${engine.id}/files`);
}
