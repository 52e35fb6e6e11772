// Words (and icons, so status never rests on colour alone) for the engine record's choices.
import type { SleeveKind } from "./schema";
import type { EngineStatus } from "./status";

export const STATUS_LABEL: Record<EngineStatus, { word: string; icon: string }> = {
  quoted: { word: "Quoted", icon: "◇" },
  "in-build": { word: "In build", icon: "⚙" },
  running: { word: "Running", icon: "▶" },
  retired: { word: "Retired", icon: "■" },
};

export const SLEEVE_LABEL: Record<SleeveKind, string> = {
  none: "No sleeves (parent bore)",
  dry: "Dry sleeves",
  "wet-flange": "Wet sleeves, top flange",
  "wet-mid": "Wet sleeves, mid support",
};

export const PEAK_SOURCE_LABEL = { measured: "measured", estimated: "estimate" } as const;

/** Short layout name: "I4", "V8". */
export function layoutName(layout: "inline" | "V", cylinders: number): string {
  return `${layout === "V" ? "V" : "I"}${cylinders}`;
}
