import { data, Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/tokens";
import { PageTitle } from "~/components/app-shell";
import { Button, Field, FormError, SelectField } from "~/components/form";
import { ROLES } from "~/lib/team/roles";
import { createToken, listTokens, revokeToken, TokenLimitError } from "~/models/api-token.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";
import { readIntent } from "~/utils/conform.server";
import { parseId } from "~/utils/ids";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "API tokens · Sealwright" }];

const TokenCreateSchema = z.object({
  intent: z.literal("create"),
  name: z.string().trim().min(1, "Name the token (what will use it: “dyno laptop”)").max(80, "At most 80 characters"),
  role: z.enum(ROLES, "Pick what the token may do"),
});
const TokenRevokeSchema = z.object({ intent: z.literal("revoke"), tokenId: z.string() });

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team, role } = await requireUser(request);
  return { team, role, roles: ROLES.filter((r) => roleAtLeast(role, r)), tokens: await listTokens(team.id, user.id) };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, team, role } = await requireUser(request);
  const form = Object.fromEntries(await request.formData());
  if (readIntent(form, ["create", "revoke"], "create") === "revoke") {
    const parsed = TokenRevokeSchema.safeParse(form);
    const id = parsed.success ? parseId(parsed.data.tokenId) : null;
    if (id === null || !(await revokeToken(team.id, user.id, id)))
      return data({ error: "No such live token of yours in this shop.", errors: {}, token: null }, { status: 404 });
    return redirectWithToast(request, "/settings/tokens", "Token revoked; it is refused from now on.");
  }
  const parsed = TokenCreateSchema.safeParse(form);
  if (!parsed.success) {
    const errors = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? "form"), i.message]));
    return data({ error: "The token was not created.", errors, token: null }, { status: 400 });
  }
  // never more than the person may do in this shop today
  if (!roleAtLeast(role, parsed.data.role)) {
    return data(
      { error: "The token was not created.", errors: { role: `You are a ${role} here; a token cannot do more.` }, token: null },
      { status: 400 },
    );
  }
  try {
    const made = await createToken(team.id, user.id, parsed.data.name, parsed.data.role);
    return { error: null, errors: {}, token: { name: parsed.data.name, role: parsed.data.role, text: made.token } };
  } catch (e) {
    if (e instanceof TokenLimitError) return data({ error: e.message, errors: {}, token: null }, { status: 400 });
    throw e;
  }
}

const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") + " UTC" : "never");

export default function Tokens({ loaderData, actionData }: Route.ComponentProps) {
  const fresh = actionData?.token ?? null;
  const errors = (actionData?.errors ?? {}) as Record<string, string>;
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
      <Form method="post" className="max-w-xl space-y-3 rounded border border-forge-100 bg-white p-4">
        <h2 className="font-bold">New token</h2>
        <FormError message={actionData?.error} />
        <input type="hidden" name="intent" value="create" />
        <Field
          label="Name"
          name="name"
          maxLength={80}
          required
          error={errors.name}
          hint="What will use it, so you can tell your tokens apart."
        />
        <SelectField
          label="May act as"
          name="role"
          defaultValue={loaderData.roles[0]}
          error={errors.role}
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
