import { describe, expect, it } from "vitest";
import { writeTransaction } from "~/utils/db.server";
import { onPostgres } from "../setup/engine";
import { ownerDb } from "../setup/db-roles";

// On PostgreSQL writeTransaction is SERIALIZABLE and runs a refused transaction again: a quota-like
// read-then-write raced by another connection stays within its limit. Under READ COMMITTED both racers
// would read 0 and both insert; here one is refused (40001), runs again, reads 1 and stops. The app role
// sees a team's rows only in that team's scope, so the probes write the demo team's rows in its scope.

const demoTeam = async (): Promise<number> => (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;

describe.runIf(onPostgres)("write transactions on PostgreSQL", () => {
  it("two racing read-then-write transactions keep a limit of one row (serialization failure, then a retry)", async () => {
    const action = `quota-probe-${Date.now()}`;
    let reads = 0;
    let bothRead!: () => void;
    const barrier = new Promise<void>((resolve) => (bothRead = resolve));
    let attempts = 0;
    const teamId = await demoTeam();
    const claim = () =>
      writeTransaction(
        async (trx) => {
          attempts++;
          const [{ n }] = await trx("audit_events").where({ action }).count({ n: "*" });
          // the first round: each waits until the other has read too, so their reads overlap for sure
          if (++reads <= 2) {
            if (reads === 2) bothRead();
            await barrier;
          }
          if (Number(n) >= 1) return false;
          await trx("audit_events").insert({ team_id: teamId, action, created_at: new Date().toISOString() });
          return true;
        },
        { teamId },
      );
    const results = await Promise.all([claim(), claim()]);
    expect(results.sort()).toEqual([false, true]);
    expect(attempts).toBeGreaterThanOrEqual(3); // two first tries and at least one retry of the refused one
    expect(await ownerDb()("audit_events").where({ action }).count({ n: "*" })).toEqual([{ n: 1 }]);
  });

  it("does not retry an error that is not a serialization failure", async () => {
    let attempts = 0;
    const teamId = await demoTeam();
    await expect(
      writeTransaction(
        async (trx) => {
          attempts++;
          await trx("memberships").insert({ user_id: -1, team_id: teamId, role: "owner", created_at: "x" });
        },
        { teamId },
      ),
    ).rejects.toMatchObject({ code: "23503" });
    expect(attempts).toBe(1);
  });
});
