import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/sharing";
import { Button, ErrorSummary } from "~/components/form";
import { engineViewers, setEngineShare } from "~/models/engine-share.server";
import { requireEngine } from "~/models/engine.server";
import { requireRole } from "~/utils/auth.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Sharing · Sealwright" }];

const ShareSchema = z.object({
  viewerId: z.coerce.number({ error: "No such viewer" }).int("No such viewer").positive("No such viewer"),
  shared: z.enum(["true", "false"], "Share or stop sharing"),
});

export async function loader({ request, params }: Route.LoaderArgs) {
  const { team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  return { engine: { id: engine.id, name: engine.name }, viewers: await engineViewers(team.id, engine.id) };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { team, user, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const submission = parseSubmission(await request.formData(), ShareSchema);
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  const shared = submission.value.shared === "true";
  await setEngineShare(team.id, user.id, engine.id, submission.value.viewerId, shared);
  const message = shared ? "Shared: the viewer now sees this engine, its plans and its build sheet." : "No longer shared with that viewer.";
  return redirectWithToast(request, `/engines/${engine.id}/sharing`, message);
}

export default function Sharing({ loaderData, actionData }: Route.ComponentProps) {
  const { engine, viewers } = loaderData;
  // the rows' fields are hidden: the answer's first message is the summary's line
  const error = Object.values(actionData?.result.error ?? {}).flatMap((list) => list ?? [])[0] ?? null;
  return (
    <div className="max-w-3xl space-y-4">
      <h2 className="text-2xl font-bold">Sharing</h2>
      <p className="text-forge-700">
        Viewers (customers, tuners) see only the engines shared with them: this engine's record, seal plans, chamber and build sheet,
        read-only. Builders and owners always see every engine.
      </p>
      <ErrorSummary message={error} answer={actionData} />
      {viewers.length === 0 ? (
        <p className="rounded border border-forge-100 bg-white p-3">
          The shop has no viewers yet. An owner invites one on the{" "}
          <Link to="/team" className="text-copper-700 underline">
            Team
          </Link>{" "}
          page (builders: ask an owner).
        </p>
      ) : (
        <table className="w-full border-collapse bg-white text-left">
          <caption className="sr-only">The shop's viewers and whether {engine.name} is shared with them</caption>
          <thead className="bg-forge-100 text-sm">
            <tr>
              <th scope="col" className="px-3 py-2">
                Viewer
              </th>
              <th scope="col" className="px-3 py-2">
                Sees this engine
              </th>
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Change</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {viewers.map((v) => (
              <tr key={v.userId} className="border-t border-forge-100">
                <td className="px-3 py-2">
                  {v.name} <span className="break-all text-sm text-forge-700">{v.email}</span>
                </td>
                <td className="px-3 py-2">{v.shared ? "✔ yes" : "no"}</td>
                <td className="px-3 py-2">
                  <Form method="post">
                    <input type="hidden" name="viewerId" value={v.userId} />
                    <input type="hidden" name="shared" value={v.shared ? "false" : "true"} />
                    <Button type="submit" kind="plain" aria-label={`${v.shared ? "Stop sharing with" : "Share with"} ${v.name}`}>
                      {v.shared ? "Stop sharing" : "Share"}
                    </Button>
                  </Form>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
