import { data } from "react-router";
import type { Route } from "./+types/item-files-upload";
import { libraryOwner, receiveUpload } from "~/models/files.server";
import { requireLibraryItem } from "~/models/library.server";
import { requireRole } from "~/utils/auth.server";
import { answerUpload } from "~/utils/upload-answer.server";

// The maker's sheet (or a photo of it) on a fastener or gasket, streamed as an engine's files are
// (app/models/files.server.ts). Builders and owners of the item's team upload; another team's item is a 404.
export async function action({ request, params }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const kind = params.kind;
  if (kind !== "fasteners" && kind !== "gaskets") throw data("Only fasteners and gaskets keep files.", { status: 404 });
  const item = await requireLibraryItem(kind, team.id, params.itemId);
  const back = `/libraries/${kind}/${item.id}`;
  return answerUpload(request, await receiveUpload(request, team.id, user.id, libraryOwner(kind, item.id)), back);
}
