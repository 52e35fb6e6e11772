import fs from "node:fs";
import path from "node:path";

// Where the e2e run's SMTP sink keeps what it caught (one JSON file a message; scripts/mail-sink.ts).
export const MAIL_DIR = "tests/.e2e-mail";
const ROOT = new URL("../..", import.meta.url).pathname;

interface Caught {
  to: string[];
  subject: string;
  text: string;
  html: string;
}

/** Waits for the newest message to this address that arrived after `since` (ISO time) and returns it. */
export async function waitForMail(address: string, since: string, timeoutMs = 10_000): Promise<Caught> {
  const dir = path.join(ROOT, MAIL_DIR);
  for (let waited = 0; waited < timeoutMs; waited += 100) {
    const files = fs.existsSync(dir)
      ? fs
          .readdirSync(dir)
          .filter((f) => f.endsWith(".json"))
          .sort()
          .reverse()
      : [];
    for (const f of files) {
      const m = JSON.parse(fs.readFileSync(path.join(dir, f), "utf8")) as Caught & { receivedAt: string };
      if (m.to.includes(address) && m.receivedAt >= since) return m;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${address} since ${since}`);
}

/** The path of the first link to the app in the message's text part that starts with `prefix`. */
export function linkIn(message: Caught, prefix: string): string {
  const match = message.text.match(new RegExp(`https?://[^\\s/]+(${prefix}[A-Za-z0-9_\\-/]+)`));
  if (!match) throw new Error(`no ${prefix} link in "${message.subject}"`);
  return match[1]!;
}
