// The estimate panel's long sections: every check, the per-cylinder table, the torque sweep as a table
// and the notes. Each is memoised on the figures it shows (plain data compared field by field), so a
// keystroke or the server's answer re-renders only what changed.
import { memo } from "react";
import { rankChecks } from "~/lib/clamp/check-order";
import type { LimitCheck } from "~/lib/clamp/limits";
import type { CylinderEstimate } from "~/lib/clamp/evaluate";
import type { SweepRow } from "~/lib/plan/estimate-view";
import { marginStatus } from "~/lib/plan/margin";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { sameList, sameRows } from "./same-figures";
import { STATUS_LOOK } from "./status-look";

const pct = (x: number) => `${(x * 100).toFixed(0)} %`;

const CHECK_FIELDS = [
  "id",
  "label",
  "ratio",
  "thinBelow",
  "status",
  "detail",
  "cylinder",
  "checked",
] as const satisfies readonly (keyof LimitCheck)[];

export const ChecksTable = memo(
  function ChecksTable({ checks }: { checks: LimitCheck[] }) {
    return (
      // a table wider than a phone scrolls in its own box, which the keyboard can reach to scroll
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Every check, worst first">
        <table className="w-full border-collapse bg-white text-left text-sm" data-testid="checks">
          <caption className="mb-1 text-left font-bold">Every check, worst first</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-1">
                Result
              </th>
              <th scope="col" className="px-2 py-1">
                Check
              </th>
              <th scope="col" className="px-2 py-1">
                Figure
              </th>
            </tr>
          </thead>
          <tbody>
            {rankChecks(checks).map((c) => {
              const l = STATUS_LOOK[c.status];
              return (
                <tr key={c.id} className="border-t border-forge-100">
                  <td className="px-2 py-1 whitespace-nowrap">{c.checked ? `${l.icon} ${l.word}` : "— not checked"}</td>
                  <td className="px-2 py-1">{c.label}</td>
                  <td className="px-2 py-1 tabular">{c.detail}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    );
  },
  (a, b) => sameRows(a.checks, b.checks, CHECK_FIELDS),
);

/** The per-cylinder figures the table shows (and so the ones its memo compares). */
export const CYLINDER_FIELDS = [
  "cylinder",
  "clampN",
  "heatAndSettlingN",
  "clampReliefN",
  "remainingSealLineHotSettledN",
  "bodyFiredN",
  "requiredOperatingN",
  "requiredSeatingN",
  "sealMargin",
  "sealMarginNominal",
] as const satisfies readonly (keyof CylinderEstimate)[];

type CylinderRow = Pick<CylinderEstimate, (typeof CYLINDER_FIELDS)[number]>;

interface CylinderTableProps {
  cylinders: CylinderRow[];
  weakestCylinder: number;
  targetMargin: number;
  units: UnitSystem;
}

export const CylinderTable = memo(
  function CylinderTable({ cylinders, weakestCylinder, targetMargin, units }: CylinderTableProps) {
    const force = (n: number) => formatQuantity(n, "force", units);
    const totals = cylinders.reduce(
      (t, c) => ({
        clamp: t.clamp + c.clampN,
        heat: t.heat + c.heatAndSettlingN,
        firing: t.firing + c.clampReliefN,
        line: t.line + c.remainingSealLineHotSettledN,
        body: t.body + c.bodyFiredN,
      }),
      { clamp: 0, heat: 0, firing: 0, line: 0, body: 0 },
    );
    return (
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Per cylinder">
        <table className="w-full border-collapse bg-white text-right text-sm tabular" data-testid="cylinders">
          <caption className="mb-1 text-left font-bold">
            Per cylinder, nominal preload: clamp + heat and settling − firing = left on the gasket (seal line + body)
          </caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Cyl
              </th>
              <th scope="col" className="px-2 py-1">
                Clamp
              </th>
              <th scope="col" className="px-2 py-1">
                Heat and settling
              </th>
              <th scope="col" className="px-2 py-1">
                Firing takes
              </th>
              <th scope="col" className="px-2 py-1">
                Left on the seal line
              </th>
              <th scope="col" className="px-2 py-1">
                Left on the body
              </th>
              <th scope="col" className="px-2 py-1">
                Seal line needs
              </th>
              <th scope="col" className="px-2 py-1">
                Margin, bottom of band
              </th>
              <th scope="col" className="px-2 py-1">
                Margin, nominal
              </th>
            </tr>
          </thead>
          <tbody>
            {cylinders.map((c) => {
              const s = STATUS_LOOK[marginStatus(c.sealMargin, targetMargin)];
              return (
                <tr key={c.cylinder} className={`border-t border-forge-100 ${c.cylinder === weakestCylinder ? "font-bold" : ""}`}>
                  <th scope="row" className="px-2 py-1 text-left">
                    {c.cylinder}
                    {c.cylinder === weakestCylinder ? " (weakest)" : ""}
                  </th>
                  <td className="px-2 py-1">{force(c.clampN)}</td>
                  <td className="px-2 py-1">
                    {c.heatAndSettlingN >= 0 ? "+" : "−"}
                    {force(Math.abs(c.heatAndSettlingN))}
                  </td>
                  <td className="px-2 py-1">−{force(c.clampReliefN)}</td>
                  <td className="px-2 py-1">{force(c.remainingSealLineHotSettledN)}</td>
                  <td className="px-2 py-1">{force(c.bodyFiredN)}</td>
                  <td className="px-2 py-1">{force(Math.max(c.requiredOperatingN, c.requiredSeatingN))}</td>
                  <td className="px-2 py-1">
                    {s.icon} {c.sealMargin.toFixed(2)}
                  </td>
                  <td className="px-2 py-1">{c.sealMarginNominal.toFixed(2)}</td>
                </tr>
              );
            })}
            <tr className="border-t-2 border-forge-300 font-bold">
              <th scope="row" className="px-2 py-1 text-left">
                All
              </th>
              <td className="px-2 py-1">{force(totals.clamp)}</td>
              <td className="px-2 py-1">
                {totals.heat >= 0 ? "+" : "−"}
                {force(Math.abs(totals.heat))}
              </td>
              <td className="px-2 py-1">−{force(totals.firing)}</td>
              <td className="px-2 py-1">{force(totals.line)}</td>
              <td className="px-2 py-1">{force(totals.body)}</td>
              <td className="px-2 py-1" colSpan={3} />
            </tr>
          </tbody>
        </table>
      </div>
    );
  },
  (a, b) =>
    a.units === b.units &&
    a.weakestCylinder === b.weakestCylinder &&
    a.targetMargin === b.targetMargin &&
    sameRows(a.cylinders, b.cylinders, CYLINDER_FIELDS),
);

const SWEEP_FIELDS = [
  "torqueNm",
  "weakestMargin",
  "weakestMarginNominal",
  "gainShare",
  "studWorkingUtilization",
  "bearingUtilizationMax",
  "mostlySqueezing",
] as const satisfies readonly (keyof SweepRow)[];

export const SweepTable = memo(
  function SweepTable({ sweep, ceilingTorqueNm, units }: { sweep: SweepRow[]; ceilingTorqueNm: number; units: UnitSystem }) {
    const torque = (nm: number) => formatQuantity(nm, "torque", units);
    return (
      <details className="text-sm" data-testid="sweep-table">
        <summary className="cursor-pointer font-medium">The torque sweep as a table</summary>
        <div className="mt-1 overflow-x-auto" tabIndex={0} role="region" aria-label="The torque sweep">
          <table className="w-full border-collapse bg-white text-right tabular">
            <caption className="sr-only">
              Over torque: weakest seal margin, seal gained per +10 % torque, the stud's use of its yield and the washer on the head
            </caption>
            <thead className="bg-forge-100">
              <tr>
                <th scope="col" className="px-2 py-1">
                  Torque
                </th>
                <th scope="col" className="px-2 py-1">
                  Weakest margin, bottom of band
                </th>
                <th scope="col" className="px-2 py-1">
                  At nominal
                </th>
                <th scope="col" className="px-2 py-1">
                  Seal gained per +10 %
                </th>
                <th scope="col" className="px-2 py-1">
                  Stud hot and fired (of yield)
                </th>
                <th scope="col" className="px-2 py-1">
                  Washer (of limit)
                </th>
              </tr>
            </thead>
            <tbody>
              {sweep
                .filter((_, i) => i % 4 === 0 || i === sweep.length - 1)
                .map((pt) => (
                  <tr key={pt.torqueNm} className="border-t border-forge-100">
                    <th scope="row" className="px-2 py-1">
                      {torque(pt.torqueNm)}
                      {pt.torqueNm > ceilingTorqueNm ? " ⚠ past the ceiling" : ""}
                    </th>
                    <td className="px-2 py-1">{pt.weakestMargin.toFixed(2)}</td>
                    <td className="px-2 py-1">{pt.weakestMarginNominal.toFixed(2)}</td>
                    <td className="px-2 py-1">
                      {pct(pt.gainShare)}
                      {pt.mostlySqueezing ? " (squeezes the head)" : ""}
                    </td>
                    <td className="px-2 py-1">{pct(pt.studWorkingUtilization)}</td>
                    <td className="px-2 py-1">{pct(pt.bearingUtilizationMax)}</td>
                  </tr>
                ))}
            </tbody>
          </table>
        </div>
      </details>
    );
  },
  (a, b) => a.units === b.units && a.ceilingTorqueNm === b.ceilingTorqueNm && sameRows(a.sweep, b.sweep, SWEEP_FIELDS),
);

export const EstimateNotes = memo(
  function EstimateNotes({ warnings, assumptions }: { warnings: string[]; assumptions: string[] }) {
    return (
      <>
        {warnings.length > 0 ? (
          <ul className="space-y-1 text-sm" aria-label="Warnings">
            {warnings.map((w) => (
              <li key={w} className="rounded border border-caution bg-caution-50 px-3 py-1">
                ⚠ {w}
              </li>
            ))}
          </ul>
        ) : null}
        {assumptions.length > 0 ? (
          <details className="text-sm">
            <summary className="cursor-pointer font-medium">What this estimate assumed ({assumptions.length})</summary>
            <ul className="mt-1 list-disc space-y-1 pl-5" aria-label="Assumptions">
              {assumptions.map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </details>
        ) : null}
      </>
    );
  },
  (a, b) => sameList(a.warnings, b.warnings) && sameList(a.assumptions, b.assumptions),
);
