import { formatQuantity, type UnitSystem } from "~/lib/units";

interface Props {
  ourTorqueNm: number;
  makerTorqueNm: number | null;
  makerLubricant: string | null;
  makerStages?: string | null;
  units: UnitSystem;
}

// The fastener maker's recorded figure beside ours, and what the difference means.
export function MakerTorque({ ourTorqueNm, makerTorqueNm, makerLubricant, makerStages, units }: Props) {
  if (makerTorqueNm === null) {
    return (
      <p className="rounded border border-caution bg-caution-50 px-3 py-2 text-sm" data-testid="maker-figure">
        ⚠ No maker's torque is recorded for this fastener. Add it from the maker's sheet in Libraries → Fasteners; the maker's figure,
        lubricant and procedure govern.
      </p>
    );
  }
  const diff = ourTorqueNm - makerTorqueNm;
  const pct = (diff / makerTorqueNm) * 100;
  const same = Math.abs(pct) < 0.5;
  return (
    <div className="rounded border border-forge-300 bg-white px-3 py-2 text-sm" data-testid="maker-figure">
      <p>
        <strong>Fastener maker's figure:</strong> {formatQuantity(makerTorqueNm, "torque", units)}
        {makerStages ? ` (stages: ${makerStages})` : ""}. Lubricant: {makerLubricant || "not recorded"}.
      </p>
      <p className="mt-1">
        {same
          ? "This plan uses the maker's torque."
          : `This plan's ${formatQuantity(ourTorqueNm, "torque", units)} is ${formatQuantity(Math.abs(diff), "torque", units)} (${Math.abs(pct).toFixed(0)} %) ${diff > 0 ? "above" : "below"} the maker's figure. The maker's figure stands; ours is an estimate to discuss with them.`}
      </p>
    </div>
  );
}
