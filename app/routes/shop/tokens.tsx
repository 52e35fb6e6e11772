import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/tokens";
import { PageTitle } from "~/components/app-shell";
import { Button, ErrorSummary, Field, SelectField } from "~/components/form";
import { TokenCreateSchema } from "~/lib/team/forms";
import { ROLES } from "~/lib/team/roles";
import { createToken, listTokens, revokeToken, TokenLimitError } from "~/models/api-token.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";
import { parseSubmission, readIntent } from "~/utils/conform.server";
import { parseId } from "~/utils/ids";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "API tokens · Sealwright" }];

const TokenRevokeSchema = z.object({ tokenId: z.string({ error: "No such token" }) });

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team, role } = await requireUser(request);
  return { team, role, roles: ROLES.filter((r) => roleAtLeast(role, r)), tokens: await listTokens(team.id, user.id) };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, team, role } = await requireUser(request);
  const formData = await request.formData();
  if (readIntent(formData, ["create", "revoke"], "create") === "revoke") {
    const submission = parseSubmission(formData, TokenRevokeSchema);
    const id = submission.status === "success" ? parseId(submission.value.tokenId) : null;
    if (id === null || !(await revokeToken(team.id, user.id, id)))
      return data(
        { intent: "revoke" as const, result: submission.reply({ formErrors: ["No such live token of yours in this shop."] }), token: null },
        { status: 404 },
      );
    return redirectWithToast(request, "/settings/tokens", "Token revoked; it is refused from now on.");
  }
  const submission = parseSubmission(formData, TokenCreateSchema);
  const refuse = (options: { fieldErrors?: Record<string, string[]>; formErrors?: string[] } = {}) =>
    data({ intent: "create" as const, result: submission.reply(options), token: null }, { status: 400 });
  if (submission.status !== "success") return refuse({ formErrors: ["The token was not created."] });
  const { name, role: tokenRole } = submission.value;
  // never more than the person may do in this shop today
  if (!roleAtLeast(role, tokenRole))
    return refuse({
      formErrors: ["The token was not created."],
      fieldErrors: { role: [`You are a ${role} here; a token cannot do more.`] },
    });
  try {
    const made = await createToken(team.id, user.id, name, tokenRole);
    // the form empties for the next token; the new one is shown once
    return { intent: "create" as const, result: submission.reply({ resetForm: true }), token: { name, role: tokenRole, text: made.token } };
  } catch (e) {
    if (e instanceof TokenLimitError) return refuse({ formErrors: [e.message] });
    throw e;
  }
}

const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") + " UTC" : "never");

export default function Tokens({ loaderData, actionData }: Route.ComponentProps) {
  const fresh = actionData?.token ?? null;
  const [form, fields] = useForm<z.input<typeof TokenCreateSchema>>({
    id: "token",
    defaultValue: { role: loaderData.roles[0] },
    lastResult: actionData?.intent === "create" ? actionData.result : undefined,
    shouldValidate: "onSubmit",
  });
  const revokeRefused = actionData?.intent === "revoke" ? actionData.result : undefined;
  return (
    <>
      <PageTitle
        sub={
          <>
            Keys for scripts and dyno laptops to use the{" "}
            <Link className="text-copper-700 underline" to="/docs/api">
              JSON API
            </Link>{" "}
            as you, in {loaderData.team.name}.
          </>
        }
      >
        API tokens
      </PageTitle>
      <ErrorSummary message={revokeRefused?.error?.[""]?.[0] ?? null} answer={revokeRefused} />
      {fresh ? (
        <section aria-labelledby="fresh-token" className="mb-6 max-w-3xl rounded border-2 border-copper-600 bg-white p-4">
          <h2 id="fresh-token" className="font-bold">
            Copy “{fresh.name}” now
          </h2>
          <p className="text-sm">
            This is the only time it is shown; we keep only a hash of it. It acts as a {fresh.role} in {loaderData.team.name}.
          </p>
          <output data-testid="new-token" className="mt-2 block break-all rounded bg-forge-900 p-3 font-mono text-sm text-white">
            {fresh.text}
          </output>
        </section>
      ) : null}
      <Form method="post" className="max-w-xl space-y-3 rounded border border-forge-100 bg-white p-4" {...getFormProps(form)}>
        <h2 className="font-bold">New token</h2>
        <ErrorSummary
          errors={form.allErrors}
          message={form.errors?.[0] ?? null}
          answer={actionData?.intent === "create" ? actionData : null}
        />
        <input type="hidden" name="intent" value="create" />
        <Field
          label="Name"
          name={fields.name.name}
          maxLength={80}
          required
          defaultValue={fields.name.initialValue}
          error={fields.name.errors?.[0]}
          hint="What will use it, so you can tell your tokens apart."
        />
        <SelectField
          label="May act as"
          name={fields.role.name}
          defaultValue={fields.role.initialValue}
          error={fields.role.errors?.[0]}
          options={loaderData.roles.map((r) => [r, r === "viewer" ? "viewer (read only)" : r])}
        />
        <Button type="submit">Create token</Button>
      </Form>
      <h2 className="mt-8 font-bold">Your tokens in {loaderData.team.name}</h2>
      {loaderData.tokens.length === 0 ? (
        <p className="mt-2 text-sm">No live tokens.</p>
      ) : (
        <table className="mt-2 w-full max-w-3xl text-sm">
          <thead>
            <tr className="text-left">
              <th scope="col">Name</th>
              <th scope="col">Starts</th>
              <th scope="col">Role</th>
              <th scope="col">Created</th>
              <th scope="col">Last used</th>
              <th scope="col">
                <span className="sr-only">Revoke</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {loaderData.tokens.map((t) => (
              <tr key={t.id} className="border-t border-forge-100">
                <td>{t.name}</td>
                <td className="font-mono">{t.prefix}…</td>
                <td>{t.role}</td>
                <td>{when(t.createdAt)}</td>
                <td>{when(t.lastUsedAt)}</td>
                <td>
                  <Form method="post">
                    <input type="hidden" name="intent" value="revoke" />
                    <input type="hidden" name="tokenId" value={t.id} />
                    <Button type="submit" kind="plain" aria-label={`Revoke ${t.name}`}>
                      Revoke
                    </Button>
                  </Form>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
