// The evidence page's scatter chart and the same runs as a table. Chart.js is loaded only when the
// chart's frame is about to be seen (it is a third of the page's JavaScript otherwise); the frame has
// its size and its text alternative from the first paint, so nothing moves when the chart arrives,
// and the table states every plotted figure without it.
import { lazy, Suspense, useRef } from "react";
import type { EvidencePoint } from "~/lib/records/evidence";
import { OUTCOME_LABEL } from "~/lib/records/run";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { useInView } from "./use-in-view";

const EvidenceChart = lazy(() => import("./evidence-chart").then((m) => ({ default: m.EvidenceChart })));

export const EVIDENCE_CHART_LABEL =
  "Chart: each run's predicted seal margin at its logged peak pressure, held or failed. The tables below have the same runs.";

export function EvidencePlot({ points, failureLine }: { points: EvidencePoint[]; failureLine: number | null }) {
  const ref = useRef<HTMLDivElement>(null);
  const near = useInView(ref, { once: true, margin: "400px" });
  const waiting = <p className="p-2 text-sm text-forge-700">Loading the chart…</p>;
  return (
    <div ref={ref} role="img" aria-label={EVIDENCE_CHART_LABEL} className="mb-2 h-80 rounded border border-forge-100 bg-white p-2">
      {near ? (
        <Suspense fallback={waiting}>
          <EvidenceChart points={points} failureLine={failureLine} />
        </Suspense>
      ) : (
        waiting
      )}
    </div>
  );
}

/** Every plotted run, as the chart places it (closed until asked for). */
export function EvidenceRunsTable({ points, units }: { points: EvidencePoint[]; units: UnitSystem }) {
  return (
    <details className="mb-6 text-sm" data-testid="evidence-runs">
      <summary className="cursor-pointer font-medium">The plotted runs as a table ({points.length})</summary>
      <div className="mt-1 overflow-x-auto" tabIndex={0} role="region" aria-label="The plotted runs (scrolls sideways)">
        <table className="w-full border-collapse bg-white tabular">
          <caption className="sr-only">Each plotted run: its predicted seal margin at its logged peak pressure, and how it ended</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Engine
              </th>
              <th scope="col" className="px-2 py-1 text-left">
                Ran on
              </th>
              <th scope="col" className="px-2 py-1 text-left">
                Outcome
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Predicted margin
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Peak pressure
              </th>
            </tr>
          </thead>
          <tbody>
            {points.map((p) => (
              <tr key={p.runId} className="border-t border-forge-100">
                <th scope="row" className="px-2 py-1 text-left font-normal">
                  {p.engineName}
                </th>
                <td className="px-2 py-1">{p.ranOn}</td>
                <td className="px-2 py-1">{OUTCOME_LABEL[p.outcome]}</td>
                <td className="px-2 py-1 text-right">{p.margin.toFixed(2)}</td>
                <td className="px-2 py-1 text-right">
                  {formatQuantity(p.peakMpa, "pressure", units)}
                  {p.peakSource === "estimated" ? " (estimated)" : ""}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
