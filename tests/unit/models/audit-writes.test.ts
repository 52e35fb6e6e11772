// The house rule (docs/decisions, DEVELOPERS.md "One way to do each thing"): every audit row is written by
// recordAudit (app/models/audit.server.ts), inside the write's own transaction; no model or seed inserts
// into audit_events by hand.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(__dirname, "../../..");
const sources = (dir: string) =>
  readdirSync(path.join(root, dir))
    .filter((f) => f.endsWith(".ts"))
    .map((f) => path.join(dir, f));

describe("audit rows", () => {
  const files = [...sources("app/models"), ...sources("migrations/seeds")];
  it("are inserted only by recordAudit", () => {
    const byHand = files.filter(
      (f) => !f.endsWith("audit.server.ts") && /\("audit_events"\)\s*\.insert/.test(readFileSync(path.join(root, f), "utf8")),
    );
    expect(files.length).toBeGreaterThan(20);
    expect(byHand).toEqual([]);
  });
  it("are written inside a write transaction, never on the bare connection", () => {
    const bare = files.filter((f) => /recordAudit\(db\(\)/.test(readFileSync(path.join(root, f), "utf8")));
    expect(bare).toEqual([]);
  });
});
