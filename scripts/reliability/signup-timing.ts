// npm run reliability:signup-timing — how long sign-up takes for a taken e-mail and for a free one
// (defect 5 of issue 9: 13 ms against 152 ms told who had an account). In-process, on a fresh copy
// of the demo database, SIGNUP_SAMPLES of each (default 15), alternating; medians in milliseconds.
import { freshDatabase } from "./server.ts";

const SAMPLES = Number(process.env.SIGNUP_SAMPLES ?? 15);
const { env } = freshDatabase("signup-timing");
Object.assign(process.env, env, { NODE_ENV: "test" });
const signup = await import("../../app/routes/auth/signup.tsx");
const { resetThrottles } = await import("../../app/utils/rate-limit.server.ts");
const { closeDb } = await import("../../app/utils/db.server.ts");

async function once(email: string): Promise<{ ms: number; status: number }> {
  resetThrottles();
  const body = new URLSearchParams({ name: "Timing Person", email, teamName: "Timing Shop", password: "a sentence for the bench" });
  const request = new Request("http://127.0.0.1/signup", {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    body,
  });
  const t0 = performance.now();
  let status = 200;
  try {
    const out = (await signup.action({ request, params: {}, context: undefined } as never)) as unknown as {
      init?: { status?: number };
      status?: number;
    };
    status = out instanceof Response ? out.status : (out.init?.status ?? 200);
  } catch (thrown) {
    status = thrown instanceof Response ? thrown.status : 500;
  }
  return { ms: performance.now() - t0, status };
}

const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
await once("warm-up@example.com");
const taken: number[] = [];
const fresh: number[] = [];
const statuses = new Set<string>();
for (let i = 0; i < SAMPLES; i++) {
  const t = await once("owner@example.com");
  const f = await once(`timing-${i}@example.com`);
  taken.push(t.ms);
  fresh.push(f.ms);
  statuses.add(`taken ${t.status}, free ${f.status}`);
}
console.log(
  JSON.stringify({
    samples: SAMPLES,
    takenMedianMs: Math.round(median(taken)),
    freeMedianMs: Math.round(median(fresh)),
    answers: [...statuses],
  }),
);
await closeDb();
