import knexFactory, { type Knex } from "knex";
import { afterAll } from "vitest";
import { db } from "../../app/utils/db.server.ts";
import { knexConfig } from "../../app/utils/knex-config.server.ts";

// Which role a test's own queries run as on the PostgreSQL pass (docs/decisions/0018-row-security.md).
// The app's db() is the app role unless TEST_PG_ROLE=owner (setup-file.ts). ownerDb() is for set-up rows and
// checks that must see every team; appDb() is the hosted app role, which row security binds. On SQLite
// both are the app's own db() (one file, no roles).

const opened: Knex[] = [];
let owner: Knex | undefined;
let app: Knex | undefined;

function open(url: string): Knex {
  const knex = knexFactory({ ...knexConfig(url), pool: { min: 0, max: 2 } });
  opened.push(knex);
  return knex;
}

function sameAsApp(url: string | undefined): boolean {
  return !url || url === process.env.DATABASE_URL;
}

export function ownerDb(): Knex {
  const url = process.env.TEST_OWNER_DATABASE_URL;
  if (sameAsApp(url)) return db();
  return (owner ??= open(url!));
}

export function appDb(): Knex {
  const url = process.env.TEST_APP_DATABASE_URL;
  if (sameAsApp(url)) return db();
  return (app ??= open(url!));
}

/** The app role's name on the PostgreSQL pass, null on SQLite. */
export function appRoleName(): string | null {
  const url = process.env.TEST_APP_DATABASE_URL;
  return url ? decodeURIComponent(new URL(url).username) : null;
}

afterAll(async () => {
  await Promise.all(opened.splice(0).map((k) => k.destroy()));
  owner = app = undefined;
});
