// The messages Sealwright sends. Each takes plain values (names, links, figures already in the
// reader's units) and gives the subject, the plain-text part and the HTML part.
import { mail, type MailContent } from "./layout";

export const INVITE_DAYS = 7;
export const RESET_MINUTES = 60;

const ROLE_WORDS = {
  owner: "an owner (everything, plus the team page)",
  builder: "a builder (engines, seal plans, libraries)",
  viewer: "a viewer (the engines the shop shares with you, read-only)",
} as const;

export function inviteMail(v: { teamName: string; inviterName: string; role: keyof typeof ROLE_WORDS; link: string }): MailContent {
  return mail(
    `${v.inviterName} invites you to ${v.teamName} on Sealwright`,
    `Join ${v.teamName}`,
    [
      { p: `${v.inviterName} invites you to ${v.teamName} on Sealwright as ${ROLE_WORDS[v.role]}.` },
      { button: { href: v.link, label: "Accept the invite" } },
      {
        small: `The link works once and for ${INVITE_DAYS} days. If you already have a Sealwright account with this address, sign in and the shop is added to it; if not, you choose your name and password.`,
      },
    ],
    "You get this because someone in the shop entered your address. If you did not expect it, ignore it: nothing happens unless the link is used.",
  );
}

export function resetMail(v: { name: string; link: string }): MailContent {
  return mail(
    "Reset your Sealwright password",
    "Reset your password",
    [
      { p: `Hello ${v.name}, someone (we hope you) asked to reset the password of your Sealwright account.` },
      { button: { href: v.link, label: "Choose a new password" } },
      {
        small: `The link works once and for ${RESET_MINUTES} minutes. After the reset every device signed in to your account is signed out.`,
      },
    ],
    "If you did not ask for this, ignore this message: your password stays as it is.",
  );
}

export interface BuildSheetSummary {
  teamName: string;
  senderName: string;
  recipientName: string;
  engineName: string;
  planName: string;
  verdict: string;
  rows: [string, string][];
  link: string;
  note: string;
}

export function buildSheetMail(v: BuildSheetSummary): MailContent {
  return mail(
    `Build sheet: ${v.engineName} — ${v.teamName}`,
    `Build sheet for ${v.engineName}`,
    [
      {
        p: `Hello ${v.recipientName}, ${v.senderName} of ${v.teamName} sends you the build sheet of ${v.engineName}: the seal plan "${v.planName}".`,
      },
      ...(v.note ? [{ p: v.note }] : []),
      { p: `Our estimate: ${v.verdict}` },
      { rows: v.rows },
      { button: { href: v.link, label: "Open the build sheet" } },
      {
        small:
          "The full sheet needs you to sign in to Sealwright with this address. Our numbers are estimates; the fastener and engine makers' torque, lubricant and procedure govern; defer to local codes and licensed practice.",
      },
    ],
    `Sent by ${v.teamName} through Sealwright.`,
  );
}
