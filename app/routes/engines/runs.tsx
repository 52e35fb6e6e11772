import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link } from "react-router";
import type { Route } from "./+types/runs";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { Button, ErrorSummary, Field, firstErrors, SelectField, TextArea } from "~/components/form";
import { FileList, Uploader } from "~/components/uploader";
import { OUTCOME_LABEL, OUTCOMES, RUN_KIND_LABEL, RUN_KINDS, runFormSchema, selectRuns, type RunSort } from "~/lib/records/run";
import { runQuery } from "~/lib/records/run-query";
import { formatQuantity, unitFor } from "~/lib/units";
import { requireEngine } from "~/models/engine.server";
import { listFiles } from "~/models/files.server";
import { createRun, listRuns } from "~/models/records.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { parseSubmission } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

export const meta: Route.MetaFunction = () => [{ title: "Runs · Sealwright" }];
// peak pressures are shown, some estimated by the model: the page carries the full caution
export const handle = CAUTION_HANDLE;

const today = () => new Date().toISOString().slice(0, 10);

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, team, role, who } = await requireUser(request);
  const engine = await requireEngine(who, params.engineId);
  const url = new URL(request.url);
  const q = runQuery(url.searchParams);
  const [all, files] = await Promise.all([listRuns(team.id, engine.id), listFiles(team.id, engine.id)]);
  const fuels = [...new Set(all.map((r) => r.fuel).filter(Boolean))].sort();
  return {
    units: user.units,
    engine: { id: engine.id, cylinders: engine.cylinders, fuel: engine.fuel },
    runs: selectRuns(all, q.filter, q.sort, q.dir),
    total: all.length,
    fuels,
    query: { kind: q.filter.kind ?? "", outcome: q.filter.outcome ?? "", fuel: q.filter.fuel ?? "", sort: q.sort, dir: q.dir },
    search: url.search,
    files: files.filter((f) => f.runId !== null),
    canEdit: roleAtLeast(role, "builder"),
    values: { ranOn: today(), kind: "dyno", fuel: engine.fuel, outcome: "held" } as Record<string, string>,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team, who } = await requireRole(request, "builder");
  const engine = await requireEngine(who, params.engineId);
  const submission = parseSubmission(await request.formData(), runFormSchema(engine.cylinders, user.units));
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  await createRun(team.id, user.id, engine, submission.value);
  return redirectWithToast(request, `/engines/${engine.id}/runs`, "Run logged.");
}

const SORT_LABEL: Record<RunSort, string> = {
  ranOn: "Date",
  kind: "Kind",
  manifoldPressureKpa: "Manifold",
  peakCylinderPressureMpa: "Peak pressure",
  outcome: "Outcome",
  fuel: "Fuel",
};

export default function Runs({ loaderData: d, actionData }: Route.ComponentProps) {
  // the one form path: the server parses with the schema, Conform carries its answer (values as typed)
  const [form] = useForm<Record<string, string>>({
    id: "log-run",
    defaultValue: d.values,
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const values = (form.initialValue ?? d.values) as Record<string, string | undefined>;
  const errors = firstErrors(form.allErrors);
  const sortLink = (s: RunSort) => {
    const p = new URLSearchParams(d.search);
    p.set("sort", s);
    p.set("dir", d.query.sort === s && d.query.dir === "desc" ? "asc" : "desc");
    return `?${p}`;
  };
  return (
    <section className="space-y-4">
      <h2 className="text-2xl font-bold">Runs</h2>
      <Caution />
      <Form method="get" className="no-print flex flex-wrap items-end gap-3 rounded border border-forge-100 bg-white p-3">
        <FilterSelect
          label="Show kind"
          name="kind"
          value={d.query.kind}
          options={[["", "Any"], ...RUN_KINDS.map((k) => [k, RUN_KIND_LABEL[k]] as [string, string])]}
        />
        <FilterSelect
          label="Show outcome"
          name="outcome"
          value={d.query.outcome}
          options={[["", "Any"], ["failed", "Anything but held"], ...OUTCOMES.map((o) => [o, OUTCOME_LABEL[o]] as [string, string])]}
        />
        <FilterSelect
          label="Show fuel"
          name="fuel"
          value={d.query.fuel}
          options={[["", "Any"], ...d.fuels.map((f) => [f, f] as [string, string])]}
        />
        <input type="hidden" name="sort" value={d.query.sort} />
        <input type="hidden" name="dir" value={d.query.dir} />
        <Button type="submit" kind="plain">
          Filter
        </Button>
        <a href={`/engines/${d.engine.id}/runs.csv${d.search}`} download className="py-2 text-copper-700 underline">
          Export CSV
        </a>
      </Form>
      <p className="text-sm text-forge-700">
        {d.runs.length} of {d.total} runs shown. Peak pressures marked “est.” were estimated by the model from the manifold pressure, not
        measured.
      </p>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="runs (scrolls sideways)">
        <table className="w-full border-collapse bg-white text-sm tabular">
          <caption className="sr-only">The engine's runs</caption>
          <thead className="bg-forge-100">
            <tr>
              {(["ranOn", "kind", "manifoldPressureKpa", "fuel", "peakCylinderPressureMpa", "outcome"] as RunSort[]).map((s) => (
                <th
                  key={s}
                  scope="col"
                  className="px-2 py-2 text-left"
                  aria-sort={d.query.sort === s ? (d.query.dir === "asc" ? "ascending" : "descending") : undefined}
                >
                  <Link to={sortLink(s)} className="underline">
                    {SORT_LABEL[s]}
                    {d.query.sort === s ? (d.query.dir === "asc" ? " ▲" : " ▼") : ""}
                  </Link>
                </th>
              ))}
              <th scope="col" className="px-2 py-2 text-left">
                Cylinders
              </th>
              <th scope="col" className="px-2 py-2 text-left">
                Notes and teardown
              </th>
            </tr>
          </thead>
          <tbody>
            {d.runs.map((r) => (
              <tr key={r.id} className="border-t border-forge-100 align-top">
                <td className="px-2 py-2">{r.ranOn}</td>
                <td className="px-2 py-2">{RUN_KIND_LABEL[r.kind]}</td>
                <td className="px-2 py-2">{r.manifoldPressureKpa === null ? "—" : `${r.manifoldPressureKpa.toFixed(0)} kPa abs`}</td>
                <td className="px-2 py-2">{r.fuel || "—"}</td>
                <td className="px-2 py-2">
                  {formatQuantity(r.peakCylinderPressureMpa, "pressure", d.units)}
                  {r.peakPressureSource === "estimated" && r.peakCylinderPressureMpa !== null ? " est." : ""}
                </td>
                <td className={`px-2 py-2 font-medium ${r.outcome === "held" ? "text-held" : "text-failed"}`}>
                  {r.outcome === "held" ? "✔" : "✖"} {OUTCOME_LABEL[r.outcome]}
                </td>
                <td className="px-2 py-2">{r.cylindersAffected.join(", ") || "—"}</td>
                <td className="max-w-md px-2 py-2">
                  {r.notes ? <p>{r.notes}</p> : null}
                  {r.teardownFindings ? (
                    <p>
                      <strong>Teardown:</strong> {r.teardownFindings}
                    </p>
                  ) : null}
                  <FileList files={d.files.filter((f) => f.runId === r.id)} />
                  {d.canEdit ? (
                    <Uploader
                      engineId={d.engine.id}
                      runId={r.id}
                      returnTo={`/engines/${d.engine.id}/runs`}
                      label="Add a photo to this run"
                    />
                  ) : null}
                </td>
              </tr>
            ))}
            {d.runs.length === 0 ? (
              <tr>
                <td colSpan={8} className="px-2 py-4 text-forge-700">
                  No runs {d.total ? "match these filters" : "logged yet"}.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      {d.canEdit ? (
        <Form method="post" className="no-print max-w-3xl space-y-3 rounded border border-forge-300 bg-white p-4" {...getFormProps(form)}>
          <h3 className="text-lg font-bold">Log a run</h3>
          <ErrorSummary
            errors={errors}
            message={Object.keys(errors).length ? "The run was not logged: see the fields marked." : null}
            answer={actionData?.result}
          />
          <div className="grid gap-3 sm:grid-cols-3">
            <Field label="Date" name="ranOn" type="date" defaultValue={values.ranOn} error={errors.ranOn} />
            <SelectField
              label="Kind"
              name="kind"
              defaultValue={values.kind}
              error={errors.kind}
              options={RUN_KINDS.map((k) => [k, RUN_KIND_LABEL[k]])}
            />
            <Field label="Fuel" name="fuel" defaultValue={values.fuel} error={errors.fuel} />
            <Field
              label={`Manifold pressure (${unitFor("manifold", d.units)})`}
              name="manifoldPressureKpa"
              inputMode="decimal"
              defaultValue={values.manifoldPressureKpa}
              error={errors.manifoldPressureKpa}
              hint="Absolute, or boost with a g after it (e.g. 1.4 bar g, 20 psi g)."
            />
            <Field
              label={`Peak cylinder pressure, measured (${unitFor("pressure", d.units)})`}
              name="peakCylinderPressureMpa"
              inputMode="decimal"
              defaultValue={values.peakCylinderPressureMpa}
              error={errors.peakCylinderPressureMpa}
              hint="Leave empty and the model estimates it from the manifold pressure (marked est.)."
            />
            <SelectField
              label="Outcome"
              name="outcome"
              defaultValue={values.outcome}
              error={errors.outcome}
              options={OUTCOMES.map((o) => [o, OUTCOME_LABEL[o]])}
            />
            <Field
              label="Cylinders affected"
              name="cylindersAffected"
              defaultValue={values.cylindersAffected}
              error={errors.cylindersAffected}
              hint={`Numbers 1–${d.engine.cylinders}, e.g. "3, 4".`}
            />
          </div>
          <TextArea label="Ignition and notes" name="notes" defaultValue={values.notes} error={errors.notes} />
          <TextArea
            label="Teardown findings"
            name="teardownFindings"
            defaultValue={values.teardownFindings}
            error={errors.teardownFindings}
          />
          <Button type="submit">Log the run</Button>
        </Form>
      ) : null}
    </section>
  );
}

// The filter's selects share their names with the log form's fields: their own ids keep the labels apart.
function FilterSelect({ label, name, value, options }: { label: string; name: string; value: string; options: [string, string][] }) {
  return (
    <div>
      <label htmlFor={`filter-${name}`} className="block text-sm font-medium text-forge-800">
        {label}
      </label>
      <select
        id={`filter-${name}`}
        name={name}
        defaultValue={value}
        className="mt-1 block w-full rounded border border-forge-300 bg-white px-3 py-2 text-base"
      >
        {options.map(([v, t]) => (
          <option key={v} value={v}>
            {t}
          </option>
        ))}
      </select>
    </div>
  );
}
