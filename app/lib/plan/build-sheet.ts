// The build sheet's key lines as [label, text] pairs in the reader's units: the e-mail's summary and
// the top of the printed sheet read the same. Pure: takes the figures, returns words.
import { GASKET_TYPE_LABELS } from "../library/labels";
import { formatQuantity, type UnitSystem } from "../units";
import type { EstimateView } from "./estimate-view";
import { METHOD_LABEL, type PlanWrite } from "./form-fields";

export interface SheetFacts {
  gasket: { name: string; type: keyof typeof GASKET_TYPE_LABELS };
  fastener: { name: string; makerTorqueNm: number | null; makerLubricant: string | null; makerStages: string | null };
  plan: { torqueNm: number; stagesNm: number[]; lubricant: string; method: PlanWrite["method"] };
  view: EstimateView;
  compressionRatio: number | null;
}

const STATUS_WORD = { holds: "Holds", thin: "Thin", short: "Short" } as const;

/** Torque stages as "40 → 80 → 125 lbf·ft". */
export function stagesText(stagesNm: number[], finalNm: number, units: UnitSystem): string {
  const all = stagesNm.length > 0 && stagesNm[stagesNm.length - 1] === finalNm ? stagesNm : [...stagesNm, finalNm];
  return all.map((nm) => formatQuantity(nm, "torque", units)).join(" → ");
}

export function verdictText(view: EstimateView): string {
  const v = view.estimate.verdict;
  return `${STATUS_WORD[v.status]}: ${v.headline}`;
}

export function sheetSummary(f: SheetFacts, units: UnitSystem): [string, string][] {
  const e = f.view.estimate;
  const torque = (nm: number) => formatQuantity(nm, "torque", units);
  const rows: [string, string][] = [
    ["Gasket", `${f.gasket.name} (${GASKET_TYPE_LABELS[f.gasket.type]})`],
    ["Fastener", f.fastener.name],
    [
      "Maker's torque",
      f.fastener.makerTorqueNm === null
        ? "not recorded: ask the fastener maker"
        : `${torque(f.fastener.makerTorqueNm)}${f.fastener.makerStages ? ` (stages: ${f.fastener.makerStages})` : ""}`,
    ],
    ["Maker's lubricant", f.fastener.makerLubricant || "not recorded"],
    [
      "This plan",
      `${METHOD_LABEL[f.plan.method]}, ${stagesText(f.plan.stagesNm, f.plan.torqueNm, units)}${f.plan.lubricant ? `, on ${f.plan.lubricant}` : ""}`,
    ],
    ["Weakest seal margin", `${e.weakestMargin.toFixed(2)} on cylinder ${e.weakestCylinder} (target ${f.view.targetMargin.toFixed(2)})`],
    ["Clamp per cylinder", e.cylinders.map((c) => `${c.cylinder}: ${formatQuantity(c.clampN, "force", units)}`).join(", ")],
    [
      "Squeeze point",
      e.squeeze.mostlySqueezing
        ? "at this torque more torque already mostly squeezes the head"
        : f.view.headSqueezeOnsetNm !== null
          ? `past ${torque(f.view.headSqueezeOnsetNm)} more torque mostly squeezes the head`
          : "not reached in the torques we tried",
    ],
  ];
  if (f.compressionRatio !== null) rows.push(["Compression ratio", `${f.compressionRatio.toFixed(2)} : 1`]);
  return rows;
}
