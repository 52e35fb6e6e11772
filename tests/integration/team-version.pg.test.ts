import { describe, expect, it } from "vitest";
import { recordAudit } from "~/models/audit.server";
import { teamDataVersion } from "~/models/team-version.server";
import { db, setRowScope, writeTransaction } from "~/utils/db.server";
import { ownerDb } from "../setup/db-roles";

// The team's data version keys the page cache (app/utils/page-cache.server.ts). On PostgreSQL two writers
// can commit out of the order their audit ids were handed out; the version must still move with the later
// commit, or a page rendered between the two would be kept under a version that never sees the first
// write (migration 20261226000000_team-data-version). PostgreSQL only: SQLite runs one writer at a time.

describe("the team's data version on PostgreSQL", () => {
  it("moves with every commit, also when the writer that started first commits last", async () => {
    const teamId = (await ownerDb()("teams").orderBy("id").first("id"))!.id as number;
    const before = await teamDataVersion(teamId);
    // the first writer takes its audit id and holds its transaction open
    const first = await db().transaction();
    await setRowScope(first, { teamId });
    await recordAudit(first, teamId, null, "test.version-first");
    // the second writer takes a later id and tries to commit while the first is still open
    const second = writeTransaction((trx) => recordAudit(trx, teamId, null, "test.version-second"), { teamId });
    await new Promise((r) => setTimeout(r, 300));
    const whileOpen = await teamDataVersion(teamId);
    await first.commit();
    await second;
    const after = await teamDataVersion(teamId);
    // nothing a reader saw while the first writer was open may equal the version after both committed
    expect(after).toBe(before + 2);
    expect(whileOpen).not.toBe(after);
    expect(whileOpen).toBeLessThan(after);
    const ids = (await ownerDb()("audit_events")
      .where({ team_id: teamId })
      .whereIn("action", ["test.version-first", "test.version-second"])
      .orderBy("id")
      .pluck("action")) as string[];
    expect(ids).toEqual(["test.version-first", "test.version-second"]);
  });
});
