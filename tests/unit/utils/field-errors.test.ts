// zod issues → the first message per field (app/utils/field-errors.ts).
import { z } from "zod";
import { describe, expect, it } from "vitest";
import { fieldErrors } from "../../../app/utils/field-errors";

describe("fieldErrors", () => {
  it("keeps the first message for each field, joining nested paths with dots", () => {
    expect(
      fieldErrors([
        { path: ["name"], message: "Give a name" },
        { path: ["name"], message: "At most 80 characters" },
        { path: ["studs", 2, "share"], message: "Share 0 to 1" },
      ]),
    ).toEqual({ name: "Give a name", "studs.2.share": "Share 0 to 1" });
  });
  it("reads a zod error's issues", () => {
    const r = z.object({ boreMm: z.number().min(50, "Bore at least 50 mm") }).safeParse({ boreMm: 10 });
    expect(r.success).toBe(false);
    if (!r.success) expect(fieldErrors(r.error.issues)).toEqual({ boreMm: "Bore at least 50 mm" });
  });
});
