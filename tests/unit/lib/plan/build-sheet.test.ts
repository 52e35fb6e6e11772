import { describe, expect, it } from "vitest";
import { evaluatePlan } from "~/lib/clamp";
import { sheetSummary, stagesText, verdictText } from "~/lib/plan/build-sheet";
import { estimateView } from "~/lib/plan/estimate-view";
import { workedExample } from "../clamp/fixtures";

describe("stagesText", () => {
  it("lists the stages ending at the final torque, in the reader's units", () => {
    expect(stagesText([60, 110, 150], 150, "metric")).toBe("60 N·m → 110 N·m → 150 N·m");
    // a final torque beyond the last stage is added; 1 lbf·ft = 1.3558 N·m
    expect(stagesText([61], 169.5, "imperial")).toBe("45 lbf·ft → 125 lbf·ft");
  });
});

describe("sheetSummary", () => {
  const input = workedExample();
  const view = estimateView(input);
  const facts = {
    gasket: { name: "Test MLS", type: "mls" as const },
    fastener: { name: "Test stud", makerTorqueNm: null, makerLubricant: null, makerStages: null },
    plan: { torqueNm: view.torqueNm, stagesNm: [view.torqueNm / 2], lubricant: "", method: "torque-estimated-friction" as const },
    view,
    compressionRatio: 9.254,
  };

  it("says the model's verdict and figures, one row per line of the mail", () => {
    const rows = Object.fromEntries(sheetSummary(facts, "metric"));
    const e = evaluatePlan(input);
    expect(verdictText(view)).toContain(e.verdict.headline);
    expect(rows["Weakest seal margin"]).toBe(
      `${e.weakestMargin.toFixed(2)} on cylinder ${e.weakestCylinder} (target ${view.targetMargin.toFixed(2)})`,
    );
    expect(rows["Clamp per cylinder"]!.split(", ")).toHaveLength(e.cylinders.length);
    expect(rows["Maker's torque"]).toBe("not recorded: ask the fastener maker");
    expect(rows["Compression ratio"]).toBe("9.25 : 1");
    expect(rows["Gasket"]).toBe("Test MLS (Multilayer steel)");
  });

  it("leaves the compression ratio out when the chamber is not known", () => {
    expect(sheetSummary({ ...facts, compressionRatio: null }, "metric").map(([k]) => k)).not.toContain("Compression ratio");
  });
});
