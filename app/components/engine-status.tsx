import { STATUS_LABEL } from "~/lib/engine/labels";
import type { EngineStatus } from "~/lib/engine/status";

// An engine's status as word + icon; the colour only repeats what the word says.
export function StatusBadge({ status }: { status: EngineStatus }) {
  const label = STATUS_LABEL[status];
  const look =
    status === "running"
      ? "border-held bg-held-50 text-held"
      : status === "in-build"
        ? "border-copper-600 bg-copper-50 text-copper-700"
        : status === "retired"
          ? "border-forge-300 bg-forge-100 text-forge-700"
          : "border-forge-500 bg-white text-forge-800";
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded border px-2 py-0.5 text-sm font-medium ${look}`}>
      <span aria-hidden="true">{label.icon}</span> {label.word}
    </span>
  );
}
