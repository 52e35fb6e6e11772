import { knexConfig } from "./app/utils/knex-config.server.ts";

// Used by the knex CLI (npm run db:migrate / db:seed). The app builds the same config in db.server.ts:
// DATABASE_URL (postgres://…) when set, else the SQLite file at DATABASE_PATH.
export default knexConfig(process.env.DATABASE_URL || process.env.DATABASE_PATH || "data/sealwright.sqlite");
