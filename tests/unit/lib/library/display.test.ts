import { describe, expect, it } from "vitest";
import { sourceLine, threadLabel } from "../../../../app/lib/library/display";

describe("threadLabel", () => {
  it("metric: diameter and pitch to two decimals, trailing zeros dropped", () => {
    expect(threadLabel("metric", 12, 1.5)).toBe("M12×1.5");
    expect(threadLabel("metric", 11.004, 1.254)).toBe("M11×1.25");
    expect(threadLabel("metric", 10.996, 1.246)).toBe("M11×1.25");
  });
  it("unified: the diameter rounds to the nearest 64th and reduces; threads per inch to one decimal", () => {
    expect(threadLabel("unified", 12.7, 25.4 / 20)).toBe("1/2-20 UN");
    expect(threadLabel("unified", 11.1125, 25.4 / 20)).toBe("7/16-20 UN");
    // 11.0 mm is 27.7 64ths: rounds up to 28/64 = 7/16, not down to 27/64
    expect(threadLabel("unified", 11.0, 25.4 / 20)).toBe("7/16-20 UN");
    expect(threadLabel("unified", 14.2875, 25.4 / 13)).toBe("9/16-13 UN");
    expect(threadLabel("unified", 25.4 * 1.125, 25.4 / 12)).toBe("1 1/8-12 UN");
    expect(threadLabel("unified", 25.4, 25.4 / 8)).toBe("1-8 UN");
    expect(threadLabel("unified", 12.7, 25.4 / 20.04)).toBe("1/2-20 UN");
  });
});

describe("sourceLine", () => {
  it("names the handbook source, the editor, or the person who entered the row", () => {
    expect(sourceLine({ source: "Handbook table", enteredById: null, enteredByName: null })).toBe("Handbook table");
    expect(sourceLine({ source: "Handbook table", enteredById: 3, enteredByName: "Demo Builder" })).toBe(
      "Handbook table · edited by Demo Builder",
    );
    expect(sourceLine({ source: null, enteredById: 3, enteredByName: null })).toBe("entered by a former member");
  });
});
