// The prepared plan (app/lib/clamp/model.ts): everything the estimate needs, found once per input.
// Expected figures are the hand-worked example of docs/clamp-model.md (also stepped through in
// worked-example.test.ts); the rest is behaviour.
import { describe, expect, it } from "vitest";
import { hotSettledPreload, preloadForTorque, prepare, torqueForPreloadNm } from "../../../../app/lib/clamp/model";
import type { PlanInput } from "../../../../app/lib/clamp";
import { relErr } from "../nist";
import { workedExample } from "./fixtures";

const close = (a: number, b: number, tol = 1e-5) => expect(relErr(a, b)).toBeLessThan(tol);

describe("prepare, the worked example (docs/clamp-model.md)", () => {
  const p = prepare(workedExample());
  it("torque per preload 2.200181 mm, stud 240 086.8 N/mm, members 243 435.2 N/mm, Φn 0.362517", () => {
    close(p.torquePerPreloadMm, 2.200181);
    close(p.stud.stiffnessNPerMm, 240_086.8);
    close(p.member.stiffnessNPerMm, 243_435.2);
    close(p.phi, 0.362517);
    close(p.C, 0.496538);
  });
  it("gas force per bore 123 163 N; firing takes (1 − Φn)·H = 78 514.3 N off each bore's gasket", () => {
    close(p.requirement.pressureForceN, 123_163.0);
    close(p.reliefPerBoreN, 78_514.3);
    close(p.reliefPerBoreN, (1 - p.phi) * p.requirement.pressureForceN, 1e-12);
  });
  it("each stud's firing load: Σ over its bores, the end studs 41 054 N, the next 51 318 N; the peak is one bore's share", () => {
    close(p.studExternalN[0]!, 41_054.33);
    close(p.studExternalN[1]!, 51_317.92);
    close(p.studPeakFiringN[1]!, 30_790.75);
    // Σ over the studs = cylinders × H
    let sum = 0;
    for (const x of p.studExternalN) sum += x;
    close(sum, p.cylinders * p.requirement.pressureForceN, 1e-12);
  });
  it("the shares in CSR form: stud s serves boreOf[start[s]…start[s+1]); Σ shares per bore is the bore's stud weight", () => {
    expect(p.studCount).toBe(10);
    expect(p.start[p.studCount]).toBe(p.boreOf.length);
    const weight = new Float64Array(p.cylinders);
    for (let s = 0; s < p.studCount; s++) for (let j = p.start[s]!; j < p.start[s + 1]!; j++) weight[p.boreOf[j]!]! += p.shareOf[j]!;
    expect([...weight]).toEqual([...p.boreStudWeight]);
    expect([...p.boreStudWeight]).toEqual([3, 2, 2, 3]);
    // bores 1 and 2 (0-based) share bore 1's weight; bore 3 shares bore 0's
    expect([...p.sameWeightAs]).toEqual([0, 1, 1, 0]);
  });
});

describe("torque and preload", () => {
  const p = prepare(workedExample());
  it("180 N·m gives 81 811.5 N (docs/clamp-model.md), and the two conversions are inverse", () => {
    close(preloadForTorque(p, 180), 81_811.5);
    expect(torqueForPreloadNm(p, preloadForTorque(p, 180))).toBeCloseTo(180, 9);
  });
});

describe("hot and settled", () => {
  const plan = workedExample();
  const p = prepare(plan);
  it("F_running = F·(1 − relaxation) − embedding loss + thermal change (VDI 2230), never below zero", () => {
    const F = 80_000;
    expect(hotSettledPreload(p, F)).toBeCloseTo(F * (1 - p.relaxationFraction) - p.embeddingLossN + p.thermalChangeN, 6);
    expect(hotSettledPreload(p, 0)).toBe(Math.max(0, -p.embeddingLossN + p.thermalChangeN));
  });
  it("an aluminium head on steel studs gains preload hot (docs/references.md §5); a hotter stud gains less", () => {
    expect(p.thermalChangeN).toBeGreaterThan(0);
    const hotStud: PlanInput = { ...plan, temperatures: { ...plan.temperatures, studC: plan.temperatures.studC + 30 } };
    expect(prepare(hotStud).thermalChangeN).toBeLessThan(p.thermalChangeN);
    const cold: PlanInput = { ...plan, temperatures: { assemblyC: 20, headC: 20, blockC: 20, studC: 20 } };
    expect(prepare(cold).thermalChangeN).toBeCloseTo(0, 9);
  });
  it("a rougher finish embeds more (VDI 2230 embedding table, from memory)", () => {
    const smooth = prepare({ ...plan, surfaceRoughness: "rz-under-10" });
    const rough = prepare({ ...plan, surfaceRoughness: "rz-40-160" });
    expect(rough.embedMm).toBeGreaterThan(p.embedMm);
    expect(p.embedMm).toBeGreaterThan(smooth.embedMm);
  });
});
