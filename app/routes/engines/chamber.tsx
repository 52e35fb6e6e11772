import { Form, Link } from "react-router";
import { ErrorSummary } from "~/components/form";
import type { Route } from "./+types/chamber";
import { chamberProblems, gasketThicknessWhatIf } from "~/lib/chamber";
import { readWhatIfThickness } from "~/lib/chamber/what-if";
import { chamberInput } from "~/lib/plan/assemble";
import { formatQuantity, unitFor } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { listPlans, planChoices } from "~/models/plan.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Chamber · Sealwright" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const [{ gaskets }, plans] = await Promise.all([planChoices(team.id), listPlans(team.id, engine.id)]);
  const url = new URL(request.url);
  const chosen = plans.find((p) => p.id === engine.chosenPlanId) ?? plans[0];
  const gasket =
    gaskets.find((g) => g.id === Number(url.searchParams.get("gasketId"))) ?? gaskets.find((g) => g.id === chosen?.gasketId) ?? gaskets[0];
  const whatIfText = url.searchParams.get("thickness") ?? "";
  const { thicknessMm: whatIfMm, error: whatIfError } = readWhatIfThickness(whatIfText, user.units);
  const base = {
    units: user.units,
    engine,
    gaskets: gaskets.map((g) => ({ id: g.id, name: g.name })),
    gasketId: gasket?.id ?? null,
    fromChosen: gasket?.id === chosen?.gasketId,
    whatIfText,
    whatIfError,
    canEdit: roleAtLeast(role, "builder"),
  };
  const input = gasket ? chamberInput(engine, gasket) : null;
  if (!input)
    return {
      ...base,
      problems: [!gasket ? "Add a gasket in Libraries first." : "The engine record has no chamber volume yet."],
      result: null,
    };
  const problems = chamberProblems(input);
  if (problems.length) return { ...base, problems, result: null };
  const newThickness = whatIfMm ?? input.gasketThicknessMm;
  return {
    ...base,
    problems: [],
    result: gasketThicknessWhatIf(input, newThickness),
    thicknessMm: input.gasketThicknessMm,
    newThicknessMm: newThickness,
  };
}

export default function Chamber({ loaderData }: Route.ComponentProps) {
  const d = loaderData;
  const u = d.units;
  const r = d.result;
  const small = unitFor("smallLength", u);
  return (
    <div className="max-w-3xl space-y-4">
      <h2 className="text-2xl font-bold">Chamber</h2>
      <ErrorSummary
        errors={d.whatIfError ? { thickness: d.whatIfError } : {}}
        message={d.whatIfError ? "The what-if thickness could not be read." : null}
        answer={d.whatIfText}
        fieldId={(name) => name}
      />
      <Form method="get" className="flex flex-wrap items-end gap-3 rounded border border-forge-100 bg-white p-3">
        <div className="min-w-0 max-w-full">
          <label htmlFor="gasketId" className="block text-sm font-medium">
            Gasket
          </label>
          <select
            id="gasketId"
            name="gasketId"
            defaultValue={d.gasketId ?? undefined}
            className="mt-1 block w-full max-w-full rounded border border-forge-500 px-2 py-2"
          >
            {d.gaskets.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="thickness" className="block text-sm font-medium">
            What if compressed thickness were ({small})
          </label>
          <input
            id="thickness"
            name="thickness"
            defaultValue={d.whatIfText}
            inputMode="decimal"
            aria-invalid={d.whatIfError ? true : undefined}
            aria-describedby={d.whatIfError ? "thickness-error" : undefined}
            className="mt-1 w-40 max-w-full rounded border border-forge-500 px-2 py-2 tabular"
          />
        </div>
        <button type="submit" className="rounded bg-copper-700 px-4 py-2 font-medium text-white">
          Work it out
        </button>
        {d.whatIfError ? (
          <p id="thickness-error" className="w-full text-sm font-medium text-failed">
            ✖ {d.whatIfError}
          </p>
        ) : null}
      </Form>
      <p className="text-sm text-forge-700">{d.fromChosen ? "Gasket of the chosen plan." : "Gasket picked above."}</p>
      {d.problems.length ? (
        <p role="alert" className="rounded border border-caution bg-caution-50 p-3">
          ⚠ {d.problems.join(" ")}{" "}
          {d.canEdit ? (
            <Link to={`/engines/${d.engine.id}/edit`} className="underline">
              Edit the engine
            </Link>
          ) : (
            "A builder in this shop can add it."
          )}
        </p>
      ) : null}
      {r ? (
        <table className="w-full border-collapse bg-white text-sm tabular [overflow-wrap:anywhere]">
          <caption className="sr-only">Compression ratio and quench, now and with the what-if thickness</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-2 text-left">
                Figure
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                With this gasket
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                What if
              </th>
            </tr>
          </thead>
          <tbody>
            <Row
              label="Compressed thickness"
              a={formatQuantity("thicknessMm" in d ? d.thicknessMm : null, "smallLength", u)}
              b={formatQuantity("newThicknessMm" in d ? d.newThicknessMm : null, "smallLength", u)}
            />
            <Row
              label="Compression ratio"
              a={`${r.before.compressionRatio.toFixed(2)} : 1`}
              b={`${r.after.compressionRatio.toFixed(2)} : 1 (${r.compressionRatioChange >= 0 ? "+" : ""}${r.compressionRatioChange.toFixed(2)})`}
            />
            <Row
              label="Quench (squish) clearance"
              a={`${formatQuantity(r.before.quenchMm, "smallLength", u)} ${r.before.quenchInUsualRange ? "✔ usual" : "⚠ outside the usual"}`}
              b={`${formatQuantity(r.after.quenchMm, "smallLength", u)} ${r.after.quenchInUsualRange ? "✔ usual" : "⚠ outside the usual"}`}
            />
            <Row label="Swept volume" a={`${r.before.sweptCc.toFixed(1)} cc`} b={`${r.after.sweptCc.toFixed(1)} cc`} />
            <Row
              label="Chamber + gasket + deck + piston"
              a={`${r.before.chamberCc.toFixed(1)} + ${r.before.gasketCc.toFixed(2)} + ${r.before.deckCc.toFixed(2)} + ${r.before.pistonCc.toFixed(1)} cc`}
              b={`${r.after.chamberCc.toFixed(1)} + ${r.after.gasketCc.toFixed(2)} + ${r.after.deckCc.toFixed(2)} + ${r.after.pistonCc.toFixed(1)} cc`}
            />
          </tbody>
        </table>
      ) : null}
      <p className="text-xs text-forge-700">
        Usual quench with steel rods: 0.9–1.15 mm (0.035–0.045 in), common practice; aluminium rods stretch more and want more. Deck
        clearance is the piston crown below the deck at TDC.
      </p>
    </div>
  );
}

function Row({ label, a, b }: { label: string; a: string; b: string }) {
  return (
    <tr className="border-t border-forge-100">
      <th scope="row" className="px-2 py-2 text-left font-medium">
        {label}
      </th>
      <td className="px-2 py-2 text-right">{a}</td>
      <td className="px-2 py-2 text-right">{b}</td>
    </tr>
  );
}
