import { Form, Link } from "react-router";
import type { Route } from "./+types/list";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { STATUS_LOOK } from "~/components/status-look";
import { CEILING_WORDS } from "~/lib/clamp";
import { formatQuantity } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { evaluateStoredPlan } from "~/models/plan-estimate.server";
import { listPlans } from "~/models/plan.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Seal plans · Sealwright" }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const plans = await listPlans(team.id, engine.id);
  const rows = await Promise.all(
    plans.map(async (plan) => {
      const r = await evaluateStoredPlan(team.id, engine, plan, user.units);
      return {
        id: plan.id,
        name: plan.name,
        torqueNm: plan.torqueNm,
        targetMargin: plan.targetMargin,
        gasket: r.gasket?.name ?? "—",
        fastener: r.fastener?.name ?? "—",
        makerTorqueNm: r.fastener?.makerTorqueNm ?? null,
        makerLubricant: r.fastener?.makerLubricant ?? null,
        weakestMargin: r.ok ? r.estimate.weakestMargin : null,
        verdict: r.ok ? { status: r.estimate.verdict.status, headline: r.estimate.verdict.headline } : null,
        ceilingNm: r.ok ? r.estimate.ceiling.torqueNm : null,
        ceilingCause: r.ok ? CEILING_WORDS[r.estimate.ceiling.cause] : null,
        problems: r.ok ? [] : r.problems,
      };
    }),
  );
  return { units: user.units, canEdit: roleAtLeast(role, "builder"), engineId: engine.id, chosenPlanId: engine.chosenPlanId, rows };
}

export default function PlanList({ loaderData }: Route.ComponentProps) {
  const { units, canEdit, engineId, chosenPlanId, rows } = loaderData;
  return (
    <>
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <h2 className="text-2xl font-bold">Seal plans</h2>
        {canEdit ? (
          <Link to="new" className="rounded bg-copper-700 px-4 py-2 font-medium text-white hover:bg-copper-600">
            New plan
          </Link>
        ) : null}
      </div>
      {rows.length === 0 ? (
        <p className="rounded border border-dashed border-forge-300 bg-white p-6">
          No plans yet.{canEdit ? " Start one with “New plan”." : ""}
        </p>
      ) : (
        <Form method="get" action={`/engines/${engineId}/compare`}>
          <div className="overflow-x-auto">
            <table className="w-full border-collapse bg-white text-sm tabular">
              <caption className="sr-only">Seal plans of this engine; tick 2 to 4 to compare</caption>
              <thead className="bg-forge-100 text-left">
                <tr>
                  <th scope="col" className="px-2 py-2">
                    Compare
                  </th>
                  <th scope="col" className="px-2 py-2">
                    Plan
                  </th>
                  <th scope="col" className="px-2 py-2">
                    Gasket
                  </th>
                  <th scope="col" className="px-2 py-2">
                    Fastener
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    Torque (ours)
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    Maker's figure
                  </th>
                  <th scope="col" className="px-2 py-2">
                    Verdict
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    Torque ceiling
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => {
                  const s = r.verdict === null ? null : STATUS_LOOK[r.verdict.status];
                  return (
                    <tr key={r.id} className="border-t border-forge-100">
                      <td className="px-2 py-2">
                        <input type="checkbox" name="ids" value={r.id} defaultChecked={rows.length <= 4} aria-label={`Compare ${r.name}`} />
                      </td>
                      <th scope="row" className="px-2 py-2 text-left font-medium">
                        <Link to={String(r.id)} className="text-copper-700 underline">
                          {r.name}
                        </Link>
                        {r.id === chosenPlanId ? (
                          <span className="ml-2 rounded border border-held bg-held-50 px-1 text-xs text-held">✔ chosen</span>
                        ) : null}
                      </th>
                      <td className="px-2 py-2">{r.gasket}</td>
                      <td className="px-2 py-2">{r.fastener}</td>
                      <td className="px-2 py-2 text-right">{formatQuantity(r.torqueNm, "torque", units)}</td>
                      <td className="px-2 py-2 text-right">
                        {r.makerTorqueNm === null ? "not recorded" : formatQuantity(r.makerTorqueNm, "torque", units)}
                        {r.makerLubricant ? <span className="block text-xs text-forge-700">{r.makerLubricant}</span> : null}
                      </td>
                      <td className="px-2 py-2">
                        {s && r.verdict ? (
                          <>
                            <span className="font-bold">
                              {s.icon} {s.word}
                            </span>{" "}
                            {r.verdict.headline}
                            <span className="block text-xs text-forge-700">
                              weakest seal margin {r.weakestMargin!.toFixed(2)}, bottom of the scatter band
                            </span>
                          </>
                        ) : (
                          `✖ ${r.problems[0] ?? "cannot estimate"}`
                        )}
                      </td>
                      <td className="px-2 py-2 text-right">
                        {r.ceilingNm === null || !Number.isFinite(r.ceilingNm) ? "—" : formatQuantity(r.ceilingNm, "torque", units)}
                        {r.ceilingCause ? <span className="block text-xs text-forge-700">{r.ceilingCause}</span> : null}
                        {r.ceilingNm !== null && r.ceilingNm < r.torqueNm ? (
                          <span className="block text-xs font-medium text-failed">⚠ below this plan's torque</span>
                        ) : null}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {rows.length >= 2 ? (
            <button type="submit" className="mt-3 rounded border border-forge-300 bg-white px-4 py-2 font-medium hover:bg-forge-100">
              Compare ticked plans
            </button>
          ) : null}
        </Form>
      )}
      <Caution className="mt-6" />
    </>
  );
}
