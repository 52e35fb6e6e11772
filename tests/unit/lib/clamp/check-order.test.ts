// The order checks are shown in (app/lib/clamp/check-order.ts): worst first, unchecked last.
import { describe, expect, it } from "vitest";
import { rankChecks } from "../../../../app/lib/clamp/check-order";
import type { LimitCheck } from "../../../../app/lib/clamp/limits";

const check = (id: LimitCheck["id"], status: LimitCheck["status"], ratio: number, thinBelow = 1.2, checked = true): LimitCheck => ({
  id,
  label: id,
  ratio,
  thinBelow,
  status,
  detail: "",
  checked,
});

describe("rankChecks", () => {
  it("failing before thin before passing, unchecked last", () => {
    const ranked = rankChecks([
      check("bearing", "holds", 2),
      check("seal", "thin", 1.1),
      check("crush", "short", 0.9, 1.2, false),
      check("fatigue", "short", 0.8),
    ]);
    expect(ranked.map((c) => c.id)).toEqual(["fatigue", "seal", "bearing", "crush"]);
  });
  it("among failing ones the furthest under its limit first", () => {
    expect(rankChecks([check("seal", "short", 0.95), check("bearing", "short", 0.6)]).map((c) => c.id)).toEqual(["bearing", "seal"]);
  });
  it("among thin ones the furthest into its comfort band (ratio over thinBelow), not the lowest ratio", () => {
    // 1.1/1.5 = 0.733 is deeper than 1.05/1.1 = 0.955
    const ranked = rankChecks([check("seal", "thin", 1.05, 1.1), check("body-seal", "thin", 1.1, 1.5)]);
    expect(ranked.map((c) => c.id)).toEqual(["body-seal", "seal"]);
  });
  it("keeps ties in their order and does not change the list it was given", () => {
    const given = [check("seal", "holds", 1.5), check("bearing", "holds", 1.5)];
    expect(rankChecks(given).map((c) => c.id)).toEqual(["seal", "bearing"]);
    rankChecks([...given].reverse());
    expect(given.map((c) => c.id)).toEqual(["seal", "bearing"]);
  });
});
