// The washer-bearing limit: by hand, and its trend (a bigger or harder washer lets the head carry more).
import { describe, expect, it } from "vitest";
import { evaluatePlan, PlanInputSchema, prepare, torqueCeiling } from "../../../../app/lib/clamp";
import { HARDENED_WASHER_HV, MPA_PER_HV, washerBearing } from "../../../../app/lib/clamp/washer";
import { demoFourRaw } from "./fixtures";

const base = { washerOdMm: 24, washerHoleMm: 13.5, washerThicknessMm: 3, nutFaceOdMm: 19 };
const HEAD_MPA = 300;
const annulus = (od: number, id: number) => (Math.PI / 4) * (od * od - id * id);

describe("washerBearing", () => {
  it("a hardened washer spreads the load over its whole face: 300 MPa × π/4·(24² − 13.5²) = 92 775 N", () => {
    const b = washerBearing({ ...base, washerHardnessHv: 400 }, HEAD_MPA);
    expect(b.headBearingOdMm).toBe(24);
    expect(b.headCapacityN).toBeCloseTo(HEAD_MPA * annulus(24, 13.5), 6);
    expect(b.headCapacityN).toBeCloseTo(92_775, 0);
    expect(b.limitedBy).toBe("head");
  });
  it("a soft washer carries it within the 30° cone from the nut face: 19 + 2·3·tan 30° = 22.46 mm", () => {
    const b = washerBearing({ ...base, washerHardnessHv: 150 }, HEAD_MPA);
    expect(b.headBearingOdMm).toBeCloseTo(19 + 6 * Math.tan(Math.PI / 6), 9);
    expect(b.headBearingOdMm).toBeCloseTo(22.464, 3);
  });
  it("the nut face dents a very soft washer first: HV × 9.807 MPa over the nut face", () => {
    const b = washerBearing({ ...base, washerHardnessHv: 20 }, 2000);
    expect(b.washerCapacityN).toBeCloseTo(20 * MPA_PER_HV * annulus(19, 13.5), 6);
    expect(b.limitedBy).toBe("washer");
    expect(b.capacityN).toBe(b.washerCapacityN);
  });
  it("no recorded hardness reads as hardened (the records before hardness was kept)", () => {
    expect(washerBearing(base, HEAD_MPA)).toEqual({
      ...washerBearing({ ...base, washerHardnessHv: HARDENED_WASHER_HV }, HEAD_MPA),
      washerCapacityN: Infinity,
      capacityN: washerBearing(base, HEAD_MPA).headCapacityN,
    });
  });
  it("trend: a bigger washer, or a harder one, lets the head carry more preload", () => {
    const cap = (over: Partial<typeof base> & { washerHardnessHv?: number }) => washerBearing({ ...base, ...over }, HEAD_MPA).capacityN;
    expect(cap({ washerOdMm: 28, washerHardnessHv: 400 })).toBeGreaterThan(cap({ washerOdMm: 24, washerHardnessHv: 400 }));
    expect(cap({ washerHardnessHv: 400 })).toBeGreaterThan(cap({ washerHardnessHv: 200 }));
    expect(cap({ washerHardnessHv: 200 })).toBeGreaterThan(cap({ washerHardnessHv: 15 }));
  });
});

describe("the washer in the clamp model", () => {
  it("a soft washer lowers the bearing ceiling and raises the bearing utilization; a larger hardened washer lifts them", () => {
    const raw = demoFourRaw();
    const withWasher = (od: number, hv: number) =>
      PlanInputSchema.parse({ ...raw, fastener: { ...raw.fastener, washerOdMm: od, washerHardnessHv: hv } });
    const hard = withWasher(raw.fastener.washerOdMm, 400);
    const soft = withWasher(raw.fastener.washerOdMm, 150);
    const big = withWasher(raw.fastener.washerOdMm + 4, 400);
    const ceil = (p: ReturnType<typeof withWasher>) => torqueCeiling(prepare(p)).torques.bearing;
    expect(ceil(soft)).toBeLessThan(ceil(hard));
    expect(ceil(big)).toBeGreaterThan(ceil(hard));
    const util = (p: ReturnType<typeof withWasher>) => evaluatePlan(p).head.bearingUtilizationMax;
    expect(util(soft)).toBeGreaterThan(util(hard));
    expect(util(big)).toBeLessThan(util(hard));
  });
});
