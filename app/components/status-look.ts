import type { Status } from "~/lib/clamp/limits";

export type StatusLook = { word: string; icon: string; tone: string };

/** How a verdict status reads: a word and an icon as well as a colour (apart, so lists need no model code). */
export const STATUS_LOOK: Record<Status, StatusLook> = {
  holds: { word: "Holds", icon: "✔", tone: "text-held bg-held-50 border-held" },
  thin: { word: "Thin", icon: "⚠", tone: "text-caution bg-caution-50 border-caution" },
  short: { word: "Short", icon: "✖", tone: "text-failed bg-failed-50 border-failed" },
};
