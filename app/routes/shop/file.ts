import { data } from "react-router";
import type { Route } from "./+types/file";
import { getEngine } from "~/models/engine.server";
import { deleteFile, getStoredFile } from "~/models/files.server";
import { requireRole, requireUser, safeRedirect } from "~/utils/auth.server";
import { fileStorage } from "~/utils/files.server";
import { redirectWithToast } from "~/utils/toast.server";

const notFound = (message: string) => new Response(message, { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });

// A kept file, to members of its team only (another team's file is a 404). An engine's file goes to a
// viewer only when its engine is shared with them; a fastener's or gasket's to every member, as the
// library does. Photos open in the browser, PDFs download; the type is the one sniffed at upload, and
// nosniff stops the browser guessing another.
export async function loader({ request, params }: Route.LoaderArgs) {
  const { team, who } = await requireUser(request);
  const row = await getStoredFile(team.id, params.fileId);
  if (!row || (row.engineId !== null && !(await getEngine(who, row.engineId)))) throw notFound("No such file in this shop.");
  const thumb = new URL(request.url).searchParams.get("thumb") === "1" && row.thumbKey;
  const stored = await fileStorage().get(thumb ? row.thumbKey! : row.storageKey);
  if (!stored) throw notFound("The file is missing from storage.");
  const type = thumb ? "image/webp" : row.contentType;
  const disposition = type === "application/pdf" ? "attachment" : "inline";
  return new Response(stored.stream(), {
    headers: {
      "Content-Type": type,
      "Content-Length": String(stored.size),
      "Content-Disposition": `${disposition}; filename*=UTF-8''${encodeURIComponent(thumb ? `thumb-${row.name}.webp` : row.name)}`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, max-age=3600",
    },
  });
}

// Taking a file away: builders and owners of its team (another team's file is a 404 before the form is read).
export async function action({ request, params }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  if (!(await getStoredFile(team.id, params.fileId))) throw notFound("No such file in this shop.");
  const form = await request.formData();
  if (form.get("intent") !== "delete") throw data("Unknown action.", { status: 400 });
  const removed = await deleteFile(team.id, user.id, params.fileId);
  if (!removed) throw notFound("No such file in this shop.");
  const back = removed.engineId !== null ? `/engines/${removed.engineId}/files` : "/libraries";
  return redirectWithToast(request, safeRedirect(String(form.get("returnTo") ?? ""), back), `Took away ${removed.name}.`);
}
