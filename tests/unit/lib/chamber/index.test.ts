// The chamber's public API (app/lib/chamber/index.ts) names the same functions as its modules.
import { describe, expect, it } from "vitest";
import * as chamber from "../../../../app/lib/chamber";
import * as compression from "../../../../app/lib/chamber/compression";
import { estimatePeakPressure } from "../../../../app/lib/chamber/peak-pressure";

describe("chamber index", () => {
  it("re-exports the compression functions and the peak-pressure estimate, not copies", () => {
    expect(chamber.compressionRatio).toBe(compression.compressionRatio);
    expect(chamber.compressionRatioFromVolumes).toBe(compression.compressionRatioFromVolumes);
    expect(chamber.quenchMm).toBe(compression.quenchMm);
    expect(chamber.gasketThicknessWhatIf).toBe(compression.gasketThicknessWhatIf);
    expect(chamber.chamberProblems).toBe(compression.chamberProblems);
    expect(chamber.estimatePeakPressure).toBe(estimatePeakPressure);
  });
});
