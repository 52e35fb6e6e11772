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
import { Bar, Line } from "react-chartjs-2";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { toDisplay, unitFor, type UnitSystem } from "~/lib/units";

// Only the parts these two charts use.
ChartJS.register(BarController, BarElement, CategoryScale, LinearScale, LineController, LineElement, PointElement, Tooltip, Legend);

const COPPER = "#a4521f";
const FORGE = "#2b4456";
const FAILED = "#a32119";
const HELD = "#1b6e48";

/** Per-cylinder seal-line load left under firing (hot, settled) against what the seal needs. */
export function CylinderChart({ view, units }: { view: EstimateView; units: UnitSystem }) {
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
          { label: `Seal-line load under firing, hot and settled (${unit})`, data: cyl.map((c) => f(c.remainingSealLineHotSettledN)), backgroundColor: cyl.map((c) => (c.sealMargin < 1 ? FAILED : COPPER)) },
          { label: `Needed by the seal (${unit})`, data: cyl.map((c) => f(Math.max(c.requiredOperatingN, c.requiredSeatingN))), backgroundColor: FORGE },
        ],
      }}
      options={{ responsive: true, maintainAspectRatio: false, animation: false, scales: { y: { beginAtZero: true, title: { display: true, text: unit } } } }}
    />
  );
}

/** Weakest margin and marginal seal-line share over torque, with the squeeze point marked. */
export function SweepChart({ view, units }: { view: EstimateView; units: UnitSystem }) {
  const unit = unitFor("torque", units);
  const t = (nm: number) => toDisplay("torque", nm, unit);
  const top = Math.max(2, ...view.sweep.map((p) => p.weakestMargin)) * 1.05;
  const squeeze = view.squeezePoint;
  const inRange = squeeze && squeeze.torqueNm >= view.sweep[0]!.torqueNm && squeeze.torqueNm <= view.sweep[view.sweep.length - 1]!.torqueNm;
  return (
    <Line
      aria-label="Chart: weakest seal margin and the share of added clamp still on the seal line under firing (and as assembled), over torque, with the squeeze point and this plan's torque marked. The text beside it states the same."
      role="img"
      data={{
        datasets: [
          { label: "Weakest seal margin", data: view.sweep.map((p) => ({ x: t(p.torqueNm), y: p.weakestMargin })), borderColor: COPPER, backgroundColor: COPPER, pointRadius: 0, borderWidth: 3 },
          { label: "Added clamp still on the seal line under firing", data: view.sweep.map((p) => ({ x: t(p.torqueNm), y: p.firedShareWeakest })), borderColor: FORGE, backgroundColor: FORGE, pointRadius: 0, borderWidth: 2 },
          { label: "…as assembled", data: view.sweep.map((p) => ({ x: t(p.torqueNm), y: p.marginalShareWeakest })), borderColor: "#5b7386", backgroundColor: "#5b7386", pointRadius: 0, borderWidth: 1, borderDash: [6, 4] },
          { label: "This plan's torque", data: [{ x: t(view.torqueNm), y: 0 }, { x: t(view.torqueNm), y: top }], borderColor: HELD, backgroundColor: HELD, pointRadius: 0, borderWidth: 2 },
          ...(inRange
            ? [{ label: "Squeeze point", data: [{ x: t(squeeze.torqueNm), y: 0 }, { x: t(squeeze.torqueNm), y: top }], borderColor: FAILED, backgroundColor: FAILED, pointRadius: 0, borderWidth: 2, borderDash: [2, 3] }]
            : []),
        ],
      }}
      options={{
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        parsing: false,
        scales: {
          x: { type: "linear", title: { display: true, text: `Torque (${unit})` } },
          y: { min: 0, max: top, title: { display: true, text: "Margin / share" } },
        },
      }}
    />
  );
}
