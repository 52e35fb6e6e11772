import { Link } from "react-router";
import type { Route } from "./+types/checklist";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { StudSequence } from "~/components/stud-sequence";
import { layoutStuds } from "~/lib/records/sequence";
import { formatQuantity } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { evaluateAtFiring } from "~/models/plan-at-pressure.server";
import { requirePlan } from "~/models/plan.server";
import { requireUser } from "~/utils/auth.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Torque procedure · ${data?.plan.name ?? "Plan"} · Sealwright` }];
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const plan = await requirePlan(team.id, engine.id, params.planId);
  const at = await evaluateAtFiring(team.id, engine, plan);
  const layout = layoutStuds(engine.studs, engine.cylinders, engine.layout);
  return {
    units: user.units,
    engine: { id: engine.id, name: engine.name },
    plan: { id: plan.id, name: plan.name, lubricant: plan.lubricant, stagesNm: plan.stagesNm, torqueNm: plan.torqueNm },
    layout,
    fastener: at.ok
      ? {
          name: at.fastener.name,
          makerTorqueNm: at.fastener.makerTorqueNm,
          makerLubricant: at.fastener.makerLubricant,
          makerStages: at.fastener.makerStages,
        }
      : null,
    gasket: at.ok ? { name: at.gasket.name, relaxationPercent: at.gasket.relaxationPercent } : null,
    nominalPreloadN: at.ok ? at.estimate.tightening.preload.nominalN : null,
  };
}

export default function Checklist({ loaderData: d }: Route.ComponentProps) {
  const u = d.units;
  const bySequence = (bank: number) => d.layout.studs.filter((s) => s.bank === bank).sort((a, b) => a.order - b.order);
  return (
    <article className="checklist max-w-4xl space-y-4">
      <p className="no-print text-sm">
        <Link to={`/engines/${d.engine.id}/plans/${d.plan.id}`} className="text-copper-700 underline">
          ← Back to the plan
        </Link>{" "}
        ·{" "}
        <button type="button" onClick={() => window.print()} className="text-copper-700 underline">
          Print
        </button>
      </p>
      <h2 className="text-2xl font-bold">Torque procedure: {d.plan.name}</h2>
      <Caution />
      <table className="w-full border-collapse bg-white text-sm">
        <tbody>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Engine
            </th>
            <td className="px-2 py-1">{d.engine.name}</td>
          </tr>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Fastener
            </th>
            <td className="px-2 py-1">{d.fastener?.name ?? "—"}</td>
          </tr>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Gasket
            </th>
            <td className="px-2 py-1">{d.gasket?.name ?? "—"}</td>
          </tr>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Lubricant
            </th>
            <td className="px-2 py-1">
              {d.plan.lubricant || "—"}
              {d.fastener?.makerLubricant && d.fastener.makerLubricant !== d.plan.lubricant
                ? ` (the maker names: ${d.fastener.makerLubricant})`
                : ""}
            </td>
          </tr>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Maker's figure
            </th>
            <td className="px-2 py-1 tabular">
              {d.fastener?.makerTorqueNm ? formatQuantity(d.fastener.makerTorqueNm, "torque", u) : "none recorded"}
              {d.fastener?.makerStages ? ` · maker's stages: ${d.fastener.makerStages}` : ""}
            </td>
          </tr>
          <tr className="border-t border-forge-100">
            <th scope="row" className="px-2 py-1 text-left">
              Plan's final torque
            </th>
            <td className="px-2 py-1 tabular">
              {formatQuantity(d.plan.torqueNm, "torque", u)} (our preload estimate {formatQuantity(d.nominalPreloadN, "force", u)} per stud;
              the maker's figure governs)
            </td>
          </tr>
          {d.gasket && d.gasket.relaxationPercent > 0 ? (
            <tr className="border-t border-forge-100">
              <th scope="row" className="px-2 py-1 text-left">
                Re-torque
              </th>
              <td className="px-2 py-1">
                This gasket relaxes after heat cycles ({d.gasket.relaxationPercent} % in its record): re-torque cold, in the same sequence,
                as the gasket and stud makers direct.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
      {Array.from({ length: d.layout.banks }, (_, bank) => (
        <section key={bank} className="break-inside-avoid space-y-2">
          <h3 className="text-lg font-bold">Sequence{d.layout.banks > 1 ? `, bank ${bank === 0 ? "A" : "B"}` : ""} (seen from above)</h3>
          <StudSequence layout={d.layout} bank={bank} />
          <table className="w-full border-collapse bg-white text-sm tabular">
            <caption className="sr-only">A box per stud per stage</caption>
            <thead className="bg-forge-100">
              <tr>
                <th scope="col" className="px-2 py-1 text-left">
                  #
                </th>
                <th scope="col" className="px-2 py-1 text-left">
                  Stud
                </th>
                {d.plan.stagesNm.map((s, i) => (
                  <th key={i} scope="col" className="px-2 py-1 text-center">
                    Stage {i + 1}: {formatQuantity(s, "torque", u)}
                  </th>
                ))}
                {d.gasket && d.gasket.relaxationPercent > 0 ? (
                  <th scope="col" className="px-2 py-1 text-center">
                    Re-torque
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {bySequence(bank).map((s) => (
                <tr key={s.index} className="border-t border-forge-100">
                  <td className="px-2 py-1 font-bold">{s.order}</td>
                  <td className="px-2 py-1">{s.label}</td>
                  {d.plan.stagesNm.map((_, i) => (
                    <td key={i} className="px-2 py-1 text-center">
                      <span role="img" aria-label="box to tick" className="inline-block h-5 w-5 border-2 border-forge-700" />
                    </td>
                  ))}
                  {d.gasket && d.gasket.relaxationPercent > 0 ? (
                    <td className="px-2 py-1 text-center">
                      <span className="inline-block h-5 w-5 border-2 border-forge-700" />
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
      <p className="text-sm">Done by: ______________________ Date: ____________ Torque wrench (calibrated on): ____________</p>
    </article>
  );
}
