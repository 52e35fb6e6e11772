// npm run db:seed: the demo shop and the handbook library, or — with SEED_DEMO=false, for a real
// shop — only the handbook library for teams that lack one. The demo accounts share a published
// password, so a production database must never get them by accident.
import knexFactory from "knex";
import { databaseTarget, getEnv } from "../app/utils/env.server.ts";
import { knexConfig } from "../app/utils/knex-config.server.ts";

const env = getEnv();
const knex = knexFactory(knexConfig(databaseTarget(env)));
try {
  if (env.SEED_DEMO === "false") {
    const [files] = await knex.seed.run({ specific: "02-libraries.ts" });
    console.log(`SEED_DEMO=false: ran ${files.length} seed file (library only, no demo accounts)`);
  } else {
    if (env.NODE_ENV === "production") {
      console.warn(
        "SEED_DEMO is not false: an empty database gets the demo accounts (published password). Set SEED_DEMO=false for a real shop.",
      );
    }
    const [files] = await knex.seed.run();
    console.log(`Ran ${files.length} seed files`);
  }
} finally {
  await knex.destroy();
}
