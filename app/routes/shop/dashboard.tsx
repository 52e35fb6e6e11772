import { Link } from "react-router";
import type { Route } from "./+types/dashboard";
import { PageTitle } from "~/components/app-shell";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { StatusBadge } from "~/components/engine-status";
import { layoutName, STATUS_LABEL } from "~/lib/engine/labels";
import { engineStatusCounts, listEngines, type EngineStatus } from "~/models/engine.server";
import { chosenPlanVerdicts } from "~/models/dashboard.server";
import { atRisk } from "~/models/plan-estimate.server";
import { auditSubject, livePlans, recentActivity } from "~/models/team.server";
import { STATUS_LOOK } from "~/components/status-look";
import { requireUser } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Dashboard · Sealwright" }];

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const [counts, recent, rawEvents, verdicts] = await Promise.all([
    engineStatusCounts(who),
    listEngines(who, { sort: "updated", dir: "desc", pageSize: 5 }),
    recentActivity(who, 10),
    chosenPlanVerdicts(who, user.units),
  ]);
  // Activity names the plan it touched and links to it while the plan is still there.
  const subjects = rawEvents.map((e) => auditSubject(e.detail));
  const live = await livePlans(
    team.id,
    subjects.flatMap((s) => (s.planId ? [s.planId] : [])),
  );
  const events = rawEvents.map((e, i) => {
    const s = subjects[i]!;
    const plan = s.planId ? live.get(s.planId) : undefined;
    return {
      id: e.id,
      action: e.action,
      at: e.at,
      who: e.who,
      plan: plan && s.planId ? { name: plan.name, href: `/engines/${plan.engineId}/plans/${s.planId}` } : null,
    };
  });
  return { user, team, role, counts, recent: recent.rows, events, atRisk: verdicts.filter(atRisk) };
}

// The audit trail's actions, in words.
const ACTION_WORDS: Record<string, string> = {
  "team.created": "Shop created",
  "team.renamed": "Shop renamed",
  "demo.seeded": "Demo shop set up",
  "demo.engines-seeded": "Demo engines added",
  "library.seeded": "Handbook library added",
  "engine.created": "Engine added",
  "engine.updated": "Engine edited",
  "engine.archived": "Engine archived",
  "plan.created": "Seal plan created",
  "plan.updated": "Seal plan edited",
  "plan.chosen": "Seal plan chosen",
  "plan.archived": "Seal plan archived",
  "plan.copied": "Seal plan copied",
  "engine.duplicated": "Engine duplicated",
};

function actionWords(action: string): string {
  if (ACTION_WORDS[action]) return ACTION_WORDS[action]!;
  const [thing = action, verb = ""] = action.split(".");
  return `${thing.charAt(0).toUpperCase()}${thing.slice(1)} ${verb}`.trim();
}

const STATUSES: EngineStatus[] = ["quoted", "in-build", "running", "retired"];

export default function Dashboard({ loaderData }: Route.ComponentProps) {
  const { user, team, role, counts, recent, events, atRisk } = loaderData;
  return (
    <>
      <PageTitle sub={`Signed in as ${user.name}, ${role} in ${team.name}.`}>{team.name}</PageTitle>
      <section aria-labelledby="at-risk" className="mb-8" data-testid="at-risk">
        <h2 id="at-risk" className="text-xl font-bold">
          Needs attention
        </h2>
        {atRisk.length === 0 ? (
          <p className="mt-2 text-forge-700">No working engine's chosen plan is short or limited by its stud.</p>
        ) : (
          <ul className="mt-2 divide-y divide-forge-100 rounded border-2 border-failed bg-white">
            {atRisk.map((v) => {
              const look = STATUS_LOOK[v.status];
              return (
                <li key={v.engineId} className="px-4 py-2">
                  <Link to={`/engines/${v.engineId}/plans/${v.planId}`} className="font-medium text-copper-700 underline">
                    {v.engineName}: {v.planName}
                  </Link>
                  <span className="block text-sm">
                    {look.icon} {look.word}: {v.headline}
                  </span>
                </li>
              );
            })}
          </ul>
        )}
      </section>
      <section aria-labelledby="engines-by-status">
        <h2 id="engines-by-status" className="sr-only">
          Engines by status
        </h2>
        <div className="grid grid-cols-2 gap-4 sm:grid-cols-4">
          {STATUSES.map((s) => (
            <Link key={s} to={`/engines?status=${s}`} className="rounded border border-forge-100 bg-white p-4 hover:border-copper-500">
              <p className="text-sm text-forge-700">
                {STATUS_LABEL[s].icon} {STATUS_LABEL[s].word}
              </p>
              <p className="mt-1 text-3xl font-bold tabular">{counts[s]}</p>
            </Link>
          ))}
        </div>
      </section>
      <div className="mt-8 grid gap-8 lg:grid-cols-2">
        <section aria-labelledby="recent-engines">
          <h2 id="recent-engines" className="text-xl font-bold">
            Recently worked on
          </h2>
          {recent.length === 0 ? (
            <p className="mt-2 text-forge-700">
              No engines yet.{" "}
              <Link to="/engines" className="text-copper-700 underline">
                Go to Engines
              </Link>
            </p>
          ) : (
            <ul className="mt-2 divide-y divide-forge-100 rounded border border-forge-100 bg-white">
              {recent.map((e) => (
                <li key={e.id} className="flex flex-wrap items-center justify-between gap-2 px-4 py-2">
                  <span>
                    <Link to={`/engines/${e.id}`} className="font-medium text-copper-700 underline">
                      {e.name}
                    </Link>{" "}
                    <span className="text-sm text-forge-700">
                      {layoutName(e.layout, e.cylinders)} · {e.chosenPlanName ? `plan: ${e.chosenPlanName}` : "no plan chosen"}
                    </span>
                  </span>
                  <StatusBadge status={e.status} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <section aria-labelledby="recent">
          <h2 id="recent" className="text-xl font-bold">
            Recent activity
          </h2>
          {events.length === 0 ? (
            <p className="mt-2 text-forge-700">Nothing recorded yet.</p>
          ) : (
            <ul className="mt-2 divide-y divide-forge-100 rounded border border-forge-100 bg-white">
              {events.map((e) => (
                <li key={e.id} className="flex justify-between gap-4 px-4 py-2 text-sm">
                  <span>
                    {actionWords(e.action)}
                    {e.plan ? (
                      <>
                        {" "}
                        <Link to={e.plan.href} className="text-copper-700 underline">
                          “{e.plan.name}”
                        </Link>
                      </>
                    ) : null}
                    {e.who ? ` · ${e.who}` : ""}
                  </span>
                  <time className="tabular text-forge-700" dateTime={e.at}>
                    {e.at.slice(0, 16).replace("T", " ")}
                  </time>
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
      <Caution className="mt-8" />
    </>
  );
}
