import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { createCookie, createSessionStorage } from "react-router";
import { now, withScope } from "./db.server";
import { cookieIsSecure, getEnv } from "./env.server";

export interface SessionData {
  userId: number;
  teamId: number | null;
}

const HOUR_MS = 3_600_000;
// last_seen_at is written at most this often, so reads stay cheap.
const TOUCH_EVERY_MS = 5 * 60_000;

export function hashSessionId(id: string): string {
  return crypto.createHash("sha256").update(id).digest("hex");
}

/** The secret that signs the session cookie (and the toast cookie). */
export function sessionSecret(): string {
  const env = getEnv();
  if (env.SESSION_SECRET) return env.SESSION_SECRET;
  // No secret configured: keep a random one beside the database so restarts keep people signed in.
  const file = path.join(path.dirname(path.resolve(env.DATABASE_PATH)), "session-secret");
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, crypto.randomBytes(32).toString("base64url"), { mode: 0o600, flag: "wx" });
  }
  return fs.readFileSync(file, "utf8").trim();
}

function lifetimes() {
  const env = getEnv();
  return { idleMs: env.SESSION_IDLE_HOURS * HOUR_MS, maxMs: env.SESSION_MAX_DAYS * 24 * HOUR_MS };
}

let storage: ReturnType<typeof build> | undefined;

function build() {
  const { idleMs, maxMs } = lifetimes();
  const cookie = createCookie("sw_session", {
    httpOnly: true,
    sameSite: "lax",
    secure: cookieIsSecure(),
    path: "/",
    maxAge: Math.round(maxMs / 1000),
    secrets: [sessionSecret()],
  });
  return createSessionStorage<SessionData>({
    cookie,
    async createData(data) {
      // 256 random bits; only its hash is stored.
      const id = crypto.randomBytes(32).toString("base64url");
      const at = new Date();
      await withScope({ sessionHash: hashSessionId(id) }, (k) =>
        k("sessions").insert({
          id_hash: hashSessionId(id),
          user_id: data.userId,
          team_id: data.teamId ?? null,
          data: "{}",
          created_at: at.toISOString(),
          last_seen_at: at.toISOString(),
          expires_at: new Date(at.getTime() + maxMs).toISOString(),
        }),
      );
      return id;
    },
    async readData(id) {
      const idHash = hashSessionId(id);
      const row = await withScope({ sessionHash: idHash }, (k) => k("sessions").where({ id_hash: idHash }).first());
      if (!row) return null;
      const t = Date.now();
      const lastSeen = Date.parse(row.last_seen_at);
      if (t > Date.parse(row.expires_at) || t - lastSeen > idleMs) {
        await withScope({ sessionHash: idHash }, (k) => k("sessions").where({ id_hash: idHash }).delete());
        return null;
      }
      if (t - lastSeen > TOUCH_EVERY_MS) {
        await withScope({ sessionHash: idHash }, (k) => k("sessions").where({ id_hash: idHash }).update({ last_seen_at: now() }));
      }
      return { userId: row.user_id, teamId: row.team_id, ...JSON.parse(row.data) };
    },
    async updateData(id, data) {
      const { userId, teamId, ...rest } = data as Partial<SessionData> & Record<string, unknown>;
      await withScope({ sessionHash: hashSessionId(id) }, (k) =>
        k("sessions")
          .where({ id_hash: hashSessionId(id) })
          .update({ team_id: teamId ?? null, data: JSON.stringify(rest), ...(userId ? { user_id: userId } : {}) }),
      );
    },
    async deleteData(id) {
      await withScope({ sessionHash: hashSessionId(id) }, (k) =>
        k("sessions")
          .where({ id_hash: hashSessionId(id) })
          .delete(),
      );
    },
  });
}

export function sessionStorage() {
  storage ??= build();
  return storage;
}

export function getSession(request: Request) {
  return sessionStorage().getSession(request.headers.get("Cookie"));
}
