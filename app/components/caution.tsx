// The caution shown wherever a torque or clamp figure appears, and in short form in the footer of the
// pages that show none — once per page. A route whose page shows it in full says so in its handle.

/** A route module's `handle` when its page shows the full caution beside its figures. */
export const CAUTION_HANDLE = { caution: true } as const;

export function pageShowsCaution(matches: readonly { handle?: unknown }[]): boolean {
  return matches.some((m) => typeof m.handle === "object" && m.handle !== null && (m.handle as { caution?: unknown }).caution === true);
}
export const CAUTION_SHORT = "Estimates, not instructions. The fastener and engine makers' torque, lubricant and procedure govern.";

export function Caution({ className = "" }: { className?: string }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={`rounded border-l-4 border-caution bg-caution-50 px-4 py-3 text-sm text-forge-950 ${className}`}
    >
      <p>
        <strong>⚠ Estimates, not instructions.</strong> Our figures come from a simplified spring model of the joint. The fastener maker's
        torque, lubricant and procedure govern; never use our figure in place of theirs. A failed head seal or a broken stud under boost can
        injure people: follow the engine and fastener makers' procedures, use calibrated tools, and defer to local rules and licensed
        practice.
      </p>
    </aside>
  );
}
