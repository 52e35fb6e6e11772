// The ceiling's causes in words (app/lib/clamp/ceiling-words.ts).
import { describe, expect, it } from "vitest";
import { CEILING_WORDS } from "../../../../app/lib/clamp/ceiling-words";
import { evaluatePlan } from "../../../../app/lib/clamp";
import { workedExample } from "./fixtures";

describe("CEILING_WORDS", () => {
  it("names each of the five causes, each differently", () => {
    expect(CEILING_WORDS).toEqual({
      "stud-assembly": "stud while tightened",
      "stud-working": "stud hot and fired",
      bearing: "washer bearing on the head",
      "thread-strip": "thread in the block",
      crush: "seal-line crush",
    });
    expect(new Set(Object.values(CEILING_WORDS)).size).toBe(5);
  });
  it("has a word for the cause the model gives the worked example's ceiling", () => {
    const cause = evaluatePlan(workedExample()).ceiling.cause;
    expect(CEILING_WORDS[cause]).toEqual(expect.any(String));
  });
});
