// The bore's load paths (ours, docs/clamp-model.md §6: seal line and body as two springs with a gap, paths that
// yield, MLS as a bead spring with a stopper): hand cases worked out in the comments, then the same
// behaviour on the plans.
import { describe, expect, it } from "vitest";
import { loadBore, moveBore, PlanInputSchema, prepare, type BorePaths } from "../../../../app/lib/clamp";
import { boreSeal } from "../../../../app/lib/clamp/cylinders";
import { demoSixRaw } from "./fixtures";

const ringAndBody = (limitN = 1e9): BorePaths => ({
  elements: [
    { kind: "ring", seal: true, kNPerMm: 1e7, engageMm: 0, limitN },
    { kind: "body", seal: false, kNPerMm: 1e7, engageMm: 0.01, limitN: Infinity },
  ],
});

describe("ring and body with a gap (ours)", () => {
  it("k_r = k_b = 1e7 N/mm, gap 0.01 mm: the body touches at 100 kN; 150 kN puts 125 kN on the line", () => {
    const paths = ringAndBody();
    // F ≤ k_r·g = 100 kN: the line takes it all
    const a = loadBore(paths, 80_000);
    expect(a.lineN).toBeCloseTo(80_000, 6);
    expect(a.bodyN).toBe(0);
    expect(a.marginalShare).toBe(1);
    // F = 150 kN: closure c from 1e7·c + 1e7·(c − 0.01) = 150 000 → c = 0.0125; line 125 kN, body 25 kN
    const b = loadBore(paths, 150_000);
    expect(b.closureMm).toBeCloseTo(0.0125, 12);
    expect(b.lineN).toBeCloseTo(125_000, 6);
    expect(b.bodyN).toBeCloseTo(25_000, 6);
    expect(b.marginalShare).toBeCloseTo(0.5, 12);
  });
  it("unloading (firing): off both paths while both touch, off the line alone once the body lifts", () => {
    const paths = ringAndBody();
    const b = loadBore(paths, 150_000);
    // 40 kN off: both still touch, half from each → line 105 kN
    expect(moveBore(paths, b, 110_000).lineN).toBeCloseTo(105_000, 6);
    // 120 kN off: the body's 25 kN goes with the first 50 kN, then the line alone: 30 kN left, all on the line
    const c = moveBore(paths, b, 30_000);
    expect(c.lineN).toBeCloseTo(30_000, 6);
    expect(c.bodyN).toBe(0);
    // the head lifts at the seal line by the closure change: 0.0125 − 0.003 = 0.0095 mm
    expect(b.closureMm - c.closureMm).toBeCloseTo(0.0095, 12);
  });
  it("the line stops at its limit (indentation) and keeps a permanent set when unloaded", () => {
    const paths = ringAndBody(110_000);
    // at 150 kN the line flows at 110 kN: body 40 kN = 1e7·(c − 0.01) → c = 0.014; set = 0.014 − 110 000/1e7 = 0.003 mm
    const a = loadBore(paths, 150_000);
    expect(a.lineN).toBeCloseTo(110_000, 6);
    expect(a.bodyN).toBeCloseTo(40_000, 6);
    expect(a.lineAtLimit).toBe(true);
    expect(a.marginalShare).toBe(0);
    expect(a.set[0]).toBeCloseTo(0.003, 12);
    // back to 100 kN with the set kept: 1e7·(c − 0.003) + 1e7·(c − 0.01) = 100 000 → c = 0.0115; line 85 kN, body 15 kN
    const b = moveBore(paths, a, 100_000);
    expect(b.lineN).toBeCloseTo(85_000, 6);
    expect(b.bodyN).toBeCloseTo(15_000, 6);
    expect(b.lineAtLimit).toBe(false);
    // a fresh bore at 100 kN has it all on the line (no set): the history matters
    expect(loadBore(paths, 100_000).lineN).toBeCloseTo(100_000, 6);
  });
  it("a recessed line (negative gap) waits for the body to close it", () => {
    const paths: BorePaths = {
      elements: [
        { kind: "ring", seal: true, kNPerMm: 1e7, engageMm: 0.01, limitN: Infinity },
        { kind: "body", seal: false, kNPerMm: 1e7, engageMm: 0, limitN: Infinity },
      ],
    };
    expect(loadBore(paths, 80_000).lineN).toBe(0);
    // 150 kN: c = 0.0125 → line 25 kN
    expect(loadBore(paths, 150_000).lineN).toBeCloseTo(25_000, 6);
  });
});

describe("MLS: a bead spring, then the stopper (ours)", () => {
  // bead 1e5 N/mm from first contact, stopper 2e6 N/mm and the body 5e6 N/mm both from 0.15 mm (the bead's travel)
  const mls = (travel = 0.15): BorePaths => ({
    elements: [
      { kind: "bead", seal: true, kNPerMm: 1e5, engageMm: 0, limitN: Infinity },
      { kind: "stopper", seal: true, kNPerMm: 2e6, engageMm: travel, limitN: 3e5 },
      { kind: "body", seal: false, kNPerMm: 5e6, engageMm: travel, limitN: Infinity },
    ],
  });
  it("before the stopper engages, the line load is the bead stiffness × closure", () => {
    const a = loadBore(mls(), 10_000);
    expect(a.closureMm).toBeCloseTo(0.1, 12);
    expect(a.lineN).toBeCloseTo(1e5 * a.closureMm, 6);
    expect(a.bodyN).toBe(0);
  });
  it("past the stopper the rest splits by stiffness: 50 kN → closure 0.154930, line 25 352 N, body 24 648 N", () => {
    // 1e5·c + 2e6·(c − 0.15) + 5e6·(c − 0.15) = 50 000 → c = (50 000 + 1.05e6)/7.1e6 = 0.1549296
    const a = loadBore(mls(), 50_000);
    expect(a.closureMm).toBeCloseTo(0.1549296, 7);
    expect(a.lineN).toBeCloseTo(1e5 * 0.1549296 + 2e6 * 0.0049296, 0);
    expect(a.bodyN).toBeCloseTo(5e6 * 0.0049296, 0);
  });
  it("under firing the head lift takes load off the bead", () => {
    const a = loadBore(mls(), 50_000);
    const fired = moveBore(mls(), a, 10_000);
    // back below the stopper: all on the bead, at the closure it has left
    expect(fired.closureMm).toBeCloseTo(0.1, 9);
    expect(fired.lineN).toBeCloseTo(1e5 * fired.closureMm, 6);
    const beadBefore = 1e5 * a.closureMm;
    expect(fired.lineN).toBeLessThan(beadBefore);
    expect(beadBefore - fired.lineN).toBeCloseTo(1e5 * (a.closureMm - fired.closureMm), 6);
  });
  it("a longer bead travel delays the stopper: it engages at bead stiffness × travel", () => {
    for (const travel of [0.1, 0.15, 0.3]) {
      const onset = 1e5 * travel;
      expect(loadBore(mls(travel), onset * 0.999).closureMm).toBeLessThan(travel);
      expect(loadBore(mls(travel), onset * 0.999).marginalShare).toBe(1);
      expect(loadBore(mls(travel), onset * 1.001).closureMm).toBeGreaterThan(travel);
    }
    // at 20 kN the 0.15 mm bead has reached its stopper, the 0.3 mm bead has not
    expect(loadBore(mls(0.15), 20_000).bodyN).toBeGreaterThan(0);
    expect(loadBore(mls(0.3), 20_000).bodyN).toBe(0);
  });

  it("the demo six's MLS (typical bead figures): bead, then stopper and body, from the gasket's own travel", () => {
    const plan = PlanInputSchema.parse(demoSixRaw());
    const p = prepare(plan);
    expect(p.paths.elements.map((e) => e.kind)).toEqual(["bead", "stopper", "body"]);
    const [bead, stopper, body] = p.paths.elements;
    // typical family figures (gasket-families.ts, our assumptions): 0.15 mm travel, 80 N/mm of circumference at the stopper
    expect(stopper.engageMm).toBeCloseTo(0.15, 12);
    expect(body.engageMm).toBeCloseTo(0.15, 12);
    // the bead alone: 80·π·91/0.15 = 152 473 N/mm, in series with the deck and faces, so a little softer
    expect(bead.kNPerMm).toBeLessThan((80 * Math.PI * 91) / 0.15);
    expect(bead.kNPerMm).toBeGreaterThan(0.8 * ((80 * Math.PI * 91) / 0.15));
    const onset = bead.kNPerMm * 0.15;
    const s = loadBore(p.paths, 0.5 * onset);
    expect(s.lineN).toBeCloseTo(bead.kNPerMm * s.closureMm, 6);
    expect(s.bodyN).toBe(0);
    // a longer travel (bead load at the stopper kept) delays the stopper: the clamp at which it engages rises
    const longer = prepare({ ...plan, gasket: { ...plan.gasket, beadTravelMm: 0.3 } });
    expect(longer.paths.elements[1].engageMm).toBeCloseTo(0.3, 12);
    expect(longer.paths.elements[0].kNPerMm * 0.3).toBeGreaterThan(onset);
    // fired at a low peak pressure (1 MPa: relief (1 − Φn)·π/4·91²·1 ≈ 5 kN, under the bore's clamp): the head
    // lifts, and below the stopper the bead loses lift × its stiffness
    const q = prepare({ ...plan, firing: { mode: "entered", peakPressureMpa: 1 } });
    expect(q.reliefPerBoreN).toBeLessThan(0.5 * onset);
    const light = boreSeal(q, 0.5 * onset, 0.5 * onset);
    expect(light.liftMm).toBeGreaterThan(0);
    expect(light.fired.lineN).toBeCloseTo(bead.kNPerMm * (light.hot.closureMm - light.liftMm), 6);
    expect(light.fired.lineN).toBeLessThan(light.hot.lineN);
    expect(light.fired.lineN).toBeCloseTo(0.5 * onset - q.reliefPerBoreN, 6);
  });
});
