import fs from "node:fs";
import path from "node:path";
import { inject } from "vitest";
import { listStoredMessages, type StoredMessage } from "~/utils/mail-store.server";
import { startMailSink, type MailSink } from "../../scripts/mail-sink";

// A real SMTP sink (the one `npm run dev` starts) for one test file, on a free port, storing in the
// run's temporary folder. Start it before anything reads the environment (before signing in): the
// app then sends over SMTP to it, as it would to a real server.
export async function startTestSink(): Promise<
  MailSink & {
    dir: string;
    messagesTo(address: string): StoredMessage[];
    waitFor(address: string, count?: number): Promise<StoredMessage[]>;
  }
> {
  const dir = path.join(inject("testDbDir"), `mail-${process.pid}-${Math.random().toString(16).slice(2)}`);
  fs.mkdirSync(dir, { recursive: true });
  const sink = await startMailSink({ port: 0, dir });
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String(sink.port);
  process.env.MAIL_SINK_DIR = dir;
  const messagesTo = (address: string) => listStoredMessages(dir).filter((m) => m.to.includes(address));
  return {
    ...sink,
    dir,
    messagesTo,
    // mail sent after the answer (the password reset) arrives a moment later
    async waitFor(address: string, count = 1) {
      for (let i = 0; i < 100; i++) {
        const found = messagesTo(address);
        if (found.length >= count) return found;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error(`no mail to ${address} within 5 s`);
    },
  };
}

/** The path of the first link to this site in a message's text part, e.g. "/invite/…". */
export function linkPath(message: StoredMessage, prefix: string): string {
  const match = message.text.match(new RegExp(`https?://[^\\s/]+(${prefix.replace(/\//g, "\\/")}[A-Za-z0-9_\\-/]+)`));
  if (!match) throw new Error(`no ${prefix} link in "${message.subject}"`);
  return match[1]!;
}
