import { data, isRouteErrorResponse, Links, Meta, Outlet, Scripts, ScrollRestoration, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import "./app.css";
import { useNonce } from "./components/nonce";
import { readToast } from "./utils/toast.server";
import { guardRequest } from "./utils/request-middleware.server";
import roboto400 from "@fontsource/roboto-condensed/files/roboto-condensed-latin-400-normal.woff2?url";
import roboto700 from "@fontsource/roboto-condensed/files/roboto-condensed-latin-700-normal.woff2?url";

// Every request: refused writes and bad ids answered first, security headers on whatever goes out.
export const middleware: Route.MiddlewareFunction[] = [guardRequest];

// The two faces the first paint uses, fetched with the page rather than after the CSS is read: the
// text swaps from the fallback before it is laid out, not after (layout shift on the dashboard and editor).
export const links: Route.LinksFunction = () => [
  { rel: "icon", href: "/favicon.svg", type: "image/svg+xml" },
  { rel: "preload", href: roboto400, as: "font", type: "font/woff2", crossOrigin: "anonymous" },
  { rel: "preload", href: roboto700, as: "font", type: "font/woff2", crossOrigin: "anonymous" },
];

export async function loader({ request }: Route.LoaderArgs) {
  const { toast, setCookie } = await readToast(request);
  return data({ toast }, setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined);
}

export function Layout({ children }: { children: React.ReactNode }) {
  const nonce = useNonce();
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen font-sans">
        {children}
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export function useRootData() {
  return useRouteLoaderData<typeof loader>("root");
}

export default function App() {
  return <Outlet />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  let title = "Something went wrong";
  let detail = "The page could not be shown. Try again, or go back to the dashboard.";
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      title = "Not found";
      detail = "There is nothing here, or it belongs to a shop you are not part of.";
    } else if (error.status === 403) {
      title = "Not allowed";
      detail = typeof error.data === "string" ? error.data : "Your role in this shop does not allow this.";
    } else {
      title = `${error.status} ${error.statusText}`;
      if (typeof error.data === "string") detail = error.data;
    }
  } else if (import.meta.env.DEV && error instanceof Error) {
    detail = error.message;
  }
  return (
    <main className="mx-auto max-w-xl p-8">
      <title>{`${title} · Sealwright`}</title>
      <h1 className="text-3xl font-bold">{title}</h1>
      <p className="mt-3 text-lg">{detail}</p>
      <p className="mt-6">
        <a className="text-copper-700 underline" href="/dashboard">
          Back to the dashboard
        </a>
      </p>
    </main>
  );
}
