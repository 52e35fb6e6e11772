import { spawn } from "node:child_process";
import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { db, writeTransaction } from "~/utils/db.server";

// Defect 7 of issue 9: Knex began SQLite transactions DEFERRED. A transaction that reads, then writes,
// while another process writes in between, gets SQLITE_BUSY at once (its snapshot is stale and SQLite
// cannot wait): a 500. Transactions now begin IMMEDIATE and wait their busy_timeout instead.

const file = () => process.env.DATABASE_PATH!;

describe("write transactions begin IMMEDIATE (SQLite)", () => {
  it("hold the write lock from the first statement: another connection cannot write until commit", async () => {
    await writeTransaction(async (trx) => {
      await trx("teams").first("id"); // only a read so far
      const other = new Database(file(), { timeout: 0 });
      try {
        expect(() => other.prepare("insert into audit_events (action, created_at) values ('probe', 'x')").run()).toThrow(/locked|busy/i);
      } finally {
        other.close();
      }
    });
  });

  it("a read-then-write transaction racing another process's write waits and succeeds (was SQLITE_BUSY)", async () => {
    const child = spawn(
      process.execPath,
      [
        "-e",
        `const D = require("better-sqlite3"); const d = new D(process.argv[1], { timeout: 5000 });
         process.stdout.write("waiting\\n");
         d.prepare("insert into audit_events (action, created_at) values ('other-process', 'x')").run();
         d.close();`,
        file(),
      ],
      { stdio: ["ignore", "pipe", "pipe"] },
    );
    const exited = new Promise<number>((resolve) => child.on("exit", (code) => resolve(code ?? -1)));
    const waiting = new Promise<void>((resolve) => child.stdout.on("data", (d) => String(d).includes("waiting") && resolve()));

    await writeTransaction(async (trx) => {
      const before = await trx("audit_events").count({ n: "*" });
      // the other process writes now (deferred: it commits at once and our snapshot goes stale)
      await waiting;
      await Promise.race([exited, new Promise((r) => setTimeout(r, 300))]);
      await trx("audit_events").insert({ action: "this-process", detail: JSON.stringify(before), created_at: "x" });
    });
    expect(await exited).toBe(0);
    const actions = await db()("audit_events").whereIn("action", ["this-process", "other-process"]).pluck("action");
    expect(actions.sort()).toEqual(["other-process", "this-process"]);
  });

  it("a write and its audit row commit or roll back together", async () => {
    const before = await db()("audit_events").count({ n: "*" });
    await expect(
      writeTransaction(async (trx) => {
        await trx("audit_events").insert({ action: "half-done", created_at: "x" });
        throw new Error("the second half failed");
      }),
    ).rejects.toThrow("the second half failed");
    expect(await db()("audit_events").count({ n: "*" })).toEqual(before);
  });
});
