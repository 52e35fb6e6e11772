import { data, Form, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/team";
import { PageTitle } from "~/components/app-shell";
import { Button, Field, fieldErrors } from "~/components/form";
import { listMembers, renameTeam } from "~/models/team.server";
import { requireRole } from "~/utils/auth.server";
import { flashToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Team · Sealwright" }];

const TeamNameSchema = z.object({
  name: z.string().trim().min(1, "Name the shop").max(120, "Keep the shop name under 120 characters"),
});

export async function loader({ request }: Route.LoaderArgs) {
  const { team } = await requireRole(request, "owner");
  return { team, members: await listMembers(team.id) };
}

export async function action({ request }: Route.ActionArgs) {
  const { team, user } = await requireRole(request, "owner");
  const parsed = TeamNameSchema.safeParse(Object.fromEntries(await request.formData()));
  if (!parsed.success) return data({ errors: fieldErrors(parsed.error.issues) }, { status: 400 });
  await renameTeam(team.id, parsed.data.name, user.id);
  return redirect("/team", { headers: { "Set-Cookie": await flashToast(request, { kind: "done", message: "Shop renamed." }) } });
}

export default function TeamPage({ loaderData, actionData }: Route.ComponentProps) {
  const { team, members } = loaderData;
  return (
    <>
      <PageTitle sub="Who works in this shop and what they may do.">Team</PageTitle>
      <table className="w-full max-w-3xl border-collapse bg-white text-left">
        <caption className="sr-only">Members of {team.name}</caption>
        <thead className="bg-forge-100 text-sm">
          <tr>
            <th scope="col" className="px-3 py-2">Name</th>
            <th scope="col" className="px-3 py-2">E-mail</th>
            <th scope="col" className="px-3 py-2">Role</th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => (
            <tr key={m.userId} className="border-t border-forge-100">
              <td className="px-3 py-2">{m.name}</td>
              <td className="px-3 py-2">{m.email}</td>
              <td className="px-3 py-2 capitalize">{m.role}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-6">
        {/* a plain link: the browser saves the file */}
        <a href="/team/export" className="text-copper-700 underline" download>
          Download the shop's data (JSON)
        </a>{" "}
        <span className="text-sm text-forge-700">— engines, plans, libraries and the activity log, for your own backup.</span>
      </p>
      <Form method="post" className="mt-8 flex max-w-xl items-end gap-3">
        <Field className="flex-1" label="Shop name" name="name" defaultValue={team.name} error={actionData?.errors?.name} />
        <Button type="submit">Rename</Button>
      </Form>
    </>
  );
}
