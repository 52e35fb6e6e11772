import { Form, Link } from "react-router";
import type { Route } from "./+types/evidence";
import { PageTitle } from "~/components/app-shell";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { EvidencePlot, EvidenceRunsTable } from "~/components/evidence-plot";
import { Button, SelectField } from "~/components/form";
import { GASKET_TYPE_LABELS } from "~/lib/library/labels";
import { combinations, filterPoints, summarize } from "~/lib/records/evidence";
import { OUTCOME_LABEL } from "~/lib/records/run";
import { formatQuantity } from "~/lib/units";
import { evidencePoints } from "~/models/evidence.server";
import { requireRole } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Evidence · Sealwright" }];
export const handle = CAUTION_HANDLE;

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team } = await requireRole(request, "builder");
  const { points: all, unplotted } = await evidencePoints(team.id);
  const p = new URL(request.url).searchParams;
  const filter = {
    gasketType: p.get("gasketType") || undefined,
    fastenerName: p.get("fastener") || undefined,
    fuel: p.get("fuel") || undefined,
  };
  const points = filterPoints(all, filter);
  const uniq = (xs: string[]) => [...new Set(xs.filter(Boolean))].sort();
  return {
    units: user.units,
    points,
    total: all.length,
    unplotted,
    filter: { gasketType: filter.gasketType ?? "", fastener: filter.fastenerName ?? "", fuel: filter.fuel ?? "" },
    choices: {
      gasketTypes: uniq(all.map((x) => x.gasketType)),
      fasteners: uniq(all.map((x) => x.fastenerName)),
      fuels: uniq(all.map((x) => x.fuel)),
    },
    rows: combinations(points),
    summary: summarize(points),
  };
}

const opts = (xs: string[], label: (x: string) => string = (x) => x): [string, string][] => [
  ["", "Any"],
  ...xs.map((x) => [x, label(x)] as [string, string]),
];
const gasketLabel = (t: string) => GASKET_TYPE_LABELS[t as keyof typeof GASKET_TYPE_LABELS] ?? t;

export default function EvidencePage({ loaderData: d }: Route.ComponentProps) {
  const s = d.summary;
  return (
    <>
      <PageTitle sub="What the shop's runs say about the model's margins">Evidence</PageTitle>
      <Caution className="mb-4" />
      <Form method="get" className="no-print mb-4 flex flex-wrap items-end gap-3 rounded border border-forge-100 bg-white p-3">
        <SelectField
          label="Gasket type"
          name="gasketType"
          defaultValue={d.filter.gasketType}
          options={opts(d.choices.gasketTypes, gasketLabel)}
        />
        <SelectField label="Fastener" name="fastener" defaultValue={d.filter.fastener} options={opts(d.choices.fasteners)} />
        <SelectField label="Fuel" name="fuel" defaultValue={d.filter.fuel} options={opts(d.choices.fuels)} />
        <Button type="submit" kind="plain">
          Filter
        </Button>
      </Form>
      <p role="status" className="mb-2 rounded border border-forge-300 bg-white p-3">
        <strong>
          {s.points} run{s.points === 1 ? "" : "s"} plotted
        </strong>{" "}
        (of {d.total} with a plan and a pressure{d.unplotted ? `; ${d.unplotted} more without one are not plotted` : ""}). {s.honesty}{" "}
        {s.failedAtOrBelowMargin !== null
          ? `The shop's history shows seal failures at predicted margins up to ${s.failedAtOrBelowMargin.toFixed(2)}; ${s.failuresBelowOne} of ${s.sealFailures} sat below margin 1, ${s.failuresAboveOne} above it.`
          : "No seal failure logged in this selection, so the history shows no failure margin yet."}
        {s.heldBelowOne ? ` ${s.heldBelowOne} run${s.heldBelowOne === 1 ? "" : "s"} held although the model put them below margin 1.` : ""}
      </p>
      <p className="mb-4 text-xs text-forge-700">
        Each margin is the clamp model's seal margin for the plan on the engine that day (its latest assembly, else the chosen plan), worked
        out at the run's own peak pressure: the bottom of the preload band, hot and fired — the same basis as a plan's verdict.
      </p>
      {s.points > 0 ? (
        <>
          <EvidencePlot points={d.points} failureLine={s.failedAtOrBelowMargin} />
          <EvidenceRunsTable points={d.points} units={d.units} />
        </>
      ) : null}
      <h2 className="mb-2 text-xl font-bold">By gasket type and fastener</h2>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="held and failed, by gasket and fastener (scrolls sideways)">
        <table className="w-full border-collapse bg-white text-sm tabular">
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-2 text-left">
                Gasket type
              </th>
              <th scope="col" className="px-2 py-2 text-left">
                Fastener
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Runs
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Held
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Held up to
              </th>
              <th scope="col" className="px-2 py-2 text-left">
                Where it failed
              </th>
            </tr>
          </thead>
          <tbody>
            {d.rows.map((r) => (
              <tr key={`${r.gasketType}-${r.fastenerName}`} className="border-t border-forge-100 align-top">
                <td className="px-2 py-2">{gasketLabel(r.gasketType)}</td>
                <td className="px-2 py-2">{r.fastenerName}</td>
                <td className="px-2 py-2 text-right">{r.runs}</td>
                <td className="px-2 py-2 text-right">{r.held}</td>
                <td className="px-2 py-2 text-right">{formatQuantity(r.heldUpToMpa, "pressure", d.units)}</td>
                <td className="px-2 py-2">
                  {r.failures.length
                    ? r.failures.map((f, i) => (
                        <span key={i} className="block text-failed">
                          ✖ {OUTCOME_LABEL[f.outcome]} at {formatQuantity(f.peakMpa, "pressure", d.units)} (margin {f.margin.toFixed(2)}),{" "}
                          {f.engineName}, {f.ranOn}
                        </span>
                      ))
                    : "none"}
                </td>
              </tr>
            ))}
            {d.rows.length === 0 ? (
              <tr>
                <td colSpan={6} className="px-2 py-4 text-forge-700">
                  No runs yet. Log runs on an engine's{" "}
                  <Link to="/engines" className="underline">
                    Runs tab
                  </Link>
                  .
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </>
  );
}
