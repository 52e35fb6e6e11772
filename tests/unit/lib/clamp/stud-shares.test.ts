// The stud-share rule (app/lib/clamp/stud-shares.ts): a stud's shares add up to 1 within 0.005.
import { describe, expect, it } from "vitest";
import { SHARE_TOLERANCE, shareProblem, shareSum } from "../../../../app/lib/clamp/stud-shares";

const stud = (...shares: number[]) => ({ serves: shares.map((share, i) => ({ cylinder: i + 1, share })) });

describe("shareSum", () => {
  it("adds the shares", () => {
    expect(shareSum(stud(0.5, 0.5))).toBe(1);
    expect(shareSum(stud(0.25, 0.25, 0.5))).toBe(1);
    expect(shareSum(stud())).toBe(0);
  });
});

describe("shareProblem", () => {
  it("thirds typed as 0.333 pass (0.999 is inside the tolerance)", () => {
    expect(shareProblem(stud(0.333, 0.333, 0.333), "A2")).toBeNull();
  });
  it("the tolerance is 0.005 either side: 0.996 and 1.004 pass, 0.994 and 1.006 do not", () => {
    expect(SHARE_TOLERANCE).toBe(0.005);
    expect(shareProblem(stud(0.5, 0.496), "A2")).toBeNull();
    expect(shareProblem(stud(0.5, 0.504), "A2")).toBeNull();
    expect(shareProblem(stud(0.5, 0.494), "A2")).toBe("Stud shares for A2 add up to 0.994; they must add up to 1");
    expect(shareProblem(stud(0.5, 0.506), "A2")).toBe("Stud shares for A2 add up to 1.006; they must add up to 1");
  });
  it("names the stud and rounds the sum to three decimals", () => {
    expect(shareProblem(stud(0.5, 0.5, 0.12345), "LB3")).toBe("Stud shares for LB3 add up to 1.123; they must add up to 1");
    expect(shareProblem(stud(), "B1")).toBe("Stud shares for B1 add up to 0; they must add up to 1");
  });
});
