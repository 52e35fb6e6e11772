import {
  BarController,
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  Tooltip,
} from "chart.js";
import { memo } from "react";
import { Bar, Line } from "react-chartjs-2";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { toDisplay, unitFor, type UnitSystem } from "~/lib/units";

// Only the parts these two charts use.
ChartJS.register(BarController, BarElement, CategoryScale, LinearScale, LineController, LineElement, PointElement, Tooltip, Legend);

const COPPER = "#a4521f";
const FORGE = "#2b4456";
const FAILED = "#a32119";
const HELD = "#1b6e48";

const OUTLINE = "#0e1820";

/** Diagonal white hatching over a colour: a "Short" bar differs from its neighbours by more than hue. */
function hatched(color: string): CanvasPattern | string {
  if (typeof document === "undefined") return color;
  const tile = document.createElement("canvas");
  tile.width = tile.height = 8;
  const ctx = tile.getContext("2d");
  if (!ctx) return color;
  ctx.fillStyle = color;
  ctx.fillRect(0, 0, 8, 8);
  ctx.strokeStyle = "#ffffff";
  ctx.lineWidth = 2;
  ctx.beginPath();
  ctx.moveTo(0, 8);
  ctx.lineTo(8, 0);
  ctx.moveTo(-2, 2);
  ctx.lineTo(2, -2);
  ctx.moveTo(6, 10);
  ctx.lineTo(10, 6);
  ctx.stroke();
  return ctx.createPattern(tile, "repeat") ?? color;
}

// Both charts are memoised on the view object: the panel hands them a held view while typing, and a
// chart re-rendered with new data objects is a full Chart.js update.

/** Per-cylinder seal-line load left under firing (hot, settled) against what the seal needs. */
export const CylinderChart = memo(function CylinderChart({ view, units }: { view: EstimateView; units: UnitSystem }) {
  const unit = unitFor("force", units);
  const f = (n: number) => toDisplay("force", n, unit);
  const cyl = view.estimate.cylinders;
  return (
    <Bar
      aria-label="Chart: seal-line load left under firing per cylinder, against the load the seal needs. The table beside it has the same figures."
      role="img"
      data={{
        labels: cyl.map((c) => `Cyl ${c.cylinder}`),
        datasets: [
          // every bar outlined in near-black (well over 3:1 on the white chart), a short one hatched too
          {
            label: `Seal line, hot and fired (${unit}; hatched: short)`,
            data: cyl.map((c) => f(c.remainingSealLineHotSettledN)),
            backgroundColor: cyl.map((c) => (c.sealMarginNominal < 1 ? hatched(FAILED) : COPPER)),
            borderColor: OUTLINE,
            borderWidth: 1.5,
          },
          {
            label: `Seal line needs (${unit})`,
            data: cyl.map((c) => f(Math.max(c.requiredOperatingN, c.requiredSeatingN))),
            backgroundColor: FORGE,
            borderColor: OUTLINE,
            borderWidth: 1.5,
          },
        ],
      }}
      options={{
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        plugins: { legend: { position: "bottom", labels: { boxWidth: 12, font: { size: 10 } } } },
        scales: { y: { beginAtZero: true, title: { display: true, text: unit } } },
      }}
    />
  );
});

/** A vertical marker at torque x on the margin axis. */
function marker(label: string, x: number, top: number, color: string, dash: number[] = []) {
  return {
    label,
    data: [
      { x, y: 0 },
      { x, y: top },
    ],
    borderColor: color,
    backgroundColor: color,
    pointRadius: 0,
    borderWidth: 2,
    borderDash: dash,
    yAxisID: "margin",
  };
}

/**
 * Over torque: the weakest seal margin (bottom of the band and nominal) and the target on the margin
 * axis; the seal gained per +10 % torque and the stud's use of its yield on a separate percent axis;
 * the plan's torque, the ceiling and the head-squeeze onset as labelled vertical markers.
 */
export const SweepChart = memo(function SweepChart({ view, units }: { view: EstimateView; units: UnitSystem }) {
  const unit = unitFor("torque", units);
  const t = (nm: number) => toDisplay("torque", nm, unit);
  const pts = view.sweep;
  const top = Math.max(2, view.targetMargin, ...pts.map((p) => p.weakestMarginNominal)) * 1.05;
  const first = pts[0]!.torqueNm;
  const last = pts[pts.length - 1]!.torqueNm;
  const inRange = (x: number | null) => x !== null && Number.isFinite(x) && x >= first && x <= last;
  const pctTop = Math.max(120, ...pts.map((p) => p.studWorkingUtilization * 100)) * 1.05;
  return (
    <Line
      aria-label={`Chart: over torque, the weakest seal margin at the bottom of the scatter band and at nominal preload against the target ${view.targetMargin.toFixed(2)} (left axis), and the seal gained per +10 % torque and the stud's share of its yield (right axis, percent), with this plan's torque, the torque ceiling and where more torque mostly squeezes the head marked. The figures beside it state the same.`}
      role="img"
      data={{
        datasets: [
          {
            label: "Weakest margin, bottom of band",
            data: pts.map((p) => ({ x: t(p.torqueNm), y: p.weakestMargin })),
            borderColor: COPPER,
            backgroundColor: COPPER,
            pointRadius: 0,
            borderWidth: 3,
            yAxisID: "margin",
          },
          {
            label: "…at nominal preload",
            data: pts.map((p) => ({ x: t(p.torqueNm), y: p.weakestMarginNominal })),
            borderColor: COPPER,
            backgroundColor: COPPER,
            pointRadius: 0,
            borderWidth: 1,
            borderDash: [6, 4],
            yAxisID: "margin",
          },
          {
            label: "Target margin",
            data: [
              { x: t(first), y: view.targetMargin },
              { x: t(last), y: view.targetMargin },
            ],
            borderColor: HELD,
            backgroundColor: HELD,
            pointRadius: 0,
            borderWidth: 1,
            borderDash: [2, 2],
            yAxisID: "margin",
          },
          {
            label: "Seal gained per +10 % torque (%)",
            data: pts.map((p) => ({ x: t(p.torqueNm), y: p.gainShare * 100 })),
            borderColor: FORGE,
            backgroundColor: FORGE,
            pointRadius: 0,
            borderWidth: 2,
            yAxisID: "percent",
          },
          {
            label: "Stud, hot and fired (% of yield)",
            data: pts.map((p) => ({ x: t(p.torqueNm), y: p.studWorkingUtilization * 100 })),
            borderColor: "#5b7386",
            backgroundColor: "#5b7386",
            pointRadius: 0,
            borderWidth: 1,
            yAxisID: "percent",
          },
          {
            label: "Stud yield (100 %)",
            data: [
              { x: t(first), y: 100 },
              { x: t(last), y: 100 },
            ],
            borderColor: FAILED,
            backgroundColor: FAILED,
            pointRadius: 0,
            borderWidth: 1,
            borderDash: [4, 4],
            yAxisID: "percent",
          },
          marker("This plan's torque", t(view.torqueNm), top, HELD),
          ...(inRange(view.ceiling.torqueNm) ? [marker("Torque ceiling", t(view.ceiling.torqueNm), top, FAILED, [2, 3])] : []),
          ...(inRange(view.headSqueezeOnsetNm)
            ? [marker("Mostly squeezes the head from here", t(view.headSqueezeOnsetNm!), top, "#7a4a94", [8, 3])]
            : []),
        ],
      }}
      options={{
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        parsing: false,
        interaction: { mode: "nearest", intersect: false },
        plugins: { legend: { position: "bottom", labels: { boxWidth: 12, font: { size: 10 } } } },
        scales: {
          x: { type: "linear", title: { display: true, text: `Torque (${unit})` } },
          margin: { type: "linear", position: "left", min: 0, max: top, title: { display: true, text: "Seal margin" } },
          percent: {
            type: "linear",
            position: "right",
            min: 0,
            max: pctTop,
            grid: { drawOnChartArea: false },
            title: { display: true, text: "Percent" },
          },
        },
      }}
    />
  );
});
