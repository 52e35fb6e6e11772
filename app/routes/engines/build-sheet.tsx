import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/build-sheet";
import { BuildSheetView } from "~/components/build-sheet";
import { CAUTION_HANDLE } from "~/components/caution";
import { Button, FormError, SelectField } from "~/components/form";
import { buildSheetMail } from "~/lib/mail/messages";
import { sheetSummary, verdictText } from "~/lib/plan/build-sheet";
import { buildSheet } from "~/models/build-sheet.server";
import { engineViewers } from "~/models/engine-share.server";
import { requireEngine } from "~/models/engine.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { appUrl } from "~/utils/env.server";
import { sendMail } from "~/utils/mail.server";
import { redirectWithToast } from "~/utils/toast.server";
import sheetCss from "~/styles/build-sheet.css?url";
import { fieldErrors } from "~/utils/field-errors";

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
  const parsed = SendSchema.safeParse(Object.fromEntries(await request.formData()));
  if (!parsed.success) return data({ errors: fieldErrors(parsed.error.issues), error: null }, { status: 400 });
  // only a viewer the engine is shared with: the link in the mail opens the sheet for them alone
  const recipient = (await engineViewers(team.id, engine.id)).find((v) => v.userId === parsed.data.viewerId && v.shared);
  if (!recipient) throw data("No such viewer shares this engine.", { status: 404 });
  const sheet = await buildSheet(team.id, engine, user.units);
  if (!sheet.ok) return data({ errors: {} as Record<string, string>, error: sheet.reason }, { status: 400 });
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
    note: parsed.data.note,
  });
  try {
    await sendMail(recipient.email, content);
  } catch (error) {
    return data(
      { errors: {} as Record<string, string>, error: `The mail could not be sent (${(error as Error).message}). Try again later.` },
      { status: 502 },
    );
  }
  return redirectWithToast(request, `/engines/${engine.id}/build-sheet`, `Build sheet sent to ${recipient.name}.`);
}

export default function BuildSheetPage({ loaderData, actionData }: Route.ComponentProps) {
  const { engine, sheet, units, canSend, recipients, teamName } = loaderData;
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
            <Form method="post" className="mt-3 space-y-3">
              <p className="text-sm text-forge-700">The mail carries a summary and a link; the full sheet opens only when they sign in.</p>
              <FormError message={actionData?.error} />
              <SelectField
                label="Send to"
                name="viewerId"
                options={recipients.map((r) => [String(r.userId), `${r.name} (${r.email})`])}
                error={actionData?.errors?.viewerId}
              />
              <div>
                <label htmlFor="f-note" className="block text-sm font-medium text-forge-800">
                  Note (optional)
                </label>
                <textarea
                  id="f-note"
                  name="note"
                  rows={3}
                  maxLength={1000}
                  className="mt-1 block w-full rounded border border-forge-300 px-3 py-2"
                  aria-invalid={actionData?.errors?.note ? true : undefined}
                />
                {actionData?.errors?.note ? <p className="mt-1 text-sm font-medium text-failed">✖ {actionData.errors.note}</p> : null}
              </div>
              <Button type="submit">Send the build sheet</Button>
            </Form>
          )}
        </section>
      ) : null}
    </div>
  );
}
