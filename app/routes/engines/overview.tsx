import type { ReactNode } from "react";
import { Form, Link } from "react-router";
import type { Route } from "./+types/overview";
import { StatusBadge } from "~/components/engine-status";
import { formatShare, layoutName, patternSummary, PEAK_SOURCE_LABEL, SLEEVE_LABEL } from "~/lib/engine/labels";
import { chosenPlanName, materialNames, requireEngine } from "~/models/engine.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";
import { formatQuantity } from "~/lib/units";

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const names = await materialNames(team.id, [engine.blockMaterialId, engine.headMaterialId, engine.sleeveMaterialId]);
  return {
    engine,
    units: user.units,
    materials: names,
    chosenPlan: await chosenPlanName(team.id, engine),
    canEdit: roleAtLeast(role, "builder"),
  };
}

export default function EngineOverview({ loaderData }: Route.ComponentProps) {
  const { engine: e, units, materials, chosenPlan, canEdit } = loaderData;
  const mat = (id: number | null) => (id === null ? "—" : (materials[id] ?? "(material no longer listed)"));
  const len = (v: number | null) => formatQuantity(v, "length", units);
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <div className="flex flex-wrap items-center justify-between gap-3 lg:col-span-2">
        <p className="text-forge-700">
          Chosen seal plan: <strong className="text-forge-950">{chosenPlan ?? "none chosen yet"}</strong>
        </p>
        {canEdit ? (
          <div className="flex flex-wrap gap-2">
            <Link to={`/engines/${e.id}/edit`} className="rounded bg-copper-700 px-4 py-2 font-medium text-white hover:bg-copper-600">
              Edit engine
            </Link>
            <Form method="post" action={`/engines/${e.id}/duplicate`}>
              <button type="submit" className="rounded border border-forge-300 bg-white px-4 py-2 font-medium hover:bg-forge-100">
                Duplicate engine
              </button>
            </Form>
          </div>
        ) : null}
      </div>
      <Section title="Geometry">
        <dl>
          <Row k="Layout">
            {layoutName(e.layout, e.cylinders)} (
            {e.layout === "V" ? `V, two banks of ${e.cylinders / 2}` : `inline, ${e.cylinders} cylinders`})
          </Row>
          <Row k="Bore">{len(e.boreMm)}</Row>
          <Row k="Stroke">{len(e.strokeMm)}</Row>
          <Row k="Rod length">{len(e.rodLengthMm)}</Row>
          <Row k="Head thickness at the stud">{len(e.headThicknessAtStudMm)}</Row>
          <Row k="Block depth to the engaged thread">{len(e.blockDepthToThreadMm)}</Row>
          <Row k="Deck clearance">{formatQuantity(e.deckClearanceMm, "smallLength", units)}</Row>
          <Row k="Chamber volume">{formatQuantity(e.chamberCc, "volume", units)}</Row>
          <Row k="Piston volume (dish +, dome −)">{formatQuantity(e.pistonVolumeCc, "volume", units)}</Row>
        </dl>
      </Section>
      <Section title="Materials and sleeves">
        <dl>
          <Row k="Block (deck)">{mat(e.blockMaterialId)}</Row>
          <Row k="Head">{mat(e.headMaterialId)}</Row>
          <Row k="Sleeves">{SLEEVE_LABEL[e.sleeveKind]}</Row>
          {e.sleeveKind !== "none" ? (
            <>
              <Row k="Sleeve material">{mat(e.sleeveMaterialId)}</Row>
              <Row k="Sleeve wall">{len(e.sleeveWallMm)}</Row>
              {e.sleeveKind === "wet-mid" ? <Row k="Support length (top to seat)">{len(e.sleeveSupportLengthMm)}</Row> : null}
            </>
          ) : null}
          <Row k="Protrusion as machined">{formatQuantity(e.sleeveProtrusionMm, "smallLength", units)}</Row>
        </dl>
      </Section>
      <Section title="Boost and firing">
        <dl>
          <Row k="Fuel">{e.fuel || "—"}</Row>
          <Row k="Target manifold pressure">{formatQuantity(e.targetManifoldKpa, "manifold", units)}</Row>
          <Row k="Peak cylinder pressure">
            {e.peakPressureMpa === null ? (
              "not given — estimated from boost in each plan"
            ) : (
              <>
                {formatQuantity(e.peakPressureMpa, "pressure", units)}{" "}
                <span className="rounded bg-forge-100 px-1.5 text-sm">{PEAK_SOURCE_LABEL[e.peakPressureSource]}</span>
              </>
            )}
          </Row>
          <Row k="Pressure-rise factor">{e.pressureRiseFactor}</Row>
          <Row k="Running head / block temperature">
            {formatQuantity(e.runningHeadC, "temperature", units)} / {formatQuantity(e.runningBlockC, "temperature", units)}
          </Row>
          <Row k="Status">
            <StatusBadge status={e.status} />
          </Row>
        </dl>
      </Section>
      <Section title="Stud pattern">
        <p className="mb-2">{patternSummary(e.studs)}</p>
        <details>
          <summary className="cursor-pointer text-copper-700">Every stud and its shares</summary>
          <table className="mt-2 w-full border-collapse text-left text-sm tabular">
            <thead className="bg-forge-100">
              <tr>
                <th scope="col" className="px-2 py-1">
                  Stud
                </th>
                <th scope="col" className="px-2 py-1">
                  Cylinders served
                </th>
                <th scope="col" className="px-2 py-1">
                  Share of each
                </th>
              </tr>
            </thead>
            <tbody>
              {e.studs.map((s, i) => (
                <tr key={i} className="border-t border-forge-100">
                  <td className="px-2 py-1">{s.label ?? i + 1}</td>
                  <td className="px-2 py-1">{s.serves.map((v) => v.cylinder).join(", ")}</td>
                  <td className="px-2 py-1">{s.serves.map((v) => formatShare(v.share)).join(", ")}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </details>
      </Section>
      <Section title="Notes" wide>
        {e.notes ? <p className="whitespace-pre-wrap">{e.notes}</p> : <p className="text-forge-700">No notes.</p>}
      </Section>
    </div>
  );
}

function Section({ title, children, wide }: { title: string; children: ReactNode; wide?: boolean }) {
  return (
    <section className={`rounded border border-forge-100 bg-white p-4 ${wide ? "lg:col-span-2" : ""}`}>
      <h2 className="mb-3 text-xl font-bold">{title}</h2>
      {children}
    </section>
  );
}

function Row({ k, children }: { k: string; children: ReactNode }) {
  return (
    <div className="flex justify-between gap-4 border-t border-forge-100 py-1.5 first:border-t-0">
      <dt className="text-forge-700">{k}</dt>
      <dd className="text-right font-medium tabular">{children}</dd>
    </div>
  );
}
