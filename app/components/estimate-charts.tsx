// The estimate panel's two charts. Chart.js loads only in the browser, after the page is up (a lazy
// chunk, not the page's first JavaScript). A redraw costs far more than the tables beside it, so the
// charts redraw only once the figures have settled (the sweep and the scatter run are back) and only
// while they are in or near view; until then they keep their last drawing and say so. The tables
// beside them carry the same figures at every keystroke.
import { lazy, Suspense, useEffect, useRef, useState } from "react";
import type { EstimateView } from "~/lib/plan/estimate-view";
import type { UnitSystem } from "~/lib/units";
import { useHeldValue, useInView } from "./use-in-view";

const CylinderChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.CylinderChart })));
const SweepChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.SweepChart })));

const FRAME = "relative h-72 min-w-0 rounded border border-forge-100 bg-white p-2";

/** The frame's text while the chart's code loads (the frame keeps its size: nothing below moves). */
function Loading() {
  return <p className="p-2 text-sm text-forge-700">Loading the chart…</p>;
}

export function PlanCharts({ view, units, settled }: { view: EstimateView; units: UnitSystem; settled: boolean }) {
  const ref = useRef<HTMLDivElement>(null);
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  const seen = useInView(ref);
  const shown = useHeldValue(view, settled && seen);
  const behind = shown !== view;
  return (
    <div ref={ref} className="grid grid-cols-1 gap-4 xl:grid-cols-2 print:grid-cols-2" data-testid="charts" data-behind={behind}>
      {[CylinderChart, SweepChart].map((Chart, i) => (
        <figure key={i} className={FRAME}>
          {mounted ? (
            <Suspense fallback={<Loading />}>
              <Chart view={shown} units={units} />
            </Suspense>
          ) : (
            <Loading />
          )}
          {behind ? (
            // over the chart's corner, not above it: showing and hiding it moves nothing
            <span className="print-hide absolute top-1 right-1 rounded border border-forge-500 bg-white px-1.5 text-xs text-forge-900">
              ↻ redraws when the figures settle
            </span>
          ) : null}
        </figure>
      ))}
    </div>
  );
}
