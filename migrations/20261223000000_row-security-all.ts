import type { Knex } from "knex";

// Row-level security on every table that carries team_id (PostgreSQL only; on SQLite nothing: one shop,
// one file). 20261219000000_hosted walled off six tables; this adds the rest, so that the app role of
// docs/hosting.md (which owns nothing, so the policies bind it) sees and writes only the rows of the team
// its transaction names in app.team_id (withTeam / writeTransaction(…, { teamId }) in db.server.ts).
//
// A few lookups come before the team is known. Each gets its own narrow policy keyed on a setting that
// names exactly the row(s) asked for, never a hole (docs/decisions/0018-row-security.md):
//   sessions      by app.session_hash (the cookie id's SHA-256) or app.user_id (sign out everywhere)
//   memberships   read by app.user_id (which teams may this person enter?)
//   api_tokens    read by app.token_hash (the bearer token's SHA-256), and by app.user_id (own keys)
//   team_invites  read by app.token_hash (the link's SHA-256)
//   audit_events  insert with no team (sign-in refusals, account events belong to no shop)
// Tables without team_id stay open to the app role: users and password_resets belong to a person, not a
// shop (a person is in several teams), teams is the shop row itself (sign-up makes it before any team
// exists), rate_limits holds throttle counts. Rows that hang off team rows all carry team_id themselves.

export const ALL_TEAM_TABLES = [
  "materials",
  "fasteners",
  "gaskets",
  "engines",
  "seal_plans",
  "audit_events",
  "memberships",
  "sessions",
  "team_invites",
  "engine_shares",
  "api_tokens",
  "assemblies",
  "runs",
  "files",
  "machining_records",
];

// the six of 20261219000000_hosted, which already have <table>_team
const WALLED_BEFORE = new Set(["materials", "fasteners", "gaskets", "engines", "seal_plans", "audit_events"]);

// current_setting(…, true) is null when never set and '' once a transaction that set it has ended.
const setting = (name: string) => `nullif(current_setting('app.${name}', true), '')`;
const TEAM = `${setting("team_id")}::integer`;
const USER = `${setting("user_id")}::integer`;

type Policy = { name: string; table: string; command: "all" | "select" | "insert" | "update" | "delete"; using?: string; check?: string };

const NARROW: Policy[] = [
  {
    name: "sessions_by_hash",
    table: "sessions",
    command: "all",
    using: `id_hash = ${setting("session_hash")}`,
    check: `id_hash = ${setting("session_hash")}`,
  },
  { name: "sessions_by_user", table: "sessions", command: "all", using: `user_id = ${USER}`, check: `user_id = ${USER}` },
  { name: "memberships_by_user", table: "memberships", command: "select", using: `user_id = ${USER}` },
  { name: "api_tokens_by_hash", table: "api_tokens", command: "select", using: `token_hash = ${setting("token_hash")}` },
  { name: "api_tokens_by_user", table: "api_tokens", command: "select", using: `user_id = ${USER}` },
  { name: "team_invites_by_hash", table: "team_invites", command: "select", using: `token_hash = ${setting("token_hash")}` },
  { name: "audit_events_no_team", table: "audit_events", command: "insert", check: "team_id is null" },
];

export async function up(knex: Knex): Promise<void> {
  if (knex.client.config.client !== "pg") return;
  for (const table of ALL_TEAM_TABLES) {
    if (WALLED_BEFORE.has(table)) continue;
    await knex.raw("alter table ?? enable row level security", [table]);
    await knex.raw(`create policy ?? on ?? using (team_id = ${TEAM}) with check (team_id = ${TEAM})`, [`${table}_team`, table]);
  }
  for (const p of NARROW) {
    const using = p.using ? ` using (${p.using})` : "";
    const check = p.check ? ` with check (${p.check})` : "";
    await knex.raw(`create policy ?? on ?? for ${p.command}${using}${check}`, [p.name, p.table]);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (knex.client.config.client !== "pg") return;
  for (const p of [...NARROW].reverse()) await knex.raw("drop policy if exists ?? on ??", [p.name, p.table]);
  for (const table of [...ALL_TEAM_TABLES].reverse()) {
    if (WALLED_BEFORE.has(table)) continue;
    await knex.raw("drop policy if exists ?? on ??", [`${table}_team`, table]);
    await knex.raw("alter table ?? disable row level security", [table]);
  }
}
