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
  REDIS_URL: z
    .string()
    .regex(/^rediss?:\/\//i, "REDIS_URL must be a redis:// URL")
    .default("redis://127.0.0.1:6379"),
  RATE_LIMIT_KEY_PREFIX: z.string().default("sw-rl:"),
  // Behind a reverse proxy, the client's address is the proxy's X-Forwarded-For entry.
  TRUST_PROXY: z.enum(["true", "false"], "TRUST_PROXY must be true or false").default("false"),
  // Where people reach the app: links in e-mails (invites, password resets, build sheets) start with it.
  // Never taken from the request's Host header, which a sender could forge into a reset link.
  APP_URL: z.url("APP_URL must be a full URL like https://sealwright.example.com").optional(),
  // Outgoing mail over SMTP, any provider. The defaults reach the development sink (scripts/mail-sink.ts).
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int("SMTP_PORT must be a port number").min(1).max(65535).default(1025),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  // "true": TLS from the first byte (usually port 465); "false": plain, upgraded by STARTTLS when offered.
  SMTP_SECURE: z.enum(["true", "false"], "SMTP_SECURE must be true or false").default("false"),
  MAIL_FROM: z.string().min(3).default("Sealwright <sealwright@localhost>"),
  // The development sink's folder, which the dev-only mailbox page reads.
  MAIL_SINK_DIR: z.string().min(1).default("data/mailbox"),
  // The mailbox page is absent when NODE_ENV=production unless this is "true" (for a test build only).
  DEV_MAILBOX: z.enum(["true", "false"], "DEV_MAILBOX must be true or false").default("false"),
  // Uploaded photos and PDFs: a directory outside the web root (default: "uploads" beside the database).
  UPLOAD_DIR: z.string().min(1).optional(),
  // Total upload storage per team, in MB.
  UPLOAD_TEAM_QUOTA_MB: z.coerce.number().positive("UPLOAD_TEAM_QUOTA_MB must be a positive number").default(500),
  // Where uploads are kept: "disk" (UPLOAD_DIR) or "s3", any S3-compatible object storage (docs/hosting.md).
  FILE_STORAGE: z.enum(["disk", "s3"], "FILE_STORAGE must be disk or s3").default("disk"),
  S3_BUCKET: z.string().min(1).optional(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  // Unset: AWS for S3_REGION. Set (MinIO, a local fake, another provider): requests go there, path-style.
  S3_ENDPOINT: z.url({ protocol: /^https?$/, error: "S3_ENDPOINT must be a full http(s) URL like https://objects.example.com" }).optional(),
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"], "S3_FORCE_PATH_STYLE must be true or false").optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_SESSION_TOKEN: z.string().min(1).optional(),
  // The sweep (npm run files:sweep) removes stored objects without a row once they are this old.
  FILE_SWEEP_MINUTES: z.coerce.number().positive("FILE_SWEEP_MINUTES must be a positive number of minutes").default(60),
});

// Settings that need one another.
const CheckedEnv = EnvSchema.superRefine((env, ctx) => {
  if (env.FILE_STORAGE !== "s3") return;
  for (const name of ["S3_BUCKET", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY"] as const)
    if (!env[name]) ctx.addIssue({ code: "custom", path: [name], message: `${name} is needed when FILE_STORAGE=s3` });
});

export type Env = z.infer<typeof EnvSchema>;

let cached: Env | undefined;

export function getEnv(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** The settings from these variables, or an error naming each bad one. */
export function parseEnv(source: Record<string, string | undefined>): Env {
  const parsed = CheckedEnv.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  return parsed.data;
}

/** What Knex opens: the PostgreSQL URL when one is set, else the SQLite file. */
export function databaseTarget(env: Env = getEnv()): string {
  return env.DATABASE_URL ?? env.DATABASE_PATH;
}

export function cookieIsSecure(env: Env = getEnv()): boolean {
  if (env.COOKIE_SECURE) return env.COOKIE_SECURE === "true";
  return env.NODE_ENV === "production";
}

/** The address links in e-mails start with, without a trailing slash. */
export function appUrl(env: Env = getEnv()): string {
  return (env.APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`).replace(/\/+$/, "");
}

/** The development mailbox page exists outside production builds (or when a test build asks for it). */
export function mailboxOpen(env: Env = getEnv()): boolean {
  return env.NODE_ENV !== "production" || env.DEV_MAILBOX === "true";
}
