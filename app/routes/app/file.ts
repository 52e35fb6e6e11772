import type { Route } from "./+types/file";
import { getEngine } from "~/models/engine.server";
import { getStoredFile } from "~/models/files.server";
import { requireUser } from "~/utils/auth.server";
import { fileStorage } from "~/utils/files.server";

// A kept file, to members of its team only (another team's file is a 404), and to a viewer only when its
// engine is shared with them. Photos open in the browser,
// PDFs download; the type is the one sniffed at upload, and nosniff stops the browser guessing another.
export async function loader({ request, params }: Route.LoaderArgs) {
  const { team, who } = await requireUser(request);
  const row = await getStoredFile(team.id, params.fileId);
  if (!row || !(await getEngine(who, row.engineId)))
    throw new Response("No such file in this shop.", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  const thumb = new URL(request.url).searchParams.get("thumb") === "1" && row.thumbKey;
  const stored = await fileStorage().get(thumb ? row.thumbKey! : row.storageKey);
  if (!stored)
    throw new Response("The file is missing from storage.", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
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
