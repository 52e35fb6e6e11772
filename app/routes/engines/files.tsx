import type { Route } from "./+types/files";
import { FileList, Uploader } from "~/components/uploader";
import { requireEngine } from "~/models/engine.server";
import { listFiles, teamUsedBytes } from "~/models/files.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";
import { teamQuotaBytes } from "~/utils/files.server";
import { UPLOAD_RULE_TEXT } from "~/utils/upload-rules";

export const meta: Route.MetaFunction = () => [{ title: "Files · Sealwright" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const [files, used] = await Promise.all([listFiles(team.id, engine.id), teamUsedBytes(team.id)]);
  return { engineId: engine.id, files, usedBytes: used, quotaBytes: teamQuotaBytes(), canEdit: roleAtLeast(role, "builder") };
}

const MB = (n: number) => `${(n / 1024 / 1024).toFixed(1)} MB`;

export default function Files({ loaderData: d }: Route.ComponentProps) {
  const own = d.files.filter((f) => !f.assemblyId && !f.runId);
  const onRecords = d.files.filter((f) => f.assemblyId || f.runId);
  const returnTo = d.canEdit ? `/engines/${d.engineId}/files` : undefined;
  return (
    <section className="max-w-4xl space-y-4">
      <h2 className="text-2xl font-bold">Files</h2>
      <p className="text-sm text-forge-700">
        Build photos, teardown pictures and makers' sheets, kept for this shop only. {UPLOAD_RULE_TEXT} The shop has used {MB(d.usedBytes)}{" "}
        of its {MB(d.quotaBytes)}.
      </p>
      {returnTo ? <Uploader engineId={d.engineId} returnTo={returnTo} /> : null}
      <h3 className="text-lg font-bold">On the engine ({own.length})</h3>
      {own.length ? (
        <FileList files={own} returnTo={returnTo} />
      ) : (
        <p className="text-sm text-forge-700">No files on the engine itself yet.</p>
      )}
      <h3 className="text-lg font-bold">On its assemblies and runs ({onRecords.length})</h3>
      {onRecords.length ? (
        <FileList files={onRecords} returnTo={returnTo} />
      ) : (
        <p className="text-sm text-forge-700">None yet: add them from the Assembly and Runs tabs.</p>
      )}
    </section>
  );
}
