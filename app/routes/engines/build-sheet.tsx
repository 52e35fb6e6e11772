import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/build-sheet";
import { BuildSheetView } from "~/components/build-sheet";
import { CAUTION_HANDLE } from "~/components/caution";
import { Button, ErrorSummary, SelectField, TextArea } from "~/components/form";
import { buildSheetMail } from "~/lib/mail/messages";
import { sheetSummary, verdictText } from "~/lib/plan/build-sheet";
import { buildSheet } from "~/models/build-sheet.server";
import { engineViewers } from "~/models/engine-share.server";
import { requireEngine } from "~/models/engine.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { appUrl } from "~/utils/env.server";
import { sendMail } from "~/utils/mail.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";
import sheetCss from "~/styles/build-sheet.css?url";

export const links: Route.LinksFunction = () => [{ rel: "stylesheet", href: sheetCss }];
export const meta: Route.MetaFunction = ({ data }) => [{ title: `Build sheet · ${data?.engine.name ?? "Engine"} · Sealwright` }];
export const handle = CAUTION_HANDLE;

const SendSchema = z.object({
  viewerId: z.coerce.number({ error: "Pick who gets it" }).int("Pick who gets it").positive("Pick who gets it"),
  note: z.string().trim().max(1000, "Keep the note under 1,000 characters").default(""),
});

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const sheet = await buildSheet(team.id, engine, user.units);
  const canSend = roleAtLeast(role, "builder");
  const recipients = canSend ? (await engineViewers(team.id, engine.id)).filter((v) => v.shared) : [];
  return {
    engine,
    teamName: team.name,
    units: user.units,
    sheet,
    canSend,
    recipients: recipients.map((r) => ({ userId: r.userId, name: r.name, email: r.email })),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const submission = parseSubmission(await request.formData(), SendSchema);
  const refuse = (status: number, formErrors?: string[]) => data({ result: submission.reply({ formErrors }) }, { status });
  if (submission.status !== "success") return refuse(400);
  const { viewerId, note } = submission.value;
  // only a viewer the engine is shared with: the link in the mail opens the sheet for them alone
  const recipient = (await engineViewers(team.id, engine.id)).find((v) => v.userId === viewerId && v.shared);
  if (!recipient) throw data("No such viewer shares this engine.", { status: 404 });
  const sheet = await buildSheet(team.id, engine, user.units);
  if (!sheet.ok) return refuse(400, [sheet.reason]);
  const rows = sheetSummary({ ...sheet, compressionRatio: sheet.chamber?.compressionRatio ?? null }, user.units);
  const content = buildSheetMail({
    teamName: team.name,
    senderName: user.name,
    recipientName: recipient.name,
    engineName: engine.name,
    planName: sheet.plan.name,
    verdict: verdictText(sheet.view),
    rows,
    link: `${appUrl()}/engines/${engine.id}/build-sheet`,
    note,
  });
  try {
    await sendMail(recipient.email, content);
  } catch (error) {
    return refuse(502, [`The mail could not be sent (${(error as Error).message}). Try again later.`]);
  }
  return redirectWithToast(request, `/engines/${engine.id}/build-sheet`, `Build sheet sent to ${recipient.name}.`);
}

export default function BuildSheetPage({ loaderData, actionData }: Route.ComponentProps) {
  const { engine, sheet, units, canSend, recipients, teamName } = loaderData;
  const [form, fields] = useForm<{ viewerId: string; note: string }>({
    id: "send-sheet",
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  return (
    <div className="build-sheet max-w-4xl space-y-6">
      <div className="no-print flex flex-wrap items-center justify-between gap-3">
        <h2 className="text-2xl font-bold">Build sheet</h2>
        {sheet.ok ? (
          <Button type="button" kind="plain" onClick={() => window.print()}>
            Print
          </Button>
        ) : null}
      </div>
      {sheet.ok ? (
        <BuildSheetView engine={engine} sheet={sheet} units={units} teamName={teamName} />
      ) : (
        <p role="status" className="rounded border border-caution bg-caution-50 p-3">
          ⚠ {sheet.reason}{" "}
          <Link to={`/engines/${engine.id}/plans`} className="underline">
            Seal plans
          </Link>
        </p>
      )}
      {canSend && sheet.ok ? (
        <section aria-labelledby="send-title" className="no-print max-w-xl rounded border border-forge-100 bg-white p-4">
          <h2 id="send-title" className="text-xl font-bold">
            E-mail it to the customer
          </h2>
          {recipients.length === 0 ? (
            <p className="mt-2 text-sm">
              Nobody can receive it yet: share the engine with a viewer first on the{" "}
              <Link to={`/engines/${engine.id}/sharing`} className="text-copper-700 underline">
                Sharing
              </Link>{" "}
              tab.
            </p>
          ) : (
            <Form method="post" className="mt-3 space-y-3" {...getFormProps(form)}>
              <p className="text-sm text-forge-700">The mail carries a summary and a link; the full sheet opens only when they sign in.</p>
              <ErrorSummary errors={form.allErrors} message={form.errors?.[0] ?? null} answer={actionData} />
              <SelectField
                label="Send to"
                name={fields.viewerId.name}
                options={recipients.map((r) => [String(r.userId), `${r.name} (${r.email})`])}
                defaultValue={fields.viewerId.initialValue}
                error={fields.viewerId.errors?.[0]}
              />
              <TextArea
                label="Note (optional)"
                name={fields.note.name}
                rows={3}
                maxLength={1000}
                defaultValue={fields.note.initialValue}
                error={fields.note.errors?.[0]}
              />
              <Button type="submit">Send the build sheet</Button>
            </Form>
          )}
        </section>
      ) : null}
    </div>
  );
}
