import { useDeferredValue, useEffect, useRef, useState } from "react";
// the words and the order from their own modules: this panel needs no model code in the browser
import { CEILING_WORDS } from "~/lib/clamp/ceiling-words";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { chance } from "~/lib/plan/margin";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { PlanCharts } from "./estimate-charts";
import { ChecksTable, CylinderTable, EstimateNotes, SweepTable } from "./estimate-tables";
import { STATUS_LOOK, type StatusLook } from "./status-look";
import { VerdictLine } from "./verdict-line";

export { STATUS_LOOK, type StatusLook };
export { VerdictLine };

const pct = (x: number) => `${(x * 100).toFixed(0)} %`;

/**
 * The estimate for one plan. At a keystroke the verdict, the margins, the ceiling and the figures
 * follow at once; the long tables follow a moment later (a deferred render React can interrupt for the
 * next keystroke) and the charts once the figures settle. While any part shown is not yet for the
 * inputs shown, the panel says it is recalculating (and is aria-busy).
 */
export function EstimatePanel({
  view,
  units,
  busy = false,
}: {
  view: EstimateView;
  units: UnitSystem;
  targetMargin?: number;
  /** The sweep and the scatter run shown are not yet these inputs' (they are on their way). */
  busy?: boolean;
}) {
  const e = view.estimate;
  const v = e.verdict;
  const look = STATUS_LOOK[v.status];
  const force = (n: number) => formatQuantity(n, "force", units);
  const torque = (nm: number) => formatQuantity(nm, "torque", units);
  // the tables' view: this one, or for a moment the one before
  const later = useDeferredValue(view);
  const behind = busy || later !== view;
  const announcement = useSettledAnnouncement(`${look.word}: ${v.headline}`, behind);
  const band = e.tightening.preload;
  const half = (band.maxN - band.minN) / 2 / band.nominalN;
  const l = later.estimate;
  return (
    <section aria-labelledby="estimate-title" aria-busy={behind} className="space-y-4">
      {/* progress without fading the figures: fading would drop the small text and the caution below contrast */}
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 id="estimate-title" tabIndex={-1} className="text-xl font-bold">
          Estimate
        </h2>
        {behind ? (
          <span
            className="rounded border border-forge-500 bg-white px-2 py-0.5 text-sm font-medium text-forge-900"
            data-testid="recalculating"
          >
            ↻ Recalculating…
          </span>
        ) : null}
      </div>
      <p className="sr-only" aria-live="polite" aria-atomic="true" data-testid="verdict-announcement">
        {announcement}
      </p>
      <div className={`rounded border-2 px-4 py-3 ${look.tone}`} data-testid="weakest">
        <p className="text-sm font-medium">Verdict (the worst of every check below)</p>
        <p className="text-2xl font-bold" data-testid="verdict">
          {look.icon} {look.word}: {v.headline}
        </p>
        <p className="text-sm tabular" data-testid="weakest-margin">
          Weakest seal margin {e.weakestMargin.toFixed(2)} on cylinder {e.weakestCylinder} at the bottom of the scatter band, hot and fired
          (at the nominal preload: {e.weakestMarginNominal.toFixed(2)}). Target {view.targetMargin.toFixed(2)}.
        </p>
        <p className="text-sm">
          With each stud's preload sampled across the tightening band (±{pct(half)}; the samples span {pct(view.preloadSpread.p2_5 - 1)} to
          +{pct(view.preloadSpread.p97_5 - 1)}), the chance the weakest margin falls below 1 is {chance(view.probabilityMarginBelowOne)} and
          the chance a stud passes its limit is {chance(view.probabilityStudOverLimit)}.
        </p>
      </div>

      <ChecksTable checks={l.verdict.checks} />

      <div className="rounded border border-forge-300 bg-white px-4 py-3 text-sm" data-testid="ceiling">
        <p className="font-bold">
          Torque ceiling {torque(e.ceiling.torqueNm)} · set by the {CEILING_WORDS[e.ceiling.cause]}
        </p>
        <p>{e.ceiling.explanation}</p>
        <p className="mt-2" data-testid="gain">
          <span className="font-bold">Seal gained per +10 % torque:</span> {pct(e.gain.share)} of the clamp it adds stays on cylinder{" "}
          {e.gain.bore + 1}'s seal line under firing (+{force(e.gain.lineGainN)} of +{force(e.gain.clampGainN)}).
        </p>
        <p className={`mt-2 ${e.squeeze.mostlySqueezing ? "font-bold text-failed" : ""}`} data-testid="squeeze">
          {e.squeeze.mostlySqueezing
            ? `✖ More torque now mostly squeezes the head${e.squeeze.reason === "line-at-limit" ? ": the seal line is at its limit and takes almost none of the added clamp" : ": the head's own compression at the boss is past its limit"}.`
            : `More torque still reaches the seal${view.headSqueezeOnsetNm !== null ? `; past ${torque(view.headSqueezeOnsetNm)} it would mostly squeeze the head` : ""}.`}{" "}
          Head compression at the stud boss {formatQuantity(e.squeeze.headCompressionMm, "smallLength", units)} (
          {(e.squeeze.headStrain * 100).toFixed(2)} % strain; we take {(e.squeeze.strainLimit * 100).toFixed(1)} % as the limit, an
          assumption near the cast alloy's yield strain).
        </p>
      </div>

      <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-3">
        <Figure
          label="Preload per stud (min / nominal / max)"
          value={`${force(band.minN)} / ${force(band.nominalN)} / ${force(band.maxN)}`}
          testId="preload"
        />
        <Figure
          label="Stud while tightened, top of the band"
          value={`${pct(e.studStress.atMax.utilization)} of yield`}
          note={`limit ${formatQuantity(e.studStress.limitMpa, "stress", units)} (90 % of yield)`}
        />
        <Figure
          label="Stud hot and fired, top of the band"
          value={`${pct(e.studStress.working.utilization)} of yield`}
          note={`load ${force(e.studStress.working.studLoadN)} with heat and the fired share`}
        />
        <Figure
          label="Washer on the head, hot and fired (max)"
          value={formatQuantity(e.head.bearingPressureMaxMpa, "stress", units)}
          note={`${pct(e.head.bearingUtilizationMax)} of the head's ${formatQuantity(e.head.limitMpa, "stress", units)}`}
        />
        <Figure
          label="Hot and settled preload per stud"
          value={force(e.hotSettled.preloadN)}
          note={`heat ${force(e.hotSettled.thermalChangeN)}, embedding −${force(e.hotSettled.embeddingLossN)}, relaxation −${force(e.hotSettled.relaxationLossN)}`}
        />
        <Figure
          label="Firing load taken by the stud"
          value={pct(e.stiffness.loadFactor)}
          note={`the gasket and block lose the other ${pct(1 - e.stiffness.loadFactor)} of it (the load acts at the gasket)`}
        />
        <Figure
          label={`Peak cylinder pressure${e.firing.estimated ? " (estimate)" : ""}`}
          value={formatQuantity(e.firing.peakPressureMpa, "pressure", units)}
          note={e.firing.note}
        />
      </dl>

      <CylinderTable cylinders={l.cylinders} weakestCylinder={l.weakestCylinder} targetMargin={later.targetMargin} units={units} />
      <p className="text-xs text-forge-700">
        Where firing would lift the gasket off, the columns after it do not add up: nothing is left to take. "Seal line needs" is the larger
        of the seating and the in-service load for the seal band
        {l.seal.requirement.basis === "asme-stand-in"
          ? " — from flange-code figures used as a conservative stand-in, not head-gasket data; the gasket maker's seating and service pressures replace them."
          : ", from the gasket maker's seating and service pressures."}
      </p>

      <PlanCharts view={later} units={units} settled={!behind} />

      <SweepTable sweep={later.sweep} ceilingTorqueNm={later.ceiling.torqueNm} units={units} />

      <EstimateNotes warnings={l.warnings} assumptions={l.assumptions} />
    </section>
  );
}

/**
 * The verdict to announce: said once the figures settle (not while an estimate is running) and only
 * when it differs from what the page opened with or last said, so a screen reader hears the verdict,
 * not every number.
 */
function useSettledAnnouncement(verdict: string, busy: boolean): string {
  const last = useRef(verdict);
  const [said, setSaid] = useState("");
  useEffect(() => {
    if (busy || verdict === last.current) return;
    last.current = verdict;
    setSaid(`Estimate updated. Verdict: ${verdict}`);
  }, [busy, verdict]);
  return said;
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
