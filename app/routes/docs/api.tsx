import type { ReactNode } from "react";
import { Link } from "react-router";
import type { Route } from "./+types/api";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { PAGE_LIMIT_MAX, SWEEP_MAX_NM, SWEEP_MAX_POINTS } from "~/lib/api/schemas";
import { RUN_KINDS, RUN_OUTCOMES } from "~/lib/api/run-schemas";
import { RULES } from "~/utils/rate-limit.server";
import { MAX_JSON_BYTES } from "~/utils/json-body.server";

// The API page: public, like the OpenAPI document, so whoever writes the script can read it before
// they have an account; it shows no shop data. docs/api.md says the same for the repository.
export const meta: Route.MetaFunction = () => [{ title: "JSON API · Sealwright" }];
export const handle = CAUTION_HANDLE;

export function loader({ request }: Route.LoaderArgs) {
  return {
    origin: new URL(request.url).origin,
    limits: {
      pageMax: PAGE_LIMIT_MAX,
      bodyKiB: MAX_JSON_BYTES / 1024,
      perMinute: RULES.apiToken.points,
      perAddress: RULES.apiAddress.points,
      sweepMaxNm: SWEEP_MAX_NM,
      sweepMaxPoints: SWEEP_MAX_POINTS,
    },
  };
}

// tabIndex: a wide example scrolls sideways, and a keyboard must be able to scroll it too
function Code({ children }: { children: string }) {
  return (
    <pre tabIndex={0} aria-label="example" className="mt-2 overflow-x-auto rounded bg-forge-900 p-3 text-xs text-white">
      <code>{children}</code>
    </pre>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mt-8">
      <h2 className="text-lg font-bold">{title}</h2>
      <div className="mt-2 space-y-2 text-sm">{children}</div>
    </section>
  );
}

const ENDPOINTS: [string, string, string, string][] = [
  ["GET", "/api/v1/engines", "viewer", "the team's engines: ?page, ?limit, ?q (name, customer, fuel), ?status"],
  ["GET", "/api/v1/engines/{engineId}", "viewer", "one engine record"],
  ["GET", "/api/v1/engines/{engineId}/plans", "viewer", "its seal plans: ?page, ?limit"],
  [
    "GET",
    "/api/v1/engines/{engineId}/plans/{planId}",
    "viewer",
    "one plan, its clamp-model input and its estimate; ?units words the sentences",
  ],
  ["POST", "/api/v1/estimate", "viewer", "{ input, units? } → the estimate of a plan you send (stores nothing)"],
  ["POST", "/api/v1/sweep", "viewer", "{ input, fromNm, toNm, points? } → one point per torque step (stores nothing)"],
  ["GET", "/api/v1/runs", "viewer", "the run log, newest first: ?engineId, ?kind, ?outcome, ?from, ?to (dates), ?cursor, ?limit"],
  ["POST", "/api/v1/runs", "builder", "log one run"],
  ["GET", "/api/v1/openapi.json", "anyone", "the OpenAPI 3.1 document of all of the above"],
];

export default function ApiDocs({ loaderData }: Route.ComponentProps) {
  const { origin: o, limits } = loaderData;
  return (
    <div className="min-h-screen bg-forge-50">
      <header className="bg-forge-900 px-4 py-3 text-white">
        <Link to="/dashboard" className="flex items-center gap-2 font-bold">
          <img src="/favicon.svg" alt="" className="h-6 w-6" /> Sealwright
        </Link>
      </header>
      <main className="mx-auto max-w-4xl p-4">
        <h1 className="text-2xl font-bold">JSON API, version 1</h1>
        <p className="mt-2 text-sm">
          For dyno software, spreadsheets and scripts beside the app. JSON in and out; SI units, and every field that carries a unit names
          it (<code>torqueNm</code>, <code>boreMm</code>, <code>manifoldPressureKpa</code> absolute, <code>peakCylinderPressureMpa</code>).
          The machine-readable description is{" "}
          <a className="text-copper-700 underline" href="/api/v1/openapi.json">
            /api/v1/openapi.json
          </a>{" "}
          (OpenAPI 3.1).
        </p>
        <Caution className="mt-4" />

        <Section title="Signing requests">
          <p>
            Make a personal token in{" "}
            <Link className="text-copper-700 underline" to="/settings/tokens">
              Settings → API tokens
            </Link>
            . It is shown once; we keep only a hash. It belongs to one shop and acts with the role you give it, never more than your own
            role there (and less if your role is lowered later). Send it on every request:
          </p>
          <Code>{`export SW_TOKEN=swt_…   # from Settings → API tokens
curl -H "Authorization: Bearer $SW_TOKEN" ${o}/api/v1/engines`}</Code>
          <p>
            Revoking a token refuses it from the next request on. The app's own pages use the session cookie instead; a cookie write must
            come from the app's pages (its Origin), a token write need not.
          </p>
        </Section>

        <Section title="Endpoints">
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="endpoints (scrolls sideways)">
            <table className="w-full text-left text-xs">
              <thead>
                <tr>
                  <th scope="col">method</th>
                  <th scope="col">path</th>
                  <th scope="col">least role</th>
                  <th scope="col">what</th>
                </tr>
              </thead>
              <tbody>
                {ENDPOINTS.map(([m, p, r, w]) => (
                  <tr key={m + p} className="border-t border-forge-100 align-top">
                    <td className="font-mono">{m}</td>
                    <td className="font-mono">{p}</td>
                    <td>{r}</td>
                    <td>{w}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p>
            A run: <code>engineId</code>, <code>ranOn</code> (2026-12-01), <code>kind</code> ({RUN_KINDS.join(", ")}), <code>outcome</code>{" "}
            ({RUN_OUTCOMES.join(", ")}), and optionally <code>manifoldPressureKpa</code>, <code>fuel</code>,{" "}
            <code>peakCylinderPressureMpa</code> with <code>peakPressureSource</code> (measured or estimated),{" "}
            <code>cylindersAffected</code> ([1, 4], none above the engine's count), <code>notes</code> and <code>teardownFindings</code>.
          </p>
        </Section>

        <Section title="Examples">
          <Code>{`# the newest engines, two at a time
curl -s -H "Authorization: Bearer $SW_TOKEN" "${o}/api/v1/engines?limit=2"

# one plan with its estimate; keep its clamp-model input
curl -s -H "Authorization: Bearer $SW_TOKEN" ${o}/api/v1/engines/3/plans/7 > plan.json

# the same plan from 60 to 140 N·m in 5 steps
jq '{input: .input, fromNm: 60, toNm: 140, points: 5}' plan.json |
  curl -s -H "Authorization: Bearer $SW_TOKEN" -H 'Content-Type: application/json' \\
       --data @- ${o}/api/v1/sweep | jq '.points[] | {torqueNm, weakestMargin}'

# log a dyno session (builder token)
curl -s -H "Authorization: Bearer $SW_TOKEN" -H 'Content-Type: application/json' \\
     --data '{"engineId":3,"ranOn":"2026-12-01","kind":"dyno","manifoldPressureKpa":250,
              "fuel":"E85","outcome":"held","notes":"demo pull"}' ${o}/api/v1/runs

# read again only when it changed
curl -s -H "Authorization: Bearer $SW_TOKEN" -H 'If-None-Match: "…etag…"' -o /dev/null -w '%{http_code}\\n' ${o}/api/v1/engines/3`}</Code>
        </Section>

        <Section title="Errors">
          <p>
            Every refusal has one body:{" "}
            <code>{`{ "error": "…", "errors": [{ "path": "fromNm", "message": "fromNm cannot be negative" }] }`}</code> (<code>errors</code>{" "}
            on a 400 only). Nothing is written when the answer is 400 or more.
          </p>
          <ul className="list-disc pl-5">
            <li>
              <b>400</b> not JSON, a wrong type, a missing field, an unknown field (the request objects are strict), a bad query value
            </li>
            <li>
              <b>401</b> no token or session, or the token is unknown or revoked
            </li>
            <li>
              <b>403</b> the role is too low (a viewer token logging a run), or a cookie write from another site
            </li>
            <li>
              <b>404</b> no such record in this shop (another shop's records are not found either)
            </li>
            <li>
              <b>405</b> wrong method · <b>413</b> body over {limits.bodyKiB} KiB · <b>415</b> not <code>application/json</code>
            </li>
            <li>
              <b>429</b> too many requests: wait the <code>Retry-After</code> seconds
            </li>
          </ul>
        </Section>

        <Section title="Paging, caching and limits">
          <p>
            Engines and plans page with <code>?page=1&amp;limit=25</code> and answer <code>page</code>, <code>limit</code>,{" "}
            <code>total</code> and <code>nextPage</code> (null on the last). The run log pages by cursor: pass the answer's{" "}
            <code>nextCursor</code> as <code>?cursor=</code>. <code>limit</code> is at most {limits.pageMax}.
          </p>
          <p>
            Reads carry an <code>ETag</code> and <code>Cache-Control: private, no-cache</code>: send the ETag back as{" "}
            <code>If-None-Match</code> and an unchanged answer is a bodiless 304.
          </p>
          <p>
            Each token, and each signed-in person, may make {limits.perMinute} requests a minute; each address {limits.perAddress}. Past
            that the answer is 429 with <code>Retry-After</code>, and the wait doubles with each lock in a day. A sweep reaches at most{" "}
            {limits.sweepMaxNm} N·m in at most {limits.sweepMaxPoints} points.
          </p>
        </Section>
      </main>
    </div>
  );
}
