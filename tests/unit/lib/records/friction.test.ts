import { describe, expect, it } from "vitest";
import { preloadFromTorque, threadGeometry, bearingDiameterMm, type TorqueGeometry } from "~/lib/clamp";
import { learnFriction, preloadShift, type FrictionObservation } from "~/lib/records/friction";

// ½-20 UNF stud with a 19 mm nut face on a 13.5 mm hole (figures of the demo's ½ stud class)
const thread = threadGeometry(12.7, 25.4 / 20, "unified");
const geometry: TorqueGeometry = {
  pitchMm: 25.4 / 20,
  pitchDiameterMm: thread.pitchDiameterMm,
  bearingDiameterMm: bearingDiameterMm(19, 13.5),
};

/** Assemblies tightened with friction μ (thread and face alike): the preload the stretch gauge would read. */
function assemblies(mu: number, torques: number[], noise: number[] = []): FrictionObservation[] {
  return torques.map((t, i) => ({
    torqueNm: t,
    observedPreloadN: preloadFromTorque(t, geometry, { thread: mu, bearing: mu }) * (1 + (noise[i] ?? 0)),
    geometry,
    diameterMm: 12.7,
  }));
}

describe("learned friction", () => {
  it("recovers the friction the assemblies were made with", () => {
    const r = learnFriction(assemblies(0.137, [100, 115, 130, 115]));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.friction).toBeCloseTo(0.137, 6);
    expect(r.frictionSpread).toBeLessThan(1e-9);
    expect(r.count).toBe(4);
    // the nut factor K = T/(F·d) of the same assemblies
    expect(r.nutFactor).toBeCloseTo((115 / (preloadFromTorque(115, geometry, { thread: 0.137, bearing: 0.137 }) * 12.7)) * 1000, 6);
  });

  it("gives a spread when the readings scatter, and the fit stays near the truth", () => {
    const r = learnFriction(assemblies(0.12, [115, 115, 115, 115, 115], [0.04, -0.03, 0.02, -0.04, 0.01]));
    if (!r.ok) throw new Error(r.reason);
    expect(r.friction).toBeGreaterThan(0.115);
    expect(r.friction).toBeLessThan(0.125);
    expect(r.frictionSpread).toBeGreaterThan(0.002);
    expect(r.frictionSpread).toBeLessThan(0.01);
  });

  it("refuses to learn from fewer than three assemblies", () => {
    const r = learnFriction(assemblies(0.13, [100, 110]));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.count).toBe(2);
    expect(r.reason).toMatch(/at least 3/);
  });

  it("refuses a fit no lubricant could give", () => {
    const obs = assemblies(0.13, [100, 110, 120]).map((o) => ({ ...o, observedPreloadN: o.observedPreloadN * 10 }));
    expect(learnFriction(obs).ok).toBe(false);
  });

  it("says how far the learned friction moves the preload at the maker's torque", () => {
    const s = preloadShift(115, geometry, { thread: 0.12, bearing: 0.12 }, 0.13, 12.7);
    expect(s.learnedN).toBeLessThan(s.handbookN);
    expect(s.change).toBeCloseTo(s.learnedN / s.handbookN - 1, 12);
    expect(s.change).toBeGreaterThan(-0.1);
    expect(s.change).toBeLessThan(-0.05);
  });
});
