import { lazy, Suspense, useEffect, useState } from "react";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { formatQuantity, type UnitSystem } from "~/lib/units";

// Chart.js loads only in the browser and only on pages that chart.
const CylinderChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.CylinderChart })));
const SweepChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.SweepChart })));

export type MarginStatus = { word: string; icon: string; tone: string };

export function marginStatus(margin: number, target: number): MarginStatus {
  if (margin >= target) return { word: "Holds", icon: "✔", tone: "text-held bg-held-50 border-held" };
  if (margin >= 1) return { word: "Thin", icon: "⚠", tone: "text-caution bg-caution-50 border-caution" };
  return { word: "Short", icon: "✖", tone: "text-failed bg-failed-50 border-failed" };
}

const pct = (x: number) => `${(x * 100).toFixed(0)} %`;
/** A probability as the compare page shows it too. */
export const chance = (x: number) => `${(x * 100).toFixed(1)} %`;

export function EstimatePanel({ view, units, targetMargin, busy = false }: { view: EstimateView; units: UnitSystem; targetMargin: number; busy?: boolean }) {
  const e = view.estimate;
  const weakest = e.cylinders[e.weakestCylinder - 1] ?? e.cylinders[0]!;
  const status = marginStatus(e.weakestMargin, targetMargin);
  const stress = e.studStress;
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return (
    <section aria-labelledby="estimate-title" aria-busy={busy} className={`space-y-4 ${busy ? "opacity-70" : ""}`}>
      <h2 id="estimate-title" className="text-xl font-bold">
        Estimate
      </h2>
      <div className={`rounded border-2 px-4 py-3 ${status.tone}`} data-testid="weakest">
        <p className="text-sm font-medium">Weakest cylinder</p>
        <p className="text-3xl font-bold tabular">
          {status.icon} Cylinder {e.weakestCylinder}: margin {e.weakestMargin.toFixed(2)} — {status.word}
        </p>
        <p className="text-sm">
          Target margin {targetMargin.toFixed(2)}. With friction sampled, the chance the weakest margin falls below 1 is{" "}
          {chance(view.probabilityMarginBelowOne)}; the weakest margin lies between {view.weakestMarginBand.p5.toFixed(2)} and{" "}
          {view.weakestMarginBand.p95.toFixed(2)} (5th to 95th percentile).
        </p>
      </div>

      <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-3">
        <Figure
          label="Preload per stud (min / nominal / max)"
          value={`${formatQuantity(e.tightening.preload.minN, "force", units)} / ${formatQuantity(e.tightening.preload.nominalN, "force", units)} / ${formatQuantity(e.tightening.preload.maxN, "force", units)}`}
          testId="preload"
        />
        <Figure
          label="Stud equivalent stress at max preload"
          value={`${pct(stress.atMax.utilization)} of yield`}
          note={`checked against ${formatQuantity(stress.limitMpa, "stress", units)}, 90 % of yield (VDI 2230)`}
        />
        <Figure
          label="Head bearing pressure (max)"
          value={formatQuantity(e.head.bearingPressureMaxMpa, "stress", units)}
          note={`${pct(e.head.bearingUtilizationMax)} of the head's ${formatQuantity(e.head.limitMpa, "stress", units)}`}
        />
        <Figure
          label="Hot and settled preload per stud"
          value={formatQuantity(e.hotSettled.preloadN, "force", units)}
          note={`heat ${formatQuantity(e.hotSettled.thermalChangeN, "force", units)}, embedding −${formatQuantity(e.hotSettled.embeddingLossN, "force", units)}, relaxation −${formatQuantity(e.hotSettled.relaxationLossN, "force", units)}`}
        />
        <Figure
          label="Added clamp still on the seal line under firing"
          value={pct(view.firedShare)}
          note={`as assembled ${pct(e.squeeze.marginalShareWeakest)} · joint constant C = ${e.stiffness.jointConstant.toFixed(3)}`}
        />
        <Figure
          label={`Peak cylinder pressure${e.firing.estimated ? " (estimate)" : ""}`}
          value={formatQuantity(e.firing.peakPressureMpa, "pressure", units)}
          note={e.firing.note}
        />
      </dl>

      <div
        className={`rounded border px-4 py-3 text-sm ${e.squeeze.mostlySqueezing ? "border-failed bg-failed-50" : "border-forge-300 bg-white"}`}
        data-testid="squeeze"
      >
        <p className="font-bold">
          {e.squeeze.mostlySqueezing ? "✖ At this torque, more torque mostly squeezes the head." : "Squeeze point"}
          {" · "}
          {formatQuantity(view.squeezePoint.torqueNm, "torque", units)}
        </p>
        <p>{view.squeezePoint.explanation}</p>
      </div>

      <div className="overflow-x-auto">
        <table className="w-full border-collapse bg-white text-right text-sm tabular">
          <caption className="mb-1 text-left font-bold">Per cylinder (cold clamp; firing and hot, settled seal-line load)</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Cyl
              </th>
              <th scope="col" className="px-2 py-1">
                Clamp
              </th>
              <th scope="col" className="px-2 py-1">
                Seal line
              </th>
              <th scope="col" className="px-2 py-1">
                Firing takes
              </th>
              <th scope="col" className="px-2 py-1">
                Left, hot
              </th>
              <th scope="col" className="px-2 py-1">
                Needed
              </th>
              <th scope="col" className="px-2 py-1">
                Margin
              </th>
            </tr>
          </thead>
          <tbody>
            {e.cylinders.map((c) => {
              const s = marginStatus(c.sealMargin, targetMargin);
              return (
                <tr key={c.cylinder} className={`border-t border-forge-100 ${c.cylinder === e.weakestCylinder ? "font-bold" : ""}`}>
                  <th scope="row" className="px-2 py-1 text-left">
                    {c.cylinder}
                    {c.cylinder === e.weakestCylinder ? " (weakest)" : ""}
                  </th>
                  <td className="px-2 py-1">{formatQuantity(c.clampN, "force", units)}</td>
                  <td className="px-2 py-1">{formatQuantity(c.sealLineN, "force", units)}</td>
                  <td className="px-2 py-1">{formatQuantity(c.clampReliefN, "force", units)}</td>
                  <td className="px-2 py-1">{formatQuantity(c.remainingSealLineHotSettledN, "force", units)}</td>
                  <td className="px-2 py-1">{formatQuantity(Math.max(c.requiredOperatingN, c.requiredSeatingN), "force", units)}</td>
                  <td className="px-2 py-1">
                    {s.icon} {c.sealMargin.toFixed(2)}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-forge-700">
        Needed: the larger of the ASME BPVC VIII-1 Appendix 2 seating (y) and operating (m) loads for the seal band — flange design values used here as a
        conservative published criterion, not head-gasket data. Weakest cylinder {weakest.cylinder} serves {weakest.effectiveStuds.toFixed(2)} studs' worth of
        clamp.
      </p>

      {mounted ? (
        <Suspense fallback={<p className="text-sm">Loading charts…</p>}>
          <div className="grid gap-4 lg:grid-cols-2">
            <figure className="h-64 rounded border border-forge-100 bg-white p-2">
              <CylinderChart view={view} units={units} />
            </figure>
            <figure className="h-64 rounded border border-forge-100 bg-white p-2">
              <SweepChart view={view} units={units} />
            </figure>
          </div>
        </Suspense>
      ) : null}

      {e.warnings.length > 0 ? (
        <ul className="space-y-1 text-sm" aria-label="Warnings">
          {e.warnings.map((w) => (
            <li key={w} className="rounded border border-caution bg-caution-50 px-3 py-1">
              ⚠ {w}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}

function Figure({ label, value, note, testId }: { label: string; value: string; note?: string; testId?: string }) {
  return (
    <div className="rounded border border-forge-100 bg-white p-3">
      <dt className="text-forge-700">{label}</dt>
      <dd className="mt-1 text-lg font-bold tabular" data-testid={testId}>
        {value}
      </dd>
      {note ? <dd className="text-xs text-forge-700">{note}</dd> : null}
    </div>
  );
}
