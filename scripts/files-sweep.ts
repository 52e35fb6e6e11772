// npm run files:sweep: removes stored uploads (disk or S3, as FILE_STORAGE says) that no files row names
// and that are older than FILE_SWEEP_MINUTES (default 60) — what a crash between storing a file and
// writing its row leaves, or a deleted engine, fastener or gasket (their rows go by cascade). npm start
// runs it before serving; hosted, run it from the deploy job or a timer (docs/hosting.md).
import { sweepOrphanFiles } from "../app/models/files.server.ts";
import { closeDb } from "../app/utils/db.server.ts";

try {
  const { listed, removed } = await sweepOrphanFiles();
  console.log(`files:sweep: ${listed} stored object(s) listed, ${removed.length} without a row removed`);
} finally {
  await closeDb();
}
