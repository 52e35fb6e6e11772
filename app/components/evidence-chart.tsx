import { Chart as ChartJS, Legend, LinearScale, LineElement, PointElement, ScatterController, Tooltip } from "chart.js";
import { Scatter } from "react-chartjs-2";
import type { EvidencePoint } from "~/lib/records/evidence";
import { OUTCOME_LABEL, isSealFailure } from "~/lib/records/run";

ChartJS.register(ScatterController, PointElement, LineElement, LinearScale, Tooltip, Legend);

const HELD = "#1b6e48";
const FAILED = "#a32119";
const OTHER = "#8a6d1f";
const FORGE = "#2b4456";

/** Predicted seal margin at the logged pressure (x) against the peak pressure (y), coloured and shaped by outcome. */
export function EvidenceChart({ points, failureLine }: { points: EvidencePoint[]; failureLine: number | null }) {
  const top = Math.max(10, ...points.map((p) => p.peakMpa)) * 1.1;
  const xy = (ps: EvidencePoint[]) =>
    ps.map((p) => ({ x: p.margin, y: p.peakMpa, label: `${p.engineName}, ${p.ranOn}: ${OUTCOME_LABEL[p.outcome]}` }));
  const held = points.filter((p) => p.outcome === "held");
  const seal = points.filter((p) => isSealFailure(p.outcome));
  const other = points.filter((p) => p.outcome !== "held" && !isSealFailure(p.outcome));
  return (
    // its text alternative is on the frame around it (evidence-plot.tsx), there before the chart loads
    <Scatter
      aria-hidden
      data={{
        datasets: [
          { label: "Held", data: xy(held), backgroundColor: HELD, pointStyle: "circle", pointRadius: 6 },
          {
            label: "Seal failed",
            data: xy(seal),
            backgroundColor: FAILED,
            pointStyle: "crossRot",
            pointRadius: 9,
            borderColor: FAILED,
            borderWidth: 3,
          },
          { label: "Other failure", data: xy(other), backgroundColor: OTHER, pointStyle: "triangle", pointRadius: 7 },
          {
            label: "Margin 1",
            data: [
              { x: 1, y: 0, label: "margin 1" },
              { x: 1, y: top, label: "margin 1" },
            ],
            showLine: true,
            borderColor: FORGE,
            borderDash: [6, 4],
            pointRadius: 0,
          },
          ...(failureLine !== null
            ? [
                {
                  label: `Highest margin that failed (${failureLine.toFixed(2)})`,
                  data: [
                    { x: failureLine, y: 0, label: "failure line" },
                    { x: failureLine, y: top, label: "failure line" },
                  ],
                  showLine: true,
                  borderColor: FAILED,
                  borderDash: [2, 3],
                  pointRadius: 0,
                },
              ]
            : []),
        ],
      }}
      options={{
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        plugins: {
          legend: { position: "bottom" },
          tooltip: {
            callbacks: {
              label: (c) =>
                `${(c.raw as { label?: string }).label ?? ""} (margin ${(c.parsed.x ?? 0).toFixed(2)}, ${(c.parsed.y ?? 0).toFixed(1)} MPa)`,
            },
          },
        },
        scales: {
          x: { title: { display: true, text: "Predicted seal margin at the logged pressure (bottom of the band, hot and fired)" }, min: 0 },
          y: { title: { display: true, text: "Peak cylinder pressure (MPa)" }, min: 0, max: top },
        },
      }}
    />
  );
}
