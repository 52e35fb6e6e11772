import sharp from "sharp";
import { fileStorage, newStorageKey } from "~/utils/files.server";
import { ownerDb } from "../setup/db-roles";

/** One stored photo on an engine (for matrices that need a file id), written as an upload would be. */
export async function seedFile(teamId: number, engineId: number): Promise<number> {
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: "#a4521f" } })
    .png()
    .toBuffer();
  const key = newStorageKey(teamId);
  await fileStorage().set(key, new File([png], "matrix.png", { type: "image/png" }));
  const [row] = await ownerDb()("files")
    .insert({
      team_id: teamId,
      engine_id: engineId,
      storage_key: key,
      name: "matrix.png",
      content_type: "image/png",
      size_bytes: png.length,
      created_at: new Date().toISOString(),
    })
    .returning("id");
  return row.id as number;
}
