import { data, Form, Link } from "react-router";
import type { Route } from "./+types/compare";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { STATUS_LOOK } from "~/components/status-look";
import { chance, marginStatus } from "~/lib/plan/margin";
import { CEILING_WORDS, type Status } from "~/lib/clamp";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { estimatePlan, type PlanEstimateResult } from "~/models/plan-estimate.server";
import { choosePlan, listPlans, type PlanRow } from "~/models/plan.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Compare plans · Sealwright" }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const plans = await listPlans(team.id, engine.id);
  const wanted = new URL(request.url).searchParams.getAll("ids").map(Number);
  const chosen = plans.filter((p) => wanted.includes(p.id));
  // Fewer than two ticked: show the first four and say so.
  const tooFew = wanted.length > 0 && chosen.length < 2;
  const picked = (chosen.length >= 2 ? chosen : plans).slice(0, 4);
  const columns = await Promise.all(
    picked.map(async (plan) => ({ plan, result: await estimatePlan(team.id, engine, plan, { units: user.units }) })),
  );
  return {
    units: user.units,
    canEdit: roleAtLeast(role, "builder"),
    engineId: engine.id,
    chosenPlanId: engine.chosenPlanId,
    plans: plans.map((p) => ({ id: p.id, name: p.name })),
    columns,
    tooMany: wanted.length > 4,
    tooFew,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const form = await request.formData();
  const planId = Number(form.get("planId"));
  const plans = await listPlans(team.id, engine.id);
  const plan = plans.find((p) => p.id === planId);
  if (!plan) throw data("No such seal plan on this engine.", { status: 404 });
  await choosePlan(team.id, user.id, engine.id, plan.id);
  const back = new URL(request.url);
  return redirectWithToast(request, back.pathname + back.search, `“${plan.name}” is now the chosen plan.`);
}

type Column = { plan: PlanRow; result: PlanEstimateResult };
type Row = {
  label: string;
  better?: "higher" | "lower";
  value: (c: Column) => number | null;
  show: (v: number, u: UnitSystem, c: Column) => string;
};

const ok = (c: Column) => (c.result.ok ? c.result.view : null);

// The outputs compared, and which way is better where one way is.
const SEVERITY: Record<Status, number> = { holds: 2, thin: 1, short: 0 };
const ROWS: Row[] = [
  {
    label: "Verdict",
    better: "higher",
    value: (c) => {
      const v = ok(c);
      return v ? SEVERITY[v.estimate.verdict.status] : null;
    },
    show: (_v, _u, c) => {
      const v = ok(c)!.estimate.verdict;
      const l = STATUS_LOOK[v.status];
      return `${l.icon} ${l.word}: ${v.headline}`;
    },
  },
  { label: "Final torque (ours)", value: (c) => c.plan.torqueNm, show: (v, u) => formatQuantity(v, "torque", u) },
  {
    label: "Fastener maker's figure",
    value: (c) => c.result.fastener?.makerTorqueNm ?? null,
    show: (v, u, c) =>
      `${formatQuantity(v, "torque", u)}${c.result.fastener?.makerLubricant ? ` · ${c.result.fastener.makerLubricant}` : ""}`,
  },
  {
    label: "Weakest seal margin, bottom of the scatter band",
    better: "higher",
    value: (c) => ok(c)?.estimate.weakestMargin ?? null,
    show: (v, _u, c) =>
      `${STATUS_LOOK[marginStatus(v, c.plan.targetMargin)].icon} ${v.toFixed(2)} (cyl ${ok(c)?.estimate.weakestCylinder})`,
  },
  { label: "…at the nominal preload", value: (c) => ok(c)?.estimate.weakestMarginNominal ?? null, show: (v) => v.toFixed(2) },
  { label: "Chance weakest margin < 1", better: "lower", value: (c) => ok(c)?.probabilityMarginBelowOne ?? null, show: (v) => chance(v) },
  {
    label: "Nominal preload per stud",
    value: (c) => ok(c)?.estimate.tightening.preload.nominalN ?? null,
    show: (v, u) => formatQuantity(v, "force", u),
  },
  {
    label: "Hot and settled preload per stud",
    better: "higher",
    value: (c) => ok(c)?.estimate.hotSettled.preloadN ?? null,
    show: (v, u) => formatQuantity(v, "force", u),
  },
  {
    label: "Stud while tightened, top of the band (of yield)",
    better: "lower",
    value: (c) => ok(c)?.estimate.studStress.atMax.utilization ?? null,
    show: (v) => `${(v * 100).toFixed(0)} %`,
  },
  {
    label: "Stud hot and fired, top of the band (of yield)",
    better: "lower",
    value: (c) => ok(c)?.estimate.studStress.working.utilization ?? null,
    show: (v) => `${(v * 100).toFixed(0)} %`,
  },
  {
    label: "Washer on the head (of its limit)",
    better: "lower",
    value: (c) => ok(c)?.estimate.head.bearingUtilizationMax ?? null,
    show: (v) => `${(v * 100).toFixed(0)} %`,
  },
  {
    label: "Seal gained per +10 % torque",
    better: "higher",
    value: (c) => ok(c)?.estimate.gain.share ?? null,
    show: (v) => `${(v * 100).toFixed(0)} % of the added clamp`,
  },
  {
    label: "Headroom to the torque ceiling",
    better: "higher",
    value: (c) => {
      const v = ok(c);
      return v && Number.isFinite(v.ceiling.torqueNm) ? v.ceiling.torqueNm - v.torqueNm : null;
    },
    show: (v, u, c) =>
      `${v < 0 ? "⚠ past it by " : ""}${formatQuantity(Math.abs(v), "torque", u)} (${CEILING_WORDS[ok(c)!.ceiling.cause]})`,
  },
  {
    label: "More torque mostly squeezes the head",
    value: (c) => {
      const v = ok(c);
      return v ? (v.estimate.squeeze.mostlySqueezing ? 1 : 0) : null;
    },
    show: (v) => (v ? "✖ yes, at this torque" : "no"),
  },
  {
    label: "Firing load the stud takes",
    value: (c) => ok(c)?.estimate.stiffness.loadFactor ?? null,
    show: (v) => `${(v * 100).toFixed(0)} %`,
  },
];

export default function Compare({ loaderData }: Route.ComponentProps) {
  const { units, canEdit, engineId, chosenPlanId, plans, columns, tooMany, tooFew } = loaderData;
  if (plans.length < 2) {
    return (
      <p className="rounded border border-dashed border-forge-300 bg-white p-6">
        Comparing needs at least two plans.{" "}
        <Link className="text-copper-700 underline" to={`/engines/${engineId}/plans`}>
          Back to the plans
        </Link>
      </p>
    );
  }
  return (
    <>
      <h2 className="mb-2 text-2xl font-bold">Compare plans</h2>
      <Form method="get" className="no-print mb-4 flex flex-wrap items-center gap-3 text-sm">
        <span className="font-medium">Plans (2–4):</span>
        {plans.map((p) => (
          <label key={p.id} className="flex items-center gap-1">
            <input type="checkbox" name="ids" value={p.id} defaultChecked={columns.some((c) => c.plan.id === p.id)} /> {p.name}
          </label>
        ))}
        <button type="submit" className="rounded border border-forge-300 bg-white px-3 py-1">
          Show
        </button>
        {tooMany ? <span className="text-failed">✖ At most four plans side by side; showing the first four.</span> : null}
        {tooFew ? <span className="text-failed">✖ Tick two to four plans to compare; showing the first ones.</span> : null}
      </Form>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse bg-white text-sm tabular">
          <caption className="sr-only">Plans side by side; the best value of each row is marked “best”.</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-2 text-left">
                Output
              </th>
              {columns.map((c) => (
                <th scope="col" key={c.plan.id} className="px-2 py-2 text-right">
                  <Link to={`/engines/${engineId}/plans/${c.plan.id}`} className="text-copper-700 underline">
                    {c.plan.name}
                  </Link>
                  {c.plan.id === chosenPlanId ? <span className="block text-xs text-held">✔ chosen</span> : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr className="border-t border-forge-100">
              <th scope="row" className="px-2 py-2 text-left font-medium">
                Gasket · fastener
              </th>
              {columns.map((c) => (
                <td key={c.plan.id} className="px-2 py-2 text-right">
                  {c.result.gasket?.name ?? "—"} · {c.result.fastener?.name ?? "—"}
                </td>
              ))}
            </tr>
            {ROWS.map((row) => {
              const values = columns.map((c) => row.value(c));
              const present = values.filter((v): v is number => v !== null);
              const best =
                row.better && present.length > 1 ? (row.better === "higher" ? Math.max(...present) : Math.min(...present)) : null;
              const distinct = new Set(present.map((v) => v.toPrecision(6))).size > 1;
              return (
                <tr key={row.label} className="border-t border-forge-100">
                  <th scope="row" className="px-2 py-2 text-left font-medium">
                    {row.label}
                  </th>
                  {columns.map((c, i) => {
                    const v = values[i];
                    const isBest = best !== null && distinct && v !== null && v === best;
                    return (
                      <td key={c.plan.id} className={`px-2 py-2 text-right ${isBest ? "bg-held-50 font-bold text-held" : ""}`}>
                        {v === null ? "—" : row.show(v, units, c)}
                        {isBest ? " ★ best" : ""}
                      </td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {canEdit ? (
        <div className="no-print mt-4 flex flex-wrap gap-2">
          {columns
            .filter((c) => c.plan.id !== chosenPlanId)
            .map((c) => (
              <Form method="post" key={c.plan.id}>
                <input type="hidden" name="planId" value={c.plan.id} />
                <button type="submit" className="rounded border border-forge-300 bg-white px-4 py-2 font-medium hover:bg-forge-100">
                  Mark “{c.plan.name}” as chosen
                </button>
              </Form>
            ))}
        </div>
      ) : null}
      <Caution className="mt-6" />
    </>
  );
}
