import { describe, expect, it } from "vitest";
import {
  figuresFingerprint,
  figuresFollowStep,
  followFastener,
  lubricantWarning,
  makerPlanFigures,
  makerStagesNm,
  scaledWrenchStages,
  wrenchSetting,
  wrenchStages,
  type MakerFigures,
} from "../../../../app/lib/plan/fastener-figures";
import { fromDisplay, toDisplay } from "../../../../app/lib/units";
import { LBF_FT_TO_NM, relErr } from "../nist";

const HALF_INCH: MakerFigures = {
  id: 1,
  name: "½-20 test stud",
  makerTorqueNm: 115 * LBF_FT_TO_NM,
  makerLubricant: "Moly paste",
  makerStages: "40, 80, then 115 lbf·ft",
  makerStretchMm: 0.1778,
  threadFriction: 0.11,
  bearingFriction: 0.12,
};
const M12: MakerFigures = {
  id: 2,
  name: "M12 test stud",
  makerTorqueNm: 150,
  makerLubricant: "Engine oil",
  makerStages: "Three even steps to 150 N·m",
  makerStretchMm: null,
  threadFriction: 0.15,
  bearingFriction: 0.16,
};
const NO_MAKER_TORQUE: MakerFigures = {
  ...M12,
  id: 3,
  name: "Unrecorded stud",
  makerTorqueNm: null,
  makerStages: null,
  makerLubricant: "",
};

describe("wrench settings", () => {
  it("round to whole N·m, or whole lbf·ft", () => {
    expect(wrenchSetting(155.92, "metric")).toBe(156);
    expect(wrenchSetting(62.4, "metric")).toBe(62);
    expect(relErr(wrenchSetting(62.4, "imperial"), 46 * LBF_FT_TO_NM)).toBeLessThan(1e-6); // 62.4 N·m = 46.02 lbf·ft
  });
  it("default stages are 40 % and 70 % at wrench settings, ending at the torque itself", () => {
    expect(wrenchStages(155.92, "metric")).toEqual([62, 109, 155.92]);
    // 115 lbf·ft: 40 % is 46, 70 % is 80.5 → 81 lbf·ft
    const imperial = wrenchStages(fromDisplay("torque", 115, "lbf·ft"), "imperial").map((s) => toDisplay("torque", s, "lbf·ft"));
    expect(imperial.map((s) => Math.round(s * 1e6) / 1e6)).toEqual([46, 81, 115]);
  });
  it("scaled stages keep their proportions at wrench settings", () => {
    expect(scaledWrenchStages([50, 100, 150], 150, 180, "metric")).toEqual([60, 120, 180]);
    expect(scaledWrenchStages([], 150, 180, "metric")).toEqual([180]);
  });
});

describe("the maker's stage text", () => {
  it("reads a list with its unit", () => {
    const s = makerStagesNm(HALF_INCH.makerStages, HALF_INCH.makerTorqueNm!)!;
    expect(s.map((x) => x / LBF_FT_TO_NM).map(Math.round)).toEqual([40, 80, 115]);
    expect(s[2]).toBe(HALF_INCH.makerTorqueNm);
  });
  it("reads even steps in words", () => {
    expect(makerStagesNm("Three even steps to 150 N·m", 150)).toEqual([50, 100, 150]);
  });
  it("finds the unit from the maker's torque when the text has none", () => {
    expect(makerStagesNm("40, 90, 150", 150)).toEqual([40, 90, 150]);
  });
  it("gives up on text that does not end at the maker's torque or does not rise", () => {
    expect(makerStagesNm("40, 90, then 150 N·m", 200)).toBeNull();
    expect(makerStagesNm("90, 40, 150 N·m", 150)).toBeNull();
    expect(makerStagesNm("see the sheet", 150)).toBeNull();
  });
});

describe("following a new fastener", () => {
  const current = {
    fastenerId: "2",
    torque: "150",
    stages: "50, 100, 150",
    lubricant: "Engine oil",
    threadFriction: "0.15",
    bearingFriction: "0.16",
    targetStretch: "",
    figuresFastenerId: "2",
  };
  it("takes the new maker's torque, stages, lubricant, friction and stretch, in the person's units", () => {
    const metric = followFastener({ ...current, fastenerId: "1" }, HALF_INCH, "metric");
    expect(metric.values).toMatchObject({
      torque: "156",
      stages: "54, 108, 156",
      lubricant: "Moly paste",
      threadFriction: "0.11",
      bearingFriction: "0.12",
      targetStretch: "0.178",
      figuresFastenerId: "1",
    });
    expect(metric.note).toBe("Torque, stages and lubricant now follow the maker's figures for ½-20 test stud; change them if you mean to.");
    const imperial = followFastener({ ...current, fastenerId: "1" }, HALF_INCH, "imperial");
    expect(imperial.values).toMatchObject({ torque: "115", stages: "40, 80, 115", targetStretch: "7" });
  });
  it("keeps the torque when the new fastener has no maker's torque, and says so", () => {
    const r = followFastener({ ...current, fastenerId: "3" }, NO_MAKER_TORQUE, "metric");
    expect(r.values).toMatchObject({ torque: "150", stages: "50, 100, 150", lubricant: "Engine oil", threadFriction: "0.15" });
    expect(r.note).toMatch(/no maker's torque is recorded for it/);
  });
  it("without JavaScript: follows only when the fastener changed and the figures are the ones shown", () => {
    const shown = { ...current, figuresSeen: figuresFingerprint(current) };
    expect(figuresFollowStep(shown, [HALF_INCH, M12], "metric")).toBeNull(); // same fastener
    const changed = figuresFollowStep({ ...shown, fastenerId: "1" }, [HALF_INCH, M12], "metric");
    expect(changed?.values.torque).toBe("156");
    // the builder typed their own torque with the new fastener: their figures stand
    expect(figuresFollowStep({ ...shown, fastenerId: "1", torque: "140", stages: "60, 140" }, [HALF_INCH, M12], "metric")).toBeNull();
    // an old form without the marker fields posts as before
    expect(figuresFollowStep({ ...current, fastenerId: "1", figuresFastenerId: "" }, [HALF_INCH, M12], "metric")).toBeNull();
  });
});

describe("lubricant warning", () => {
  it("is silent for the maker's lubricant however it is spelt, and speaks for another", () => {
    expect(lubricantWarning("moly  PASTE.", HALF_INCH)).toBeNull();
    expect(lubricantWarning("Engine oil", HALF_INCH)).toMatch(
      /^This plan's lubricant \(“Engine oil”\) is not the maker's \(“Moly paste”\)/,
    );
    expect(lubricantWarning("", HALF_INCH)).toMatch(/names no lubricant/);
    expect(lubricantWarning("Anything", NO_MAKER_TORQUE)).toBeNull();
  });
});

describe("a new plan's figures with no plan to start from", () => {
  it("are the maker's at wrench settings, or 100 N·m in three stages", () => {
    expect(makerPlanFigures(M12, "metric")).toMatchObject({
      torqueNm: 150,
      stagesNm: [50, 100, 150],
      lubricant: "Engine oil",
      threadFriction: 0.15,
    });
    expect(makerPlanFigures(NO_MAKER_TORQUE, "metric")).toMatchObject({ torqueNm: 100, stagesNm: [40, 70, 100] });
  });
});

describe("stage scaling and the stage-tolerance check (oneway)", () => {
  it("scaled stages keep their proportions and land on wrench settings in the person's units", () => {
    // 1/3 and 2/3 of 200 N·m
    expect(scaledWrenchStages([50, 100, 150], 150, 200, "metric")).toEqual([
      wrenchSetting(200 / 3, "metric"),
      wrenchSetting(400 / 3, "metric"),
      200,
    ]);
    const imperial = scaledWrenchStages([60, 120, 180], 180, 240, "imperial");
    expect(imperial[imperial.length - 1]).toBe(240);
    expect(imperial).toHaveLength(3);
    expect(imperial[0]! / 240).toBeCloseTo(1 / 3, 1);
  });
  it("the maker's last stage must be within 2 % of the maker's torque", () => {
    expect(makerStagesNm("50, 100, 152 N·m", 150)).toEqual([50, 100, 150]);
    expect(makerStagesNm("50, 100, 154 N·m", 150)).toBeNull();
    expect(makerStagesNm("50, 100, 147 N·m", 150)).toEqual([50, 100, 150]);
    expect(makerStagesNm("50, 100, 146 N·m", 150)).toBeNull();
  });
});
