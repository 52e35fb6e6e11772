import nodemailer, { type Transporter } from "nodemailer";
import type { MailContent } from "~/lib/mail/layout";
import { getEnv } from "./env.server";

// Outgoing mail over SMTP (any provider: host, port, login from the environment). In development and
// tests the defaults reach the local sink (scripts/mail-sink.ts), which keeps every message.

let transport: Transporter | undefined;
let transportKey = "";

function transporter(): Transporter {
  const env = getEnv();
  const key = `${env.SMTP_HOST}:${env.SMTP_PORT}`;
  if (transport && key === transportKey) return transport;
  transportKey = key;
  transport = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE === "true",
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    // a mail server that does not answer must not hold a request for minutes
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return transport;
}

export async function sendMail(to: string, content: MailContent): Promise<void> {
  await transporter().sendMail({ from: getEnv().MAIL_FROM, to, subject: content.subject, text: content.text, html: content.html });
}

/**
 * Sends without making the request wait: for the password reset, whose answer must not take longer
 * when the address exists. A failure is logged (the person can ask again), never shown.
 */
export function sendMailLater(to: string, content: MailContent): Promise<void> {
  return sendMail(to, content).catch((error: Error) => {
    console.warn(`mail to ${to.replace(/^(.).*@/, "$1…@")} not sent: ${error.message}`);
  });
}
