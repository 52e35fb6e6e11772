import { data, Form, Link, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/login";
import { AuthFrame } from "~/components/auth-frame";
import { Button, ErrorSummary, Field } from "~/components/form";
import { listMemberships } from "~/models/user.server";
import { authenticator, getUser, safeRedirect, SignInError, startSession } from "~/utils/auth.server";
import { clientAddress } from "~/utils/client-address.server";
import { signInAttempt, signInSucceeded } from "~/utils/sign-in-throttle.server";
import { useRootData } from "~/root";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Sealwright" }];

// A throttled attempt's Retry-After reaches the page response too (not only the data).
export const headers: Route.HeadersFunction = ({ actionHeaders }) => {
  const retryAfter = actionHeaders.get("Retry-After");
  return retryAfter ? { "Retry-After": retryAfter } : new Headers();
};

export async function loader({ request }: Route.LoaderArgs) {
  if (await getUser(request)) throw redirect("/dashboard");
  return null;
}

export async function action({ request, context }: Route.ActionArgs) {
  const redirectTo = safeRedirect(new URL(request.url).searchParams.get("redirectTo"));
  const email = String((await request.clone().formData()).get("email") ?? "");
  const address = clientAddress(context);
  // Throttled before the password is checked: a refused guess never reaches the hash.
  const refused = await signInAttempt(email, address);
  if (refused) return data({ error: refused.message, email }, { status: 429, headers: refused.headers });
  try {
    const user = await authenticator.authenticate("form", request);
    await signInSucceeded(email, address);
    const [first] = await listMemberships(user.id);
    return startSession(request, user.id, first?.teamId ?? null, redirectTo);
  } catch (error) {
    if (error instanceof SignInError) return data({ error: error.message, email }, { status: 400 });
    throw error;
  }
}

export default function Login({ actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  return (
    <AuthFrame toast={useRootData()?.toast} title="Sign in">
      <Form method="post" className="space-y-4">
        <ErrorSummary message={actionData?.error} answer={actionData} />
        <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={actionData?.email} />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required />
        <Button type="submit" disabled={busy}>
          {busy ? "Signing in…" : "Sign in"}
        </Button>
      </Form>
      <p className="mt-4 text-sm">
        <Link className="text-copper-700 underline" to="/forgot-password">
          Forgot your password?
        </Link>
      </p>
      <p className="mt-6 text-sm">
        New shop?{" "}
        <Link className="text-copper-700 underline" to="/signup">
          Create an account and a team
        </Link>
      </p>
    </AuthFrame>
  );
}
