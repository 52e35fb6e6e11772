// Words and icons for the engine record's choices (app/lib/engine/labels.ts).
import { describe, expect, it } from "vitest";
import { layoutName, PEAK_SOURCE_LABEL, SLEEVE_LABEL, STATUS_LABEL } from "../../../../app/lib/engine/labels";
import { ENGINE_STATUSES } from "../../../../app/lib/engine/status";

describe("engine labels", () => {
  it("every status has a word and its own icon, so status never rests on colour alone", () => {
    expect(Object.keys(STATUS_LABEL)).toEqual([...ENGINE_STATUSES]);
    expect(STATUS_LABEL["in-build"]).toEqual({ word: "In build", icon: "⚙" });
    expect(new Set(Object.values(STATUS_LABEL).map((s) => s.icon)).size).toBe(ENGINE_STATUSES.length);
  });
  it("sleeves and the peak pressure's source read as a builder says them", () => {
    expect(SLEEVE_LABEL.none).toBe("No sleeves (parent bore)");
    expect(SLEEVE_LABEL["wet-mid"]).toBe("Wet sleeves, mid support");
    expect(PEAK_SOURCE_LABEL).toEqual({ measured: "measured", estimated: "estimate" });
  });
  it("layoutName: I4, I6, V8", () => {
    expect(layoutName("inline", 4)).toBe("I4");
    expect(layoutName("inline", 6)).toBe("I6");
    expect(layoutName("V", 8)).toBe("V8");
  });
});
