import { z } from "zod";

// Validated once at start-up; a bad value stops the server with a readable message.
const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_PATH: z.string().min(1).default("data/sealwright.sqlite"),
  // Hosted: a postgres:// URL puts every process on one PostgreSQL (docs/hosting.md); unset, SQLite at DATABASE_PATH.
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//i, "DATABASE_URL must be a postgres:// URL (leave it unset for SQLite)")
    .optional(),
  // Signs the session cookie. When unset, a random secret is made and kept beside the database.
  SESSION_SECRET: z.string().min(32, "SESSION_SECRET must be at least 32 characters").optional(),
  // Idle and absolute session lifetimes (see docs/decisions/0002-sessions.md).
  SESSION_IDLE_HOURS: z.coerce.number().positive().default(12),
  SESSION_MAX_DAYS: z.coerce.number().positive().default(14),
  // Secure cookies in production unless the shop serves plain HTTP on its own network.
  COOKIE_SECURE: z.enum(["true", "false"]).optional(),
  // The demo shop (published password) is seeded into an empty database unless this is "false".
  SEED_DEMO: z.enum(["true", "false"], "SEED_DEMO must be true or false").default("true"),
  // Where the sign-in, sign-up and API throttles keep their counts (app/utils/rate-limit.server.ts).
  RATE_LIMIT_STORE: z
    .enum(["memory", "sqlite", "redis", "postgres"], "RATE_LIMIT_STORE must be memory, sqlite, redis or postgres")
    .default("memory"),
  RATE_LIMIT_SQLITE_PATH: z.string().min(1).optional(),
  // The Redis the "redis" store talks to; the "postgres" store uses DATABASE_URL.
  REDIS_URL: z.string().regex(/^rediss?:\/\//i, "REDIS_URL must be a redis:// URL").default("redis://127.0.0.1:6379"),
  RATE_LIMIT_KEY_PREFIX: z.string().default("sw-rl:"),
  // Behind a reverse proxy, the client's address is the proxy's X-Forwarded-For entry.
  TRUST_PROXY: z.enum(["true", "false"], "TRUST_PROXY must be true or false").default("false"),
});

export type Env = z.infer<typeof EnvSchema>;

let cached: Env | undefined;

export function getEnv(): Env {
  if (cached) return cached;
  const parsed = EnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}

/** What Knex opens: the PostgreSQL URL when one is set, else the SQLite file. */
export function databaseTarget(env: Env = getEnv()): string {
  return env.DATABASE_URL ?? env.DATABASE_PATH;
}

export function cookieIsSecure(env: Env = getEnv()): boolean {
  if (env.COOKIE_SECURE) return env.COOKIE_SECURE === "true";
  return env.NODE_ENV === "production";
}
