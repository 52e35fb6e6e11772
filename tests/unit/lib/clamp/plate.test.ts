// The head deck's bending under the seal ring: ringLoadPlateCompliance (Timoshenko & Woinowsky-Krieger,
// Theory of Plates and Shells, 2nd ed., clamped circular plate loaded along a concentric circle) against
// an independent numerical integration of the axisymmetric plate equation, written out here.
import { describe, expect, it } from "vitest";
import { ringLoadPlateCompliance } from "../../../../app/lib/clamp";
import { relErr } from "../nist";

/**
 * Deflection at the load circle r = b of a circular plate clamped at r = a under a total load P spread
 * along r = b, by integrating the axisymmetric plate equation in the slope φ = dw/dr:
 *   D·d/dr[(1/r)·d/dr(r·φ)] = V(r),  V = 0 inside the load circle, P/(2π·r) outside (the shear per unit
 *   length that carries P to the clamped edge), with φ(0) = 0 and φ(a) = 0, then w(b) = −∫_b^a φ dr
 *   (w(a) = 0, deflection counted positive in the direction of the load).
 * State u = r·φ, ψ = (1/r)·du/dr: u' = r·ψ, ψ' = V/D; u(0) = 0; ψ(0) unknown, fixed by u(a) = 0 (the ODE
 * is linear, so two shots find it). Classical RK4, the load circle a grid node.
 */
function integratedRingDeflection(E: number, t: number, a: number, b: number, P: number, nu = 0.3, steps = 2000): number {
  const D = (E * t ** 3) / (12 * (1 - nu * nu));
  const shoot = (psi0: number) => {
    let s = [0, psi0, 0]; // u, ψ, W = ∫_b^r φ dr
    const segment = (r0: number, r1: number, outside: boolean) => {
      const h = (r1 - r0) / steps;
      // inside the load circle there is no shear; outside V = P/(2πr); W only accumulates outside
      const f = (r: number, x: number[]) => [r * x[1], outside ? P / (2 * Math.PI * r * D) : 0, outside ? x[0] / r : 0];
      for (let i = 0; i < steps; i++) {
        const r = r0 + i * h;
        const k1 = f(r, s);
        const k2 = f(
          r + h / 2,
          s.map((x, j) => x + (h / 2) * k1[j]),
        );
        const k3 = f(
          r + h / 2,
          s.map((x, j) => x + (h / 2) * k2[j]),
        );
        const k4 = f(
          r + h,
          s.map((x, j) => x + h * k3[j]),
        );
        s = s.map((x, j) => x + (h / 6) * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j]));
      }
    };
    segment(0, b, false);
    segment(b, a, true);
    return { uAtEdge: s[0], W: s[2] };
  };
  const s0 = shoot(0);
  const s1 = shoot(1);
  const psi0 = -s0.uAtEdge / (s1.uAtEdge - s0.uAtEdge);
  return -shoot(psi0).W;
}

const plateD = (E: number, t: number, nu = 0.3) => (E * t ** 3) / (12 * (1 - nu * nu));

describe("ringLoadPlateCompliance (Timoshenko & Woinowsky-Krieger, clamped plate, ring load)", () => {
  // Cases: a fire deck of cast aluminium (E 72.4 GPa, docs/references.md §7) or cast iron (100 GPa), clamped at
  // the stud circle a, loaded at the seal band's radius b. Tolerance 1e-6: the integrands are smooth on
  // each side of the load circle and RK4 with 2000 steps is exact to ~1e-12 here; the formula must match it.
  it.each([
    { E: 72_400, t: 12, a: 66.2, b: 49.5 },
    { E: 72_400, t: 10.75, a: 59.5, b: 45.5 },
    { E: 100_000, t: 14, a: 70, b: 56 },
    { E: 72_400, t: 8, a: 50, b: 25 },
  ])("E $E, t $t, a $a, b $b: formula = numerical integration of the plate equation, ±1e-6", ({ E, t, a, b }) => {
    const numeric = integratedRingDeflection(E, t, a, b, 1);
    expect(numeric).toBeGreaterThan(0);
    expect(relErr(ringLoadPlateCompliance(E, t, a, b), numeric)).toBeLessThan(1e-6);
    // linear in the load: 10 kN deflects 10 000 times as far
    expect(relErr(integratedRingDeflection(E, t, a, b, 10_000), 10_000 * numeric)).toBeLessThan(1e-9);
  });

  it("b → 0 is the clamped plate under a centre load, w = P·a²/(16π·D) (Timoshenko, from memory), ±1e-5", () => {
    const E = 72_400;
    const t = 12;
    const a = 60;
    const centre = (a * a) / (16 * Math.PI * plateD(E, t));
    expect(relErr(ringLoadPlateCompliance(E, t, a, 1e-3), centre)).toBeLessThan(1e-5);
    // the integration gives the same centre-load limit, so the two agree on the limit independently
    expect(relErr(integratedRingDeflection(E, t, a, 1e-3, 1), centre)).toBeLessThan(1e-5);
  });

  it("b → a: a load on the clamped edge does not bend the plate (→ 0), and b ≥ a or b ≤ 0 give exactly 0", () => {
    const E = 72_400;
    const t = 12;
    const a = 60;
    const centre = (a * a) / (16 * Math.PI * plateD(E, t));
    // w(b) falls like (a − b)³ near the edge: at a − b = 0.06 mm (0.1 % of a) it is under 1e-8 of the centre value
    expect(ringLoadPlateCompliance(E, t, a, a * 0.999)).toBeLessThan(1e-8 * centre);
    expect(ringLoadPlateCompliance(E, t, a, a * 0.999)).toBeGreaterThan(0);
    expect(ringLoadPlateCompliance(E, t, a, a)).toBe(0);
    expect(ringLoadPlateCompliance(E, t, a, a + 5)).toBe(0);
    expect(ringLoadPlateCompliance(E, t, a, 0)).toBe(0);
  });

  it("falls steadily as the load circle moves out toward the clamp, and scales as 1/(E·t³)", () => {
    let prev = Infinity;
    for (let b = 5; b < 60; b += 5) {
      const w = ringLoadPlateCompliance(72_400, 12, 60, b);
      expect(w).toBeLessThan(prev);
      prev = w;
    }
    const base = ringLoadPlateCompliance(72_400, 12, 60, 45);
    expect(relErr(ringLoadPlateCompliance(2 * 72_400, 12, 60, 45), base / 2)).toBeLessThan(1e-12);
    expect(relErr(ringLoadPlateCompliance(72_400, 24, 60, 45), base / 8)).toBeLessThan(1e-12);
  });
});
