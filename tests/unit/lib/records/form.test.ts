import { readSubmission } from "../read-submission";
import { describe, expect, it } from "vitest";
import { typedFormSchema } from "~/lib/records/form";
import { runFormSchema } from "~/lib/records/run";

const post = (fields: Record<string, string>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  return fd;
};

describe("record forms read through Conform", () => {
  it("typedFormSchema hands the parse function the strings as typed and files its messages under their fields", () => {
    const seen: Record<string, string>[] = [];
    const schema = typedFormSchema((form) => {
      seen.push(form);
      return form.a === "1"
        ? { ok: true as const, value: { a: 1 } }
        : { ok: false as const, errors: { a: "A must be 1", "stage-0-reached": "Too low" } };
    });
    expect(readSubmission(post({ a: "1", b: "two" }), { schema }).value).toEqual({ a: 1 });
    expect(seen[0]).toMatchObject({ a: "1", b: "two" });
    expect(readSubmission(post({ a: "2" }), { schema }).error).toEqual({ a: ["A must be 1"], "stage-0-reached": ["Too low"] });
  });

  it("the run form: blank fields read as empty, the bounds in the person's units, the value in SI", () => {
    const good = { ranOn: "2026-07-12", kind: "dyno", manifoldPressureKpa: "20 psi g", outcome: "held" };
    const r = readSubmission(post(good), { schema: runFormSchema(4, "imperial") });
    expect(r.status).toBe("success");
    // 20 psi gauge plus the standard atmosphere (ISO 2533, 101.325 kPa): 137.9 + 101.3 kPa
    const value = r.status === "success" ? r.value : null;
    expect(value?.manifoldPressureKpa).toBeCloseTo(239.22, 1);
    expect(value?.fuel).toBe("");
    expect(value?.cylindersAffected).toEqual([]);
    const refused = readSubmission(post({ ...good, manifoldPressureKpa: "", peakCylinderPressureMpa: "20000" }), {
      schema: runFormSchema(4, "imperial"),
    });
    expect(refused.error).toEqual({ peakCylinderPressureMpa: ["Peak cylinder pressure must be between 145 psi and 14,504 psi"] });
  });
});
