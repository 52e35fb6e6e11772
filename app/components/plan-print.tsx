import { METHOD_LABEL, WIRE_LABEL, type PlanWrite } from "~/lib/plan/form-fields";
import { unitFor, type UnitSystem } from "~/lib/units";

interface Props {
  values: Record<string, string>;
  gasketName: string;
  fastenerName: string;
  sleeved: boolean;
  units: UnitSystem;
}

// On paper the form's controls would fill a page: the plan's inputs print as a compact table instead
// (hidden on screen, where the form shows them).
export function PlanPrintSheet({ values, gasketName, fastenerName, sleeved, units }: Props) {
  const small = unitFor("smallLength", units);
  const torque = unitFor("torque", units);
  const method = METHOD_LABEL[values.method as PlanWrite["method"]] ?? values.method;
  const rows: [string, string][] = [
    ["Gasket", gasketName],
    ["Wire ring", WIRE_LABEL[values.wireLocation as PlanWrite["wireLocation"]] ?? values.wireLocation ?? ""],
    [`Wire projection (${small})`, values.wireProjection ?? ""],
    [`Receiver groove depth (${small})`, values.receiverGrooveDepth ?? ""],
    ...(sleeved ? ([[`Sleeve protrusion (${small})`, values.sleeveProtrusion || "engine's figure"]] as [string, string][]) : []),
    ["Fastener", fastenerName],
    ["Lubricant", values.lubricant ?? ""],
    ["Thread / washer-face friction", `${values.threadFriction ?? ""} / ${values.bearingFriction ?? ""}`],
    ["How the studs are tightened", method ?? ""],
    ...(values.method === "stretch-measured" ? ([[`Target stretch (${small})`, values.targetStretch ?? ""]] as [string, string][]) : []),
    [`Final torque (${torque})`, values.torque ?? ""],
    [`Stages (${torque})`, values.stages ?? ""],
    ["Target seal margin", values.targetMargin ?? ""],
  ];
  return (
    <div className="hidden print:block" data-testid="plan-print-sheet">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="mb-1 text-left font-bold">Plan inputs</caption>
        <tbody>
          {rows.map(([label, value]) => (
            <tr key={label} className="border-t border-forge-300">
              <th scope="row" className="w-1/2 py-0.5 pr-2 font-medium">
                {label}
              </th>
              <td className="py-0.5 tabular">{value}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {values.notes ? <p className="mt-1 text-sm">Notes: {values.notes}</p> : null}
    </div>
  );
}
