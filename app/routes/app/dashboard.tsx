import type { Route } from "./+types/dashboard";
import { PageTitle } from "~/components/app-shell";
import { Caution } from "~/components/caution";
import { listAuditEvents, listMembers } from "~/models/team.server";
import { requireUser } from "~/utils/auth.server";

export const meta: Route.MetaFunction = () => [{ title: "Dashboard · Sealwright" }];

export async function loader({ request }: Route.LoaderArgs) {
  const { user, team, role } = await requireUser(request);
  const [members, events] = await Promise.all([listMembers(team.id), listAuditEvents(team.id, 10)]);
  return { user, team, role, memberCount: members.length, events };
}

export default function Dashboard({ loaderData }: Route.ComponentProps) {
  const { user, team, role, memberCount, events } = loaderData;
  return (
    <>
      <PageTitle sub={`Signed in as ${user.name}, ${role} in ${team.name}.`}>{team.name}</PageTitle>
      <div className="grid gap-4 sm:grid-cols-3">
        <Stat label="People in this shop" value={String(memberCount)} />
        <Stat label="Your role" value={role} />
        <Stat label="Display units" value={user.units} />
      </div>
      <section className="mt-8" aria-labelledby="recent">
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
                  {e.action} {e.who ? `· ${e.who}` : ""}
                </span>
                <time className="tabular text-forge-700" dateTime={e.at}>
                  {e.at.slice(0, 16).replace("T", " ")}
                </time>
              </li>
            ))}
          </ul>
        )}
      </section>
      <Caution className="mt-8" />
    </>
  );
}

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded border border-forge-100 bg-white p-4">
      <p className="text-sm text-forge-700">{label}</p>
      <p className="mt-1 text-3xl font-bold capitalize tabular">{value}</p>
    </div>
  );
}
