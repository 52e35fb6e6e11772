import type { ReactNode } from "react";
import { CEILING_WORDS } from "~/lib/clamp/ceiling-words";
import { layoutName, SLEEVE_LABEL } from "~/lib/engine/labels";
import { GASKET_TYPE_LABELS } from "~/lib/library/labels";
import { stagesText } from "~/lib/plan/build-sheet";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { METHOD_LABEL, WIRE_LABEL } from "~/lib/plan/form-fields";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { Caution } from "./caution";
import { marginStatus } from "~/lib/plan/margin";
import { VerdictLine } from "./verdict-line";
import { STATUS_LOOK } from "./status-look";
import { MakerTorque } from "./maker-torque";

// The build sheet a customer reads: plain data in, one page out (on screen and on paper).

interface SheetEngine {
  name: string;
  customer: string;
  layout: "inline" | "V";
  cylinders: number;
  boreMm: number;
  strokeMm: number;
  sleeveKind: keyof typeof SLEEVE_LABEL;
  fuel: string;
  targetManifoldKpa: number | null;
  peakPressureMpa: number | null;
}

interface Sheet {
  plan: {
    name: string;
    method: keyof typeof METHOD_LABEL;
    torqueNm: number;
    stagesNm: number[];
    lubricant: string;
    wireLocation: keyof typeof WIRE_LABEL;
    updatedAt: string;
  };
  fastener: { name: string; diameterMm: number; makerTorqueNm: number | null; makerLubricant: string | null; makerStages: string | null };
  gasket: { name: string; type: keyof typeof GASKET_TYPE_LABELS; compressedThicknessMm: number; boreMm: number };
  view: EstimateView;
  chamber: { compressionRatio: number; quenchMm: number; quenchInUsualRange: boolean; sweptCc: number; clearanceCc: number } | null;
  materials: { block: string; head: string };
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded border border-forge-100 bg-white p-4 print:border-0 print:p-0">
      <h2 className="mb-2 text-lg font-bold">{title}</h2>
      {children}
    </section>
  );
}

function Facts({ rows }: { rows: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2 print:grid-cols-2">
      {rows.map(([k, v]) => (
        <div key={k} className="flex justify-between gap-3 border-b border-forge-100 py-1">
          <dt className="text-forge-700">{k}</dt>
          <dd className="text-right font-medium tabular">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function BuildSheetView({
  engine,
  sheet,
  units,
  teamName,
}: {
  engine: SheetEngine;
  sheet: Sheet;
  units: UnitSystem;
  teamName: string;
}) {
  const { plan, fastener, gasket, view, chamber, materials } = sheet;
  const e = view.estimate;
  const len = (mm: number) => formatQuantity(mm, "length", units);
  const small = (mm: number) => formatQuantity(mm, "smallLength", units);
  const force = (n: number) => formatQuantity(n, "force", units);
  const torque = (nm: number) => formatQuantity(nm, "torque", units);
  return (
    <article aria-label={`Build sheet of ${engine.name}`} className="space-y-4" data-testid="build-sheet">
      <p className="text-sm text-forge-700">
        From {teamName}
        {engine.customer ? ` for ${engine.customer}` : ""} · seal plan <strong className="text-forge-950">{plan.name}</strong> · last
        changed {plan.updatedAt.slice(0, 10)}
      </p>

      <Section title="Engine">
        <Facts
          rows={[
            ["Layout", layoutName(engine.layout, engine.cylinders)],
            ["Bore × stroke", `${len(engine.boreMm)} × ${len(engine.strokeMm)}`],
            ["Block / head", `${materials.block} / ${materials.head}`],
            ["Sleeves", SLEEVE_LABEL[engine.sleeveKind]],
            ["Fuel", engine.fuel || "—"],
            ["Target manifold pressure", formatQuantity(engine.targetManifoldKpa, "manifold", units)],
          ]}
        />
      </Section>

      <Section title="Gasket strategy">
        <Facts
          rows={[
            ["Gasket", gasket.name],
            ["Kind", GASKET_TYPE_LABELS[gasket.type]],
            ["Compressed thickness", small(gasket.compressedThicknessMm)],
            ["Gasket bore", len(gasket.boreMm)],
            ["Wire ring", WIRE_LABEL[plan.wireLocation]],
          ]}
        />
      </Section>

      <Section title="Fastener and torque">
        <Facts
          rows={[
            ["Fastener", fastener.name],
            ["Thread diameter", len(fastener.diameterMm)],
            ["How it is tightened", METHOD_LABEL[plan.method]],
            ["This plan's stages", stagesText(plan.stagesNm, plan.torqueNm, units)],
            ["This plan's lubricant", plan.lubricant || "as the maker says"],
          ]}
        />
        <div className="mt-3">
          <MakerTorque
            ourTorqueNm={plan.torqueNm}
            makerTorqueNm={fastener.makerTorqueNm}
            makerLubricant={fastener.makerLubricant}
            makerStages={fastener.makerStages}
            units={units}
          />
        </div>
      </Section>

      <Section title="Our estimate">
        <p data-testid="sheet-verdict">
          <VerdictLine view={view} />
        </p>
        <p className="mt-1 text-sm tabular">
          Weakest seal margin {e.weakestMargin.toFixed(2)} on cylinder {e.weakestCylinder} (target {view.targetMargin.toFixed(2)}), at the
          bottom of the tightening scatter, hot and fired.
        </p>
        <table className="mt-3 w-full border-collapse text-sm tabular" data-testid="sheet-cylinders">
          <caption className="sr-only">Clamp and seal margin per cylinder</caption>
          <thead className="bg-forge-100">
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Cylinder
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Clamp (cold)
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Seal margin
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Body margin
              </th>
            </tr>
          </thead>
          <tbody>
            {e.cylinders.map((c) => {
              const look = STATUS_LOOK[marginStatus(c.sealMargin, view.targetMargin)];
              return (
                <tr key={c.cylinder} className="border-t border-forge-100">
                  <th scope="row" className="px-2 py-1 text-left font-medium">
                    {c.cylinder}
                  </th>
                  <td className="px-2 py-1 text-right">{force(c.clampN)}</td>
                  <td className="px-2 py-1 text-right">
                    {look.icon} {c.sealMargin.toFixed(2)}
                  </td>
                  <td className="px-2 py-1 text-right">{c.bodyMargin.toFixed(2)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <p className="mt-3 text-sm" data-testid="sheet-squeeze">
          <strong>Squeeze point:</strong>{" "}
          {e.squeeze.mostlySqueezing
            ? "at this torque, more torque already mostly squeezes the head instead of the seal."
            : view.headSqueezeOnsetNm !== null
              ? `past ${torque(view.headSqueezeOnsetNm)}, more torque would mostly squeeze the head instead of the seal.`
              : "more torque still reaches the seal across the torques we tried."}{" "}
          Torque ceiling {torque(e.ceiling.torqueNm)}, set by the {CEILING_WORDS[e.ceiling.cause]}.
        </p>
      </Section>

      {chamber ? (
        <Section title="Chamber">
          <Facts
            rows={[
              ["Compression ratio", `${chamber.compressionRatio.toFixed(2)} : 1`],
              [
                "Quench (squish) clearance",
                `${small(chamber.quenchMm)} ${chamber.quenchInUsualRange ? "(usual)" : "(outside the usual 0.9–1.15 mm)"}`,
              ],
              ["Swept volume per cylinder", `${chamber.sweptCc.toFixed(1)} cc`],
              ["Clearance volume", `${chamber.clearanceCc.toFixed(1)} cc`],
            ]}
          />
        </Section>
      ) : null}

      <Section title="Torque procedure">
        <ol className="list-decimal space-y-1 pl-5 text-sm">
          <li>Clean and chase the threads; fit the studs to the depth the fastener maker gives.</li>
          <li>
            Lubricate threads and washer faces — {fastener.makerLubricant || plan.lubricant || "the lubricant the fastener maker names"}.
          </li>
          <li>
            Tighten in the engine maker's sequence, in stages: {stagesText(plan.stagesNm, plan.torqueNm, units)}
            {fastener.makerTorqueNm !== null && Math.abs(fastener.makerTorqueNm - plan.torqueNm) / fastener.makerTorqueNm >= 0.005
              ? ` (the maker's figure is ${torque(fastener.makerTorqueNm)}: theirs governs)`
              : ""}
            .
          </li>
          <li>Re-check at the final figure in the same sequence, and after the first heat cycle if the gasket maker asks for it.</li>
        </ol>
        <p className="mt-2 text-xs text-forge-700">
          Preload per stud we expect: {force(e.tightening.preload.minN)} to {force(e.tightening.preload.maxN)} across the tightening
          scatter.
        </p>
      </Section>

      <Caution />
    </article>
  );
}
