import { data, Link } from "react-router";
import type { Route } from "./+types/mailbox";
import { getEnv, mailboxOpen } from "~/utils/env.server";
import { getStoredMessage, listStoredMessages } from "~/utils/mail-store.server";

// Development only: the messages the local SMTP sink caught (scripts/mail-sink.ts). Absent (404) in a
// production build unless DEV_MAILBOX=true. Each message's HTML is shown in a sandboxed frame.

export const meta: Route.MetaFunction = () => [{ title: "Mailbox (development) · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  if (!mailboxOpen()) throw data("Not found", { status: 404 });
  const dir = getEnv().MAIL_SINK_DIR;
  const id = new URL(request.url).searchParams.get("id");
  const messages = listStoredMessages(dir).map(({ html: _h, text: _t, ...m }) => m);
  const open = id ? getStoredMessage(dir, id) : null;
  return { dir, messages: messages.slice(0, 100), open };
}

export default function Mailbox({ loaderData }: Route.ComponentProps) {
  const { dir, messages, open } = loaderData;
  return (
    <main className="mx-auto max-w-6xl p-4">
      <h1 className="text-2xl font-bold">Mailbox (development only)</h1>
      <p className="text-sm text-forge-700">
        Every message the app sent to the local SMTP sink, newest first; stored in {dir}. Nothing here left the machine.
      </p>
      <div className="mt-4 grid gap-4 md:grid-cols-[20rem_1fr]">
        <ul className="space-y-1 text-sm">
          {messages.length === 0 ? <li>No messages yet.</li> : null}
          {messages.map((m) => (
            <li key={m.id}>
              <Link
                to={`/dev/mailbox?id=${m.id}`}
                className={`block rounded px-2 py-1 ${open?.id === m.id ? "bg-copper-50 font-bold" : "hover:bg-forge-100"}`}
              >
                <span className="block break-all">{m.to.join(", ")}</span>
                <span className="block">{m.subject}</span>
                <span className="block text-xs text-forge-700">{m.receivedAt}</span>
              </Link>
            </li>
          ))}
        </ul>
        {open ? (
          <section aria-label="The message" className="space-y-2">
            <p className="text-sm">
              <strong>{open.subject}</strong> — to {open.to.join(", ")} from {open.from}
            </p>
            {/* sandbox without scripts: the mail's HTML cannot run anything in the app's origin */}
            <iframe title="HTML part" sandbox="" srcDoc={open.html} className="h-[32rem] w-full rounded border border-forge-300 bg-white" />
            <details>
              <summary className="cursor-pointer text-sm">Plain-text part</summary>
              <pre className="overflow-x-auto whitespace-pre-wrap rounded bg-white p-3 text-sm">{open.text}</pre>
            </details>
          </section>
        ) : null}
      </div>
    </main>
  );
}
