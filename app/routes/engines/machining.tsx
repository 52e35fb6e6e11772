import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { data, Form } from "react-router";
import type { Route } from "./+types/machining";
import { ScrollTable } from "~/components/scroll-table";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { Button, ErrorSummary, Field, firstErrors, SelectField, TextArea } from "~/components/form";
import { STATUS_LOOK } from "~/components/status-look";
import type { LimitCheck } from "~/lib/clamp";
import { typedFormSchema } from "~/lib/records/form";
import { parseMachiningForm } from "~/lib/records/machining";
import { MACHINING_FIGURES } from "~/lib/records/machining-figures";
import { formatQuantity, unitFor, type UnitSystem } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { createMachining, listMachining, measuredEstimate } from "~/models/machining.server";
import { listPlans } from "~/models/plan.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Machining · Sealwright" }];
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const [plans, records] = await Promise.all([listPlans(team.id, engine.id), listMachining(team.id, engine.id)]);
  const sheets = await Promise.all(
    records.map(async (m) => {
      const plan = plans.find((p) => p.id === m.planId);
      return {
        ...m,
        planName: plan?.name ?? "(archived plan)",
        estimate: plan
          ? await measuredEstimate(team.id, engine, plan, m, user.units)
          : ({ ok: false, problems: ["The plan is archived."] } as const),
      };
    }),
  );
  return {
    units: user.units,
    userName: user.name,
    cylinders: engine.cylinders,
    plans: plans.map((p) => ({ id: p.id, name: p.name })),
    formPlanId: engine.chosenPlanId ?? plans[0]?.id ?? null,
    sheets,
    canEdit: roleAtLeast(role, "builder"),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const plans = await listPlans(team.id, engine.id);
  const schema = typedFormSchema((form) =>
    parseMachiningForm(form, { planIds: plans.map((p) => p.id), cylinders: engine.cylinders, units: user.units }),
  );
  const submission = parseSubmission(await request.formData(), schema);
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  await createMachining(team.id, user.id, engine.id, submission.value);
  return redirectWithToast(request, `/engines/${engine.id}/machining`, "Machining record kept.");
}

function MachiningForm({ d, lastResult }: { d: Route.ComponentProps["loaderData"]; lastResult: SubmissionResult<string[]> | undefined }) {
  const u = d.units;
  // the one form path: the server parses with the schema, Conform carries its answer (values as typed)
  const [form] = useForm<Record<string, string>>({ id: "machining", lastResult, shouldValidate: "onSubmit" });
  const values = (form.initialValue ?? {}) as Record<string, string | undefined>;
  const errors = firstErrors(form.allErrors);
  return (
    <Form
      method="post"
      className="no-print max-w-4xl space-y-3 rounded border border-forge-300 bg-white p-4"
      aria-label="Record machining and measurements"
      {...getFormProps(form)}
    >
      <h3 className="text-lg font-bold">Record machining and measurements</h3>
      <ErrorSummary
        errors={errors}
        message={Object.keys(errors).length ? "The measurements were not recorded: see the fields marked." : null}
        answer={lastResult}
      />
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField
          label="For the plan"
          name="planId"
          defaultValue={values.planId ?? String(d.formPlanId)}
          error={errors.planId}
          options={d.plans.map((p) => [String(p.id), p.name])}
        />
        <Field
          label="Date"
          name="measuredOn"
          type="date"
          defaultValue={values.measuredOn ?? new Date().toISOString().slice(0, 10)}
          error={errors.measuredOn}
        />
        <Field label="Measured by" name="measuredBy" defaultValue={values.measuredBy ?? d.userName} error={errors.measuredBy} />
        {MACHINING_FIGURES.map((f) => (
          <Field
            key={f.name}
            label={`${f.label} (${unitFor(f.quantity, u)})`}
            name={f.name}
            inputMode="decimal"
            defaultValue={values[f.name]}
            error={errors[f.name]}
          />
        ))}
      </div>
      <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-6">
        <legend className="text-sm font-bold">Sleeve protrusion measured per bore ({unitFor("smallLength", u)}), where taken</legend>
        {Array.from({ length: d.cylinders }, (_, i) => (
          <Field
            key={i}
            label={`Bore ${i + 1}`}
            name={`protrusion-${i}`}
            inputMode="decimal"
            defaultValue={values[`protrusion-${i}`]}
            error={errors[`protrusion-${i}`]}
          />
        ))}
      </fieldset>
      <TextArea label="Notes" name="notes" defaultValue={values.notes} error={errors.notes} />
      <Button type="submit">Keep the record</Button>
    </Form>
  );
}

type Sheet = Awaited<ReturnType<typeof loader>>["sheets"][number];

export default function Machining({ loaderData: d, actionData }: Route.ComponentProps) {
  const u = d.units;
  return (
    <section className="space-y-5">
      <h2 className="text-2xl font-bold">Machining and measurement</h2>
      <Caution />
      <p className="max-w-3xl text-sm text-forge-700">
        What the head and deck measured as machined, and the plan's estimate run again with those figures in place of the planned ones. Each
        bore is estimated at its own measured protrusion.
      </p>
      {d.sheets.length === 0 ? <p className="text-sm text-forge-700">No machining record on this engine yet.</p> : null}
      {d.sheets.map((s) => (
        <SheetView key={s.id} sheet={s} units={u} />
      ))}
      {d.canEdit && d.formPlanId !== null ? (
        // a new key after each record kept empties the form; a refusal keeps it
        <MachiningForm key={d.sheets.length} d={d} lastResult={actionData?.result} />
      ) : null}
    </section>
  );
}

function SheetView({ sheet: s, units: u }: { sheet: Sheet; units: UnitSystem }) {
  // a machinist reads a deck to the micrometre: one decimal finer than the usual millimetres
  const fine = (v: number | null) => formatQuantity(v, "smallLength", u, u === "metric" ? { decimals: 3 } : {});
  const figure = (f: (typeof MACHINING_FIGURES)[number], v: number | null) =>
    f.quantity === "smallLength" ? fine(v) : formatQuantity(v, f.quantity, u);
  const e = s.estimate;
  const use = (name: string) => (e.ok ? e.uses.find((x) => x.name === name)?.why : undefined);
  const measuredProtrusions = s.sleeveProtrusionMm.filter((v): v is number => v !== null);
  return (
    <article className="space-y-3 rounded border border-forge-300 bg-white p-3 text-sm" aria-label={`Machining record of ${s.measuredOn}`}>
      <h3 className="font-bold">
        {s.measuredOn} · {s.planName} · by {s.measuredBy}
      </h3>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="as measured (scrolls sideways)">
        <table className="border-collapse tabular">
          <caption className="text-left text-xs text-forge-700">As measured, and what each figure does in the estimate</caption>
          <tbody>
            {MACHINING_FIGURES.map((f) => (
              <tr key={f.name}>
                <th scope="row" className="pr-3 text-left font-medium">
                  {f.label}
                </th>
                <td className="pr-3 text-right">{figure(f, s[f.name])}</td>
                <td className="text-forge-700">{s[f.name] === null ? "not measured" : use(f.name)}</td>
              </tr>
            ))}
            <tr>
              <th scope="row" className="pr-3 text-left font-medium">
                Sleeve protrusion
              </th>
              <td className="pr-3 text-right">
                {measuredProtrusions.length} of {s.sleeveProtrusionMm.length} bores
              </td>
              <td className="text-forge-700">{measuredProtrusions.length === 0 ? "not measured" : use("sleeveProtrusionMm")}</td>
            </tr>
          </tbody>
        </table>
      </div>
      {s.notes ? <p>{s.notes}</p> : null}
      {e.ok ? (
        <>
          <ScrollTable
            region="planned against measured"
            label="Seal margin planned and measured, per cylinder"
            caption="Seal margin per cylinder at the bottom of the preload band, hot and fired: planned, and with the measured figures"
            columns={["Cylinder", "Protrusion planned", "measured", "Margin planned", "measured", "Change"]}
          >
            {e.compare.cylinders.map((c, b) => (
              <tr key={c.cylinder}>
                <td className="px-2">{c.cylinder}</td>
                <td className="px-2 text-right">{fine(e.planned.protrusionMm)}</td>
                <td className="px-2 text-right">{fine(s.sleeveProtrusionMm[b] ?? null)}</td>
                <td className="px-2 text-right">
                  {STATUS_LOOK[c.plannedStatus].icon} {c.planned.toFixed(2)}
                </td>
                <td className="px-2 text-right">
                  {STATUS_LOOK[c.measuredStatus].icon} {c.measured.toFixed(2)}
                </td>
                <td className="px-2 text-right">{`${c.measured >= c.planned ? "+" : ""}${(c.measured - c.planned).toFixed(2)}`}</td>
              </tr>
            ))}
          </ScrollTable>
          <dl className="grid gap-2 sm:grid-cols-2">
            <VerdictBox title="As planned" check={e.compare.planned} />
            <VerdictBox title="As measured" check={e.compare.measured} />
          </dl>
          <p className="text-xs text-forge-700">
            Each verdict carries the worst of all the checks. As measured, the stud, washer, thread and crush checks are taken at their
            worst over the bores' protrusions, which is on the safe side.
          </p>
        </>
      ) : (
        <p className="text-caution">⚠ Not estimated: {e.problems.join(" ")}</p>
      )}
    </article>
  );
}

function VerdictBox({ title, check }: { title: string; check: LimitCheck }) {
  const look = STATUS_LOOK[check.status];
  return (
    <div className={`rounded border p-2 ${look.tone}`}>
      <dt className="font-bold">{title}</dt>
      <dd>
        {look.icon} {look.word}: {check.label.toLowerCase()}, {check.detail}
      </dd>
    </div>
  );
}
