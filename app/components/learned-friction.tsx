import { formatQuantity, type UnitSystem } from "~/lib/units";

export interface LearnedOffer {
  fastenerId: number;
  lubricant: string;
  friction: number;
  spread: number;
  count: number;
  shift: { handbookN: number; learnedN: number; change: number; torqueNm: number; fromMaker: boolean } | null;
}

// The shop's learned friction offered beside a new plan's friction fields: the builder may type it in;
// nothing is applied for them, and the maker's torque stays the figure that governs.
export function LearnedFrictionOffer({ learned, units }: { learned: LearnedOffer[]; units: UnitSystem }) {
  if (learned.length === 0) return null;
  return (
    <aside aria-label="Your shop's friction" className="mt-2 rounded border border-forge-300 bg-white p-3 text-sm">
      {learned.map((l) => (
        <p key={l.lubricant}>
          <strong>Your shop's friction</strong> with “{l.lubricant}”: {l.friction.toFixed(3)} ± {l.spread.toFixed(3)}, from {l.count} of
          your assemblies.
          {l.shift
            ? ` At ${l.shift.fromMaker ? "the maker's" : "the plan's"} ${formatQuantity(l.shift.torqueNm, "torque", units)} it gives ${formatQuantity(l.shift.learnedN, "force", units)} per stud, ${(l.shift.change * 100).toFixed(0)} % against the handbook friction.`
            : ""}{" "}
          Type it into the friction fields to plan with it; the maker's torque still governs.
        </p>
      ))}
    </aside>
  );
}
