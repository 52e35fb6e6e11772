import { data, Form, Link } from "react-router";
import type { ReactNode } from "react";
import type { Route } from "./+types/list";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { sourceLine, threadLabel } from "~/lib/library/display";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { GASKET_TYPE_LABELS, isLibraryKind, MATERIAL_KIND_LABELS, type LibraryKind } from "~/lib/library/labels";
import { listLibrary, type FastenerRow, type GasketRow, type LibraryRow, type MaterialRow } from "~/models/library.server";
import { requireUser, roleAtLeast } from "~/utils/auth.server";

export const meta: Route.MetaFunction = ({ params }) => [{ title: `${TITLE[params.kind as LibraryKind] ?? "Libraries"} · Sealwright` }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

const TITLE: Record<LibraryKind, string> = { fasteners: "Fasteners", gaskets: "Gaskets", materials: "Materials" };
const NEW_LABEL: Record<LibraryKind, string> = { fasteners: "New fastener", gaskets: "New gasket", materials: "New material" };

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role } = await requireUser(request);
  const kind = params.kind;
  if (!isLibraryKind(kind)) throw data("There is no such library.", { status: 404 });
  const showArchived = new URL(request.url).searchParams.get("archived") === "1";
  const rows = await listLibrary(kind, team.id, { includeArchived: showArchived });
  return { kind, rows, showArchived, units: user.units, canEdit: roleAtLeast(role, "builder") };
}

export default function LibraryList({ loaderData }: Route.ComponentProps) {
  const { kind, rows, showArchived, units, canEdit } = loaderData;
  return (
    <section aria-labelledby="library-heading">
      <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <h2 id="library-heading" className="text-2xl font-bold">
          {TITLE[kind]} <span className="text-base font-normal text-forge-700">({rows.length})</span>
        </h2>
        <div className="flex flex-wrap items-center gap-3">
          <Form method="get" className="flex items-center gap-2">
            {/* Works without JavaScript: the button submits the toggle. */}
            <input type="hidden" name="archived" value={showArchived ? "0" : "1"} />
            <button
              type="submit"
              className="rounded border border-forge-300 bg-white px-3 py-2 text-sm hover:bg-forge-100"
              aria-pressed={showArchived}
            >
              {showArchived ? "☑ Showing archived — hide them" : "☐ Show archived"}
            </button>
          </Form>
          {canEdit ? (
            <Link to={`/libraries/${kind}/new`} className="rounded bg-copper-700 px-4 py-2 font-medium text-white hover:bg-copper-600">
              {NEW_LABEL[kind]}
            </Link>
          ) : null}
        </div>
      </div>
      <Caution className="mb-4" />
      {rows.length === 0 ? (
        <p className="rounded border border-dashed border-forge-300 bg-white p-6 text-forge-700">
          Nothing here yet.{canEdit ? ` Use “${NEW_LABEL[kind]}” to add the first one.` : ""}
        </p>
      ) : (
        <div className="overflow-x-auto">
          {kind === "fasteners" ? (
            <FastenerTable rows={rows as FastenerRow[]} units={units} />
          ) : kind === "gaskets" ? (
            <GasketTable rows={rows as GasketRow[]} units={units} />
          ) : (
            <MaterialTable rows={rows as MaterialRow[]} units={units} />
          )}
        </div>
      )}
    </section>
  );
}

function Table({ caption, head, children }: { caption: string; head: string[]; children: ReactNode }) {
  return (
    <table className="w-full border-collapse bg-white text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="bg-forge-100">
        <tr>
          {head.map((h) => (
            <th key={h} scope="col" className="whitespace-nowrap px-2 py-2">
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

const td = "px-2 py-1.5 align-top";
const num = `${td} tabular whitespace-nowrap text-right`;

function NameCell({ row, kind }: { row: LibraryRow; kind: LibraryKind }) {
  return (
    <th scope="row" className={`${td} font-medium`}>
      <Link to={`/libraries/${kind}/${row.id}`} className="text-copper-700 underline">
        {row.name}
      </Link>
      {row.archivedAt ? (
        <span className="ml-2 whitespace-nowrap rounded border border-forge-300 px-1 text-xs text-forge-700">⊘ Archived</span>
      ) : null}
    </th>
  );
}

function SourceCell({ row }: { row: LibraryRow }) {
  const seeded = Boolean(row.source);
  return (
    <td className={`${td} max-w-md text-xs text-forge-700`}>
      <span aria-hidden="true">{seeded ? "§ " : "✎ "}</span>
      {sourceLine(row)}
    </td>
  );
}

function FastenerTable({ rows, units }: { rows: FastenerRow[]; units: UnitSystem }) {
  return (
    <Table
      caption="Fasteners: thread, shank, material, and the fastener maker's recorded figures"
      head={[
        "Name",
        "Thread",
        "Shank",
        "Material",
        "Maker's torque",
        "Maker's lubricant",
        "Maker's stages",
        "Stretch",
        "μ thread / bearing",
        "Source",
      ]}
    >
      {rows.map((f) => (
        <tr key={f.id} className="border-t border-forge-100">
          <NameCell row={f} kind="fasteners" />
          <td className={`${td} whitespace-nowrap`}>{threadLabel(f.threadSystem, f.diameterMm, f.pitchMm)}</td>
          <td className={`${td} whitespace-nowrap`}>
            {f.reducedShankDiameterMm ? `reduced to ${formatQuantity(f.reducedShankDiameterMm, "length", units)}` : "full"}
          </td>
          <td className={td}>{f.materialName ?? "—"}</td>
          <td className={`${num} font-bold`}>{f.makerTorqueNm ? formatQuantity(f.makerTorqueNm, "torque", units) : "not recorded"}</td>
          <td className={td}>{f.makerLubricant || "not recorded"}</td>
          <td className={td}>{f.makerStages || "—"}</td>
          <td className={num}>{formatQuantity(f.makerStretchMm, "smallLength", units)}</td>
          <td className={num}>
            {f.threadFriction} / {f.bearingFriction}
          </td>
          <SourceCell row={f} />
        </tr>
      ))}
    </Table>
  );
}

function GasketTable({ rows, units }: { rows: GasketRow[]; units: UnitSystem }) {
  return (
    <Table
      caption="Gaskets: type, thickness, bore, seal band and seating figures"
      head={["Name", "Type", "Compressed", "Bore", "Seal Ø / ring width", "m", "y", "Finish window", "Source"]}
    >
      {rows.map((g) => (
        <tr key={g.id} className="border-t border-forge-100">
          <NameCell row={g} kind="gaskets" />
          <td className={td}>{GASKET_TYPE_LABELS[g.type]}</td>
          <td className={num}>{formatQuantity(g.compressedThicknessMm, "smallLength", units)}</td>
          <td className={num}>{formatQuantity(g.boreMm, "length", units)}</td>
          <td className={num}>
            {formatQuantity(g.sealDiameterMm, "length", units)} / {formatQuantity(g.ringWidthMm, "length", units)}
          </td>
          <td className={num}>{g.m}</td>
          <td className={num}>{formatQuantity(g.yMpa, "stress", units)}</td>
          <td className={num}>
            {g.finishMinRaUm != null || g.finishMaxRaUm != null
              ? `${formatQuantity(g.finishMinRaUm, "roughness", units, { withUnit: false })}–${formatQuantity(g.finishMaxRaUm, "roughness", units)}`
              : "—"}
          </td>
          <SourceCell row={g} />
        </tr>
      ))}
    </Table>
  );
}

function MaterialTable({ rows, units }: { rows: MaterialRow[]; units: UnitSystem }) {
  return (
    <Table
      caption="Materials: modulus, yield, expansion and limiting surface pressure"
      head={["Name", "Kind", "Modulus", "Yield", "Expansion", "Limiting surface pressure", "Source"]}
    >
      {rows.map((m) => (
        <tr key={m.id} className="border-t border-forge-100">
          <NameCell row={m} kind="materials" />
          <td className={td}>{MATERIAL_KIND_LABELS[m.kind]}</td>
          <td className={num}>{formatQuantity(m.modulusMpa, "modulus", units)}</td>
          <td className={num}>{formatQuantity(m.yieldMpa, "stress", units)}</td>
          <td className={num}>{formatQuantity(m.expansionUmPerMC, "expansion", units)}</td>
          <td className={num}>{formatQuantity(m.limitingSurfacePressureMpa, "stress", units)}</td>
          <SourceCell row={m} />
        </tr>
      ))}
    </Table>
  );
}
