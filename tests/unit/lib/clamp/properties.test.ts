// Property tests (fast-check, 1,000 runs each).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  evaluatePlan,
  preloadFromTorque,
  splitClamp,
  suggest,
  torqueSweep,
  uncertainty,
} from "../../../../app/lib/clamp";
import { allFinite, plan } from "./arbitraries";

const RUNS = { numRuns: 1000 };
const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const geometry = fc.record({ pitchMm: dbl(0.3, 4), pitchDiameterMm: dbl(5, 40), bearingDiameterMm: dbl(8, 60) });

describe("properties", () => {
  it("preload rises with torque (ISO 16047 long form)", () => {
    fc.assert(
      fc.property(geometry, dbl(0.02, 0.6), dbl(0.02, 0.6), dbl(1, 1000), dbl(1.001, 3), (g, mg, mk, T, f) => {
        const mu = { thread: mg, bearing: mk };
        expect(preloadFromTorque(T * f, g, mu)).toBeGreaterThan(preloadFromTorque(T, g, mu));
      }),
      RUNS,
    );
  });

  it("preload falls as either friction rises", () => {
    fc.assert(
      fc.property(geometry, dbl(0.02, 0.5), dbl(0.02, 0.5), dbl(0.001, 0.1), dbl(1, 1000), (g, mg, mk, dm, T) => {
        const base = preloadFromTorque(T, g, { thread: mg, bearing: mk });
        expect(preloadFromTorque(T, g, { thread: mg + dm, bearing: mk })).toBeLessThan(base);
        expect(preloadFromTorque(T, g, { thread: mg, bearing: mk + dm })).toBeLessThan(base);
      }),
      RUNS,
    );
  });

  it("seal-line share rises with protrusion; with the gap wide enough the line carries all of it", () => {
    fc.assert(
      fc.property(dbl(1e5, 1e8), dbl(1e5, 1e9), dbl(1e3, 1e6), dbl(1e3, 1e7), dbl(-0.2, 0.5), dbl(0, 0.3), (kr, kb, F, lim, g, dg) => {
        const a = splitClamp(F, { lineNPerMm: kr, bodyNPerMm: kb, gapMm: g, lineLimitN: lim });
        const b = splitClamp(F, { lineNPerMm: kr, bodyNPerMm: kb, gapMm: g + dg, lineLimitN: lim });
        expect(b.lineN).toBeGreaterThanOrEqual(a.lineN - 1e-9 * F);
        expect(a.lineN + a.bodyN).toBeCloseTo(F, 6);
        // body does not touch while F ≤ k_r·g: the seal line takes all (up to its flow limit)
        if (F <= kr * (g + dg)) expect(b.lineN).toBeCloseTo(Math.min(F, lim), 6);
        // once the body touches and the line is elastic, more gap strictly moves load onto the line
        if (dg > 1e-4 && g >= 0 && F > kr * (g + dg) && b.lineN < lim && !b.lineYielded) expect(b.lineN).toBeGreaterThan(a.lineN);
      }),
      RUNS,
    );
  });

  it("clamp is conserved: Σ over cylinders (seal line + body) = Σ over studs of preload", () => {
    fc.assert(
      fc.property(plan, (p) => {
        const e = evaluatePlan(p);
        const studs = e.studs.reduce((s, x) => s + x.preloadN, 0);
        const bores = e.cylinders.reduce((s, c) => s + c.sealLineN + c.bodyN, 0);
        expect(Math.abs(bores - studs) / studs).toBeLessThan(1e-9);
        for (const c of e.cylinders) expect(Math.abs(c.sealLineN + c.bodyN - c.clampN)).toBeLessThanOrEqual(1e-9 * c.clampN);
        // and the firing load all goes back to the studs: Σ per-stud P = cylinders × H
        const P = e.studs.reduce((s, x) => s + x.externalN, 0);
        expect(P / (e.cylinders.length * e.seal.asme.pressureForceN)).toBeCloseTo(1, 9);
      }),
      RUNS,
    );
  });

  it("sweeps are monotone where physics says so", () => {
    fc.assert(
      fc.property(plan, dbl(0, 200), dbl(10, 600), (p, from, span) => {
        const s = torqueSweep(p, { fromNm: from, toNm: from + span, points: 12 });
        const e = evaluatePlan(p);
        const hp = e.seal.asme.operatingContactN;
        // A relaxation allowance is a loss proportional to preload: with the seal line at its flow limit,
        // more torque also relaxes more, so the remaining load may fall by at most relax·Δclamp (ours).
        const relax = p.gasket.relaxationPercent / 100;
        for (let i = 1; i < s.points.length; i++) {
          const a = s.points[i - 1];
          const b = s.points[i];
          expect(b.preloadN).toBeGreaterThan(a.preloadN);
          expect(b.preloadMaxN).toBeGreaterThan(a.preloadMaxN);
          expect(b.studUtilizationMax).toBeGreaterThan(a.studUtilizationMax);
          expect(b.bearingPressureMaxMpa).toBeGreaterThan(a.bearingPressureMaxMpa);
          expect(b.headCompressionMm).toBeGreaterThan(a.headCompressionMm);
          let maxStep = 0;
          for (let c = 0; c < b.clampN.length; c++) {
            expect(b.clampN[c]).toBeGreaterThan(a.clampN[c]);
            const step = b.clampN[c] - a.clampN[c];
            maxStep = Math.max(maxStep, step);
            const tol = (x: number) => 1e-9 * (x + a.clampN[c] + 1);
            // more clamp never takes load off the seal line at assembly
            expect(b.sealLineN[c]).toBeGreaterThanOrEqual(a.sealLineN[c] - tol(a.sealLineN[c]));
            // nor under firing, hot and settled (up to the relaxation of the extra preload)
            expect(b.remainingSealLineN[c]).toBeGreaterThanOrEqual(a.remainingSealLineN[c] - relax * step - tol(a.remainingSealLineN[c]));
          }
          expect(b.weakestMargin).toBeGreaterThanOrEqual(a.weakestMargin - (relax * maxStep) / hp - 1e-9 * (1 + a.weakestMargin));
        }
      }),
      RUNS,
    );
  });

  it("each bore's marginal seal-line share only falls with torque while the line stands proud (g ≥ 0)", () => {
    // DESIGN.md: 1 before the body touches, k_r/(k_r + k_b) after, 0 once the line flows. A recessed
    // line (g < 0) starts at 0 and rises when the body has closed the gap, so it is left out here.
    fc.assert(
      fc.property(plan, dbl(1, 400), dbl(1.001, 3), (p, T, f) => {
        const at = (t: number) => evaluatePlan({ ...p, tightening: { ...p.tightening, target: { mode: "torque", torqueNm: t } } });
        const a = at(T);
        const b = at(T * f);
        if (a.seal.gapMm < 0) return;
        for (let c = 0; c < a.cylinders.length; c++) {
          expect(b.cylinders[c].marginalSealLineShare).toBeLessThanOrEqual(a.cylinders[c].marginalSealLineShare + 1e-12);
          if (a.cylinders[c].sealLineYielded) expect(b.cylinders[c].sealLineYielded).toBe(true);
        }
      }),
      RUNS,
    );
  });

  it("without a relaxation allowance the weakest margin never falls as torque rises", () => {
    fc.assert(
      fc.property(plan, dbl(0, 200), dbl(10, 600), (p0, from, span) => {
        const p = { ...p0, gasket: { ...p0.gasket, relaxationPercent: 0 } };
        const s = torqueSweep(p, { fromNm: from, toNm: from + span, points: 12 });
        for (let i = 1; i < s.points.length; i++) {
          const a = s.points[i - 1];
          const b = s.points[i];
          expect(b.weakestMargin).toBeGreaterThanOrEqual(a.weakestMargin - 1e-9 * (1 + a.weakestMargin));
          for (let c = 0; c < b.clampN.length; c++)
            expect(b.remainingSealLineN[c]).toBeGreaterThanOrEqual(a.remainingSealLineN[c] - 1e-9 * (a.remainingSealLineN[c] + a.clampN[c] + 1));
        }
      }),
      RUNS,
    );
  });

  it("no NaN or Infinity anywhere for any accepted input", () => {
    fc.assert(
      fc.property(plan, fc.integer({ min: 0, max: 2 ** 31 - 1 }), (p, seed) => {
        expect(allFinite(evaluatePlan(p))).toBeNull();
        expect(allFinite(torqueSweep(p, { fromNm: 0, toNm: 400, points: 5 }))).toBeNull();
        expect(allFinite(uncertainty(p, { samples: 20, seed }))).toBeNull();
      }),
      RUNS,
    );
  });

  it("suggest's torque, when there is one, reaches the target and stays within the limit", () => {
    fc.assert(
      fc.property(plan, dbl(0.5, 3), (p, target) => {
        const r = suggest(p, { targetMargin: target });
        expect(allFinite(r)).toBeNull();
        if (r.reachable) {
          const T = r.torqueNm as number;
          expect(T).toBeLessThanOrEqual(r.limit.torqueNm * (1 + 1e-12));
          const at = evaluatePlan({ ...p, tightening: { ...p.tightening, target: { mode: "torque", torqueNm: T } } });
          expect(at.weakestMargin).toBeGreaterThanOrEqual(target * (1 - 1e-9));
        } else {
          expect(r.changes.length).toBeGreaterThan(0);
          expect(r.marginAtLimit).toBeLessThan(target);
        }
      }),
      { numRuns: 200 },
    );
  });
});
