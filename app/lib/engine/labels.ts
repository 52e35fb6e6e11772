// Words (and icons, so status never rests on colour alone) for the engine record's choices.
import type { Stud } from "../clamp/schema";
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

export function formatShare(share: number): string {
  return String(Number(share.toFixed(4)));
}

/** "10 studs: 6 shared by two bores, 4 serving one bore". */
export function patternSummary(studs: Stud[]): string {
  const byCount = new Map<number, number>();
  for (const s of studs) byCount.set(s.serves.length, (byCount.get(s.serves.length) ?? 0) + 1);
  const parts = [...byCount.entries()]
    .sort((a, b) => b[0] - a[0])
    .map(([bores, n]) => (bores === 1 ? `${n} serving one bore` : `${n} shared by ${bores === 2 ? "two" : bores} bores`));
  return `${studs.length} stud${studs.length === 1 ? "" : "s"}: ${parts.join(", ")}`;
}
