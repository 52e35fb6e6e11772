import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { fromDisplay, toDisplay, type DisplayUnit, type Quantity } from "~/lib/units";

// Our display conversions (built on convert-units) against a second, independent reference library
// from the registry: mathjs's unit system. Relative agreement within 1e-6.
const CASES: { quantity: Quantity; si: number; unit: DisplayUnit; mathjs: [string, string] }[] = [
  { quantity: "length", si: 25.4, unit: "in", mathjs: ["mm", "inch"] },
  { quantity: "smallLength", si: 0.1016, unit: "thou", mathjs: ["mm", "mil"] },
  { quantity: "force", si: 4448.2216, unit: "lbf", mathjs: ["N", "lbf"] },
  { quantity: "force", si: 90_100, unit: "kN", mathjs: ["N", "kN"] },
  { quantity: "torque", si: 162.698, unit: "lbf·ft", mathjs: ["N m", "lbf ft"] },
  { quantity: "pressure", si: 18.9, unit: "psi", mathjs: ["MPa", "psi"] },
  { quantity: "pressure", si: 18.9, unit: "bar", mathjs: ["MPa", "bar"] },
  { quantity: "stress", si: 1379, unit: "psi", mathjs: ["MPa", "psi"] },
];

describe("display units agree with mathjs", () => {
  for (const c of CASES) {
    it(`${c.si} ${c.mathjs[0]} → ${c.unit}`, () => {
      const ours = toDisplay(c.quantity, c.si, c.unit);
      const theirs = unit(c.si, c.mathjs[0]).toNumber(c.mathjs[1]);
      expect(Math.abs(ours / theirs - 1)).toBeLessThan(1e-6);
      // and back again to SI
      expect(Math.abs(fromDisplay(c.quantity, ours, c.unit) / c.si - 1)).toBeLessThan(1e-9);
    });
  }
});
