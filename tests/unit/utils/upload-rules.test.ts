// Upload limits the browser shows and the server enforces (app/utils/upload-rules.ts).
import { describe, expect, it } from "vitest";
import { ALLOWED_UPLOAD_TYPES, MAX_UPLOAD_BYTES, UPLOAD_PATH, UPLOAD_RULE_TEXT } from "../../../app/utils/upload-rules";

describe("upload rules", () => {
  it("10 MB per file (10 × 1024 × 1024 bytes), and the sentence says so", () => {
    expect(MAX_UPLOAD_BYTES).toBe(10_485_760);
    expect(UPLOAD_RULE_TEXT).toContain("at most 10 MB each");
  });
  it("photos and PDFs only", () => {
    expect([...ALLOWED_UPLOAD_TYPES]).toEqual(["image/jpeg", "image/png", "image/webp", "application/pdf"]);
  });
  it("the upload paths: an engine's, a fastener's or a gasket's, with a decimal id and an optional slash", () => {
    for (const p of [
      "/engines/12/files/upload",
      "/engines/12/files/upload/",
      "/libraries/fasteners/3/files/upload",
      "/libraries/gaskets/4/files/upload",
    ])
      expect(UPLOAD_PATH.test(p)).toBe(true);
    for (const p of [
      "/engines/x/files/upload",
      "/engines/12/files",
      "/libraries/heads/3/files/upload",
      "/engines/12/files/upload/more",
      "/api/engines/1/files/upload",
    ])
      expect(UPLOAD_PATH.test(p)).toBe(false);
  });
});
