// The local SMTP sink for development and tests: catches every message the app sends and keeps it as
// a JSON file in MAIL_SINK_DIR (default data/mailbox), where /dev/mailbox and the e2e tests read it.
// Nothing leaves the machine. `npm run dev` starts it beside the dev server; the Playwright config
// starts it beside the built app. Run alone: `node --import tsx scripts/mail-sink.ts`.
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";
import { writeStoredMessage } from "../app/utils/mail-store.server.ts";

export interface MailSink {
  port: number;
  close(): Promise<void>;
}

export function startMailSink(options: { port: number; host?: string; dir: string }): Promise<MailSink> {
  const server = new SMTPServer({
    // a sink on the loopback: no TLS, any (or no) login is accepted
    secure: false,
    disabledCommands: ["STARTTLS"],
    authOptional: true,
    onAuth(_auth, _session, callback) {
      callback(null, { user: "sink" });
    },
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address);
          writeStoredMessage(options.dir, {
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            to,
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : "",
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
    logger: false,
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, options.host ?? "127.0.0.1", () => {
      const address = server.server.address();
      const port = typeof address === "object" && address ? address.port : options.port;
      resolve({ port, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}

// Run as a script (not when a test imports startMailSink).
if (import.meta.url === `file://${process.argv[1]}`) {
  const port = Number(process.env.SMTP_PORT ?? 1025);
  const dir = process.env.MAIL_SINK_DIR ?? "data/mailbox";
  const sink = await startMailSink({ port, dir });
  console.log(`mail sink on 127.0.0.1:${sink.port}, storing in ${dir}`);
  for (const signal of ["SIGINT", "SIGTERM"] as const) process.once(signal, () => void sink.close().then(() => process.exit(0)));
}
