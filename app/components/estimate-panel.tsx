import { lazy, Suspense, useEffect, useRef, useState } from "react";
// the words and the order from their own modules: this panel needs no model code in the browser
import { CEILING_WORDS } from "~/lib/clamp/ceiling-words";
import { rankChecks } from "~/lib/clamp/check-order";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { chance, marginStatus } from "~/lib/plan/margin";
import { formatQuantity, type UnitSystem } from "~/lib/units";

// Chart.js loads only in the browser and only on pages that chart.
const CylinderChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.CylinderChart })));
const SweepChart = lazy(() => import("./plan-charts").then((m) => ({ default: m.SweepChart })));

import { STATUS_LOOK, type StatusLook } from "./status-look";

export { STATUS_LOOK, type StatusLook };

const pct = (x: number) => `${(x * 100).toFixed(0)} %`;

/** The verdict in one line, for the phone's sticky bar and the plan list. */
export function VerdictLine({ view }: { view: EstimateView }) {
  const v = view.estimate.verdict;
  const look = STATUS_LOOK[v.status];
  return (
    <span className="font-bold">
      {look.icon} {look.word}: {v.headline}
    </span>
  );
}

export function EstimatePanel({
  view,
  units,
  busy = false,
}: {
  view: EstimateView;
  units: UnitSystem;
  targetMargin?: number;
  busy?: boolean;
}) {
  const e = view.estimate;
  const v = e.verdict;
  const look = STATUS_LOOK[v.status];
  const force = (n: number) => formatQuantity(n, "force", units);
  const torque = (nm: number) => formatQuantity(nm, "torque", units);
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  const announcement = useSettledAnnouncement(`${look.word}: ${v.headline}`, busy);
  const band = e.tightening.preload;
  const half = (band.maxN - band.minN) / 2 / band.nominalN;
  const totals = e.cylinders.reduce(
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
    <section aria-labelledby="estimate-title" aria-busy={busy} className="space-y-4">
      {/* progress without fading the figures: fading would drop the small text and the caution below contrast */}
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 id="estimate-title" tabIndex={-1} className="text-xl font-bold">
          Estimate
        </h2>
        {busy ? (
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

      {/* a table wider than a phone scrolls in its own box, which the keyboard can reach to scroll */}
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
            {rankChecks(v.checks).map((c) => {
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
            {e.cylinders.map((c) => {
              const s = STATUS_LOOK[marginStatus(c.sealMargin, view.targetMargin)];
              return (
                <tr key={c.cylinder} className={`border-t border-forge-100 ${c.cylinder === e.weakestCylinder ? "font-bold" : ""}`}>
                  <th scope="row" className="px-2 py-1 text-left">
                    {c.cylinder}
                    {c.cylinder === e.weakestCylinder ? " (weakest)" : ""}
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
      <p className="text-xs text-forge-700">
        Where firing would lift the gasket off, the columns after it do not add up: nothing is left to take. "Seal line needs" is the larger
        of the seating and the in-service load for the seal band
        {e.seal.requirement.basis === "asme-stand-in"
          ? " — from flange-code figures used as a conservative stand-in, not head-gasket data; the gasket maker's seating and service pressures replace them."
          : ", from the gasket maker's seating and service pressures."}
      </p>

      {mounted ? (
        <Suspense fallback={<p className="text-sm">Loading charts…</p>}>
          <div className="grid grid-cols-1 gap-4 xl:grid-cols-2 print:grid-cols-2">
            <figure className="h-72 min-w-0 rounded border border-forge-100 bg-white p-2">
              <CylinderChart view={view} units={units} />
            </figure>
            <figure className="h-72 min-w-0 rounded border border-forge-100 bg-white p-2">
              <SweepChart view={view} units={units} />
            </figure>
          </div>
        </Suspense>
      ) : null}

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
              {view.sweep
                .filter((_, i) => i % 4 === 0 || i === view.sweep.length - 1)
                .map((pt) => (
                  <tr key={pt.torqueNm} className="border-t border-forge-100">
                    <th scope="row" className="px-2 py-1">
                      {torque(pt.torqueNm)}
                      {pt.torqueNm > view.ceiling.torqueNm ? " ⚠ past the ceiling" : ""}
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

      {e.warnings.length > 0 ? (
        <ul className="space-y-1 text-sm" aria-label="Warnings">
          {e.warnings.map((w) => (
            <li key={w} className="rounded border border-caution bg-caution-50 px-3 py-1">
              ⚠ {w}
            </li>
          ))}
        </ul>
      ) : null}
      {e.assumptions.length > 0 ? (
        <details className="text-sm">
          <summary className="cursor-pointer font-medium">What this estimate assumed ({e.assumptions.length})</summary>
          <ul className="mt-1 list-disc space-y-1 pl-5" aria-label="Assumptions">
            {e.assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        </details>
      ) : null}
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
