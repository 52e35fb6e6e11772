import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import type { Route } from "./+types/assembly";
import { ScrollTable } from "~/components/scroll-table";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { Button, ErrorSummary, Field, firstErrors, SelectField, TextArea } from "~/components/form";
import { FileList, Uploader } from "~/components/uploader";
import { parseAssemblyForm } from "~/lib/records/assembly";
import { typedFormSchema } from "~/lib/records/form";
import { formatQuantity, inputValue, unitFor, type UnitSystem } from "~/lib/units";
import { assemblyReadings, learnedFrictions } from "~/models/assembly-readings.server";
import { requireEngine } from "~/models/engine.server";
import { listFiles } from "~/models/files.server";
import { listPlans } from "~/models/plan.server";
import { createAssembly, listAssemblies } from "~/models/records.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Assembly · Sealwright" }];
export const handle = CAUTION_HANDLE;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const [plans, assemblies, files, learned] = await Promise.all([
    listPlans(team.id, engine.id),
    listAssemblies(team.id, engine.id),
    listFiles(team.id, engine.id),
    learnedFrictions(team.id),
  ]);
  const readings = await assemblyReadings(team.id, engine, assemblies, plans);
  const wanted = Number(new URL(request.url).searchParams.get("planId"));
  const formPlan = plans.find((p) => p.id === wanted) ?? plans.find((p) => p.id === engine.chosenPlanId) ?? plans[0] ?? null;
  return {
    units: user.units,
    userName: user.name,
    engine: { id: engine.id },
    plans: plans.map((p) => ({ id: p.id, name: p.name, lubricant: p.lubricant, stagesNm: p.stagesNm, fastenerId: p.fastenerId })),
    formPlanId: formPlan?.id ?? null,
    studLabels: engine.studs.map((s, i) => s.label ?? `S${i + 1}`),
    assemblies: assemblies.map((a) => ({
      ...a,
      reading: readings.find((r) => r.assemblyId === a.id)!,
      planName: plans.find((p) => p.id === a.planId)?.name ?? "(archived plan)",
    })),
    files: files.filter((f) => f.assemblyId !== null),
    learned: learned.filter((l) => plans.some((p) => p.fastenerId === l.fastenerId)),
    canEdit: roleAtLeast(role, "builder"),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const plans = await listPlans(team.id, engine.id);
  const formData = await request.formData();
  const plan = plans.find((p) => p.id === Number(formData.get("planId")));
  const schema = typedFormSchema((form) =>
    parseAssemblyForm(form, {
      planIds: plans.map((p) => p.id),
      stagesNm: plan?.stagesNm ?? [],
      studLabels: engine.studs.map((s, i) => s.label ?? `S${i + 1}`),
      units: user.units,
    }),
  );
  const submission = parseSubmission(formData, schema);
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  await createAssembly(team.id, user.id, engine.id, submission.value);
  return redirectWithToast(request, `/engines/${engine.id}/assembly`, "Assembly recorded.");
}

const pct = (x: number | null) => (x === null ? "—" : `${x >= 0 ? "+" : ""}${(x * 100).toFixed(0)} %`);

export default function Assembly({ loaderData: d, actionData }: Route.ComponentProps) {
  const u = d.units;
  return (
    <section className="space-y-5">
      <h2 className="text-2xl font-bold">Assembly</h2>
      <Caution />
      <div>
        <h3 className="text-lg font-bold">Torque procedure checklists</h3>
        <ul className="list-disc pl-5">
          {d.plans.map((p) => (
            <li key={p.id}>
              <Link to={`/engines/${d.engine.id}/plans/${p.id}/checklist`} className="text-copper-700 underline">
                {p.name}
              </Link>
            </li>
          ))}
          {d.plans.length === 0 ? <li>No seal plans yet.</li> : null}
        </ul>
      </div>
      <div className="space-y-3">
        <h3 className="text-lg font-bold">Recorded assemblies ({d.assemblies.length})</h3>
        {d.assemblies.length === 0 ? <p className="text-sm text-forge-700">No assembly recorded on this engine yet.</p> : null}
        {d.assemblies.map((a) => (
          <article key={a.id} className="rounded border border-forge-300 bg-white p-3 text-sm" aria-label={`Assembly of ${a.assembledOn}`}>
            <h4 className="font-bold">
              {a.assembledOn} · {a.planName} · by {a.assembledBy}
            </h4>
            <p>
              Lubricant: {a.lubricant || "—"} · Protrusion measured: {formatQuantity(a.measuredProtrusionMm, "smallLength", u)} · Gasket
              compressed: {formatQuantity(a.gasketCompressedMm, "smallLength", u)}
            </p>
            <p className="tabular">
              Stages as done:{" "}
              {a.stagesDone
                .map(
                  (s, i) =>
                    `${i + 1}: ${formatQuantity(s.targetNm, "torque", u)} → ${s.reachedNm === null ? "—" : formatQuantity(s.reachedNm, "torque", u)}${s.angleDeg ? ` + ${s.angleDeg}°` : ""}`,
                )
                .join(" · ") || "—"}
            </p>
            {a.reading.studs.length ? (
              <ScrollTable
                className="mt-2"
                region="stages and studs"
                caption={
                  <>
                    Measured stretch → preload through the model's stud stiffness (
                    {a.reading.studStiffnessNPerMm ? `${(a.reading.studStiffnessNPerMm / 1000).toFixed(0)} kN/mm` : "—"}), beside what the
                    torque reached predicted
                  </>
                }
                columns={["Stud", "Stretch", "Implied preload", "Predicted from torque", "Difference"]}
              >
                {a.reading.studs.map((s) => (
                  <tr key={s.label}>
                    <td className="px-2">{s.label}</td>
                    <td className="px-2 text-right">{formatQuantity(s.stretchMm, "smallLength", u, { decimals: 3 })}</td>
                    <td className="px-2 text-right">{formatQuantity(s.impliedPreloadN, "force", u)}</td>
                    <td className="px-2 text-right">{formatQuantity(s.predictedPreloadN, "force", u)}</td>
                    <td className="px-2 text-right">{pct(s.difference)}</td>
                  </tr>
                ))}
              </ScrollTable>
            ) : null}
            {a.reading.problem ? <p className="text-caution">⚠ {a.reading.problem}</p> : null}
            {a.notes ? <p className="mt-1">{a.notes}</p> : null}
            <FileList files={d.files.filter((f) => f.assemblyId === a.id)} />
            {d.canEdit ? (
              <Uploader
                engineId={d.engine.id}
                assemblyId={a.id}
                returnTo={`/engines/${d.engine.id}/assembly`}
                label="Add a photo of this assembly"
              />
            ) : null}
          </article>
        ))}
      </div>
      <LearnedFriction learned={d.learned} units={u} />
      {d.canEdit && d.formPlanId !== null ? (
        // a new key after each assembly recorded (or another plan's stages asked for) empties the form; a refusal keeps it
        <AssemblyForm key={`${d.formPlanId}-${d.assemblies.length}`} d={d} lastResult={actionData?.result} />
      ) : null}
    </section>
  );
}

type LoaderData = Route.ComponentProps["loaderData"];

function AssemblyForm({ d, lastResult }: { d: LoaderData; lastResult: SubmissionResult<string[]> | undefined }) {
  const u = d.units;
  // the one form path: the server parses with the schema, Conform carries its answer (values as typed)
  const [form] = useForm<Record<string, string>>({ id: "assembly", lastResult, shouldValidate: "onSubmit" });
  const values = (form.initialValue ?? {}) as Record<string, string | undefined>;
  const errors = firstErrors(form.allErrors);
  const formPlan = d.plans.find((p) => p.id === Number(values.planId)) ?? d.plans.find((p) => p.id === d.formPlanId)!;
  return (
    <Form
      method="post"
      className="no-print max-w-4xl space-y-3 rounded border border-forge-300 bg-white p-4"
      aria-label="Record an assembly"
      {...getFormProps(form)}
    >
      <h3 className="text-lg font-bold">Record an assembly</h3>
      <ErrorSummary
        errors={errors}
        message={Object.keys(errors).length ? "The assembly was not recorded: see the fields marked." : null}
        answer={lastResult}
      />
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField
          label="Plan installed"
          name="planId"
          defaultValue={String(formPlan.id)}
          error={errors.planId}
          options={d.plans.map((p) => [String(p.id), p.name])}
        />
        <Field
          label="Date"
          name="assembledOn"
          type="date"
          defaultValue={values.assembledOn ?? new Date().toISOString().slice(0, 10)}
          error={errors.assembledOn}
        />
        <Field label="Assembled by" name="assembledBy" defaultValue={values.assembledBy ?? d.userName} error={errors.assembledBy} />
        <Field label="Lubricant used" name="lubricant" defaultValue={values.lubricant ?? formPlan.lubricant} error={errors.lubricant} />
        <Field
          label={`Protrusion measured (${unitFor("smallLength", u)})`}
          name="measuredProtrusionMm"
          inputMode="decimal"
          defaultValue={values.measuredProtrusionMm}
          error={errors.measuredProtrusionMm}
        />
        <Field
          label={`Gasket compressed thickness (${unitFor("smallLength", u)})`}
          name="gasketCompressedMm"
          inputMode="decimal"
          defaultValue={values.gasketCompressedMm}
          error={errors.gasketCompressedMm}
        />
      </div>
      <p className="text-xs text-forge-700">
        The stages below are those of “{formPlan.name}”. For another plan's stages, open the form with it:{" "}
        {d.plans
          .filter((p) => p.id !== formPlan.id)
          .map((p) => (
            <Link key={p.id} to={`?planId=${p.id}`} className="mr-2 underline">
              {p.name}
            </Link>
          ))}
      </p>
      {/* another plan's stages are other fields */}
      <fieldset key={formPlan.id} className="grid gap-3 sm:grid-cols-3">
        <legend className="text-sm font-bold">Tightening as done ({unitFor("torque", u)} reached, or the angle turned)</legend>
        {formPlan.stagesNm.map((s, i) => (
          <div key={i} className="flex gap-2">
            <Field
              label={`Stage ${i + 1} (plan ${formatQuantity(s, "torque", u)}) reached`}
              name={`stage-${i}-reached`}
              inputMode="decimal"
              defaultValue={values[`stage-${i}-reached`] ?? inputValue(s, "torque", u)}
              error={errors[`stage-${i}-reached`]}
            />
            <Field
              label="Angle (°)"
              name={`stage-${i}-angle`}
              inputMode="decimal"
              defaultValue={values[`stage-${i}-angle`]}
              error={errors[`stage-${i}-angle`]}
            />
          </div>
        ))}
      </fieldset>
      <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-6">
        <legend className="text-sm font-bold">Stud stretch measured at the last stage ({unitFor("smallLength", u)}), where taken</legend>
        {d.studLabels.map((label, i) => (
          <Field
            key={i}
            label={label}
            name={`stretch-${i}`}
            inputMode="decimal"
            defaultValue={values[`stretch-${i}`]}
            error={errors[`stretch-${i}`]}
          />
        ))}
      </fieldset>
      <TextArea label="Notes" name="notes" defaultValue={values.notes} error={errors.notes} />
      <Button type="submit">Record the assembly</Button>
      <p className="text-xs text-forge-700">Photos are added to the assembly once it is recorded.</p>
    </Form>
  );
}

function LearnedFriction({ learned, units }: { learned: Awaited<ReturnType<typeof loader>>["learned"]; units: UnitSystem }) {
  if (learned.length === 0) return null;
  return (
    <div>
      <h3 className="text-lg font-bold">The shop's own friction, learned</h3>
      <p className="text-sm text-forge-700">
        From assemblies where stretch was measured at a known torque, per fastener and lubricant. It never replaces the maker's torque; it
        shows how far the preload at that torque may differ from the handbook friction.
      </p>
      <ul className="mt-2 space-y-1 text-sm">
        {learned.map((l) => (
          <li key={`${l.fastenerId}-${l.lubricant}`}>
            <strong>{l.fastenerName}</strong> with “{l.lubricant}”:{" "}
            {l.learned.ok ? (
              <>
                friction {l.learned.friction.toFixed(3)} ± {l.learned.frictionSpread.toFixed(3)} (nut factor{" "}
                {l.learned.nutFactor.toFixed(3)} ± {l.learned.nutFactorSpread.toFixed(3)}), from {l.learned.count} of your assemblies.
                {l.shift
                  ? ` At ${l.shift.fromMaker ? "the maker's" : "the plan's"} ${formatQuantity(l.shift.torqueNm, "torque", units)}: ${formatQuantity(l.shift.learnedN, "force", units)} per stud against ${formatQuantity(l.shift.handbookN, "force", units)} with the handbook friction (${pct(l.shift.change)}).`
                  : ""}
              </>
            ) : (
              <span className="text-forge-700">not learned yet — {l.learned.reason}</span>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
