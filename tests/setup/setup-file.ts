import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { afterAll, afterEach, beforeEach, inject, vi } from "vitest";
import { createDatabase, dropDatabase, uniqueName, urlAs, urlFor } from "./postgres.ts";
import { withUser } from "../../app/utils/knex-config.server.ts";

// Each test file gets its own copy of the migrated, seeded template database: a SQLite file, or on the
// PostgreSQL pass a database made from the template database.
const tmp = inject("testDbDir");
const pgBaseUrl = inject("pgBaseUrl");
const pgTemplate = inject("pgTemplate");
const pgAppRole = inject("pgAppRole");
const file = path.join(tmp, `db-${process.pid}-${crypto.randomBytes(4).toString("hex")}.sqlite`);
const pgDatabase = pgBaseUrl && pgTemplate ? uniqueName("") : null;
if (pgBaseUrl && pgTemplate && pgDatabase) {
  await createDatabase(pgBaseUrl, pgDatabase, pgTemplate);
  // Two doors to the same copy (tests/setup/db-roles.ts): the owner (migrations, set-up rows; row security
  // never binds it) and the app role of docs/hosting.md (owns nothing, so the policies bind it).
  // The app's own db() is the app role, as a hosted process runs, so every test goes through the
  // policies; TEST_PG_ROLE=owner puts it on the owner instead (to tell a policy's refusal from a bug).
  const ownerUrl = withUser(urlFor(pgBaseUrl, pgDatabase));
  process.env.TEST_OWNER_DATABASE_URL = ownerUrl;
  process.env.TEST_APP_DATABASE_URL = pgAppRole ? urlAs(ownerUrl, pgAppRole) : ownerUrl;
  process.env.DATABASE_URL = process.env.TEST_PG_ROLE === "owner" ? ownerUrl : process.env.TEST_APP_DATABASE_URL;
} else {
  fs.copyFileSync(path.join(tmp, "template.sqlite"), file);
  delete process.env.DATABASE_URL;
}
// Still set on the PostgreSQL pass: the session secret and the SQLite rate-limit store live beside it.
process.env.DATABASE_PATH = file;
process.env.NODE_ENV = "test";
// No mail leaves a test: port 9 (discard) on the loopback refuses, unless the file starts its own sink
// (tests/integration/mail.ts), which points SMTP_PORT at itself.
process.env.SMTP_HOST = "127.0.0.1";
process.env.SMTP_PORT = "9";
process.env.MAIL_SINK_DIR = path.join(tmp, "mail-none");
process.env.SESSION_SECRET ??= "test-secret-test-secret-test-secret-0123";

// An unexpected console.error fails the test that caused it.
let errorSpy: ReturnType<typeof vi.spyOn>;
beforeEach(() => {
  errorSpy = vi.spyOn(console, "error");
});
afterEach(() => {
  const calls = errorSpy.mock.calls;
  errorSpy.mockRestore();
  if (calls.length > 0) throw new Error(`console.error was called: ${calls.map((c: unknown[]) => c.join(" ")).join("\n")}`);
});

afterAll(async () => {
  const { closeDb } = await import("../../app/utils/db.server.ts");
  await closeDb();
  for (const suffix of ["", "-wal", "-shm"]) fs.rmSync(file + suffix, { force: true });
  if (pgBaseUrl && pgDatabase) await dropDatabase(pgBaseUrl, pgDatabase);
});
