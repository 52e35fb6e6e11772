import { getFormProps, useForm } from "@conform-to/react";
import { data, Form, Link, useNavigation } from "react-router";
import type { Route } from "./+types/edit";
import { Caution, CAUTION_HANDLE } from "~/components/caution";
import { Button, ErrorSummary, Field, SelectField } from "~/components/form";
import { ItemFiles } from "~/components/item-files";
import { TYPICAL_GASKETS } from "~/lib/clamp/gasket-families";
import { sourceLine } from "~/lib/library/display";
import {
  FASTENER_FRICTION_FIELDS,
  FASTENER_GEOMETRY_FIELDS,
  FASTENER_MAKER_FIELDS,
  formValues,
  GASKET_NUMBER_FIELDS,
  MATERIAL_NUMBER_FIELDS,
  libraryDefaults,
  libraryFormSchema,
  typicalGasketType,
  type NumberField,
} from "~/lib/library/fields";
import { unitFor, type UnitSystem } from "~/lib/units";
import {
  GASKET_TYPE_LABELS,
  isLibraryKind,
  LIBRARY_GASKET_TYPES,
  MATERIAL_KIND_LABELS,
  MATERIAL_KINDS,
  type LibraryKind,
} from "~/lib/library/labels";
import {
  createLibraryItem,
  getMaterial,
  listMaterials,
  requireLibraryItem,
  setLibraryArchived,
  updateLibraryItem,
} from "~/models/library.server";
import { libraryOwner, listFiles } from "~/models/files.server";
import { requireRole, requireUser, roleAtLeast } from "~/utils/auth.server";
import { parseSubmission, readIntent } from "~/utils/conform.server";
import { redirectWithToast } from "~/utils/toast.server";

// One module for two routes: "library-new" (:kind/new) and "library-edit" (:kind/:itemId).

const SINGULAR: Record<LibraryKind, string> = { fasteners: "fastener", gaskets: "gasket", materials: "material" };

export const meta: Route.MetaFunction = ({ params }) => {
  const kind = params.kind as LibraryKind;
  const what = SINGULAR[kind] ?? "library item";
  return [{ title: `${"itemId" in params && params.itemId ? "Edit" : "New"} ${what} · Sealwright` }];
};

// this page shows the full caution beside its figures (the footer leaves it out)
export const handle = CAUTION_HANDLE;

function kindOf(param: string | undefined): LibraryKind {
  if (!isLibraryKind(param)) throw data("There is no such library.", { status: 404 });
  return param;
}

const itemIdOf = (params: Record<string, string | undefined>) => params.itemId;

export async function loader({ request, params }: Route.LoaderArgs) {
  const itemId = itemIdOf(params);
  // Everyone in the shop may read a library row; adding one needs a builder.
  const { user, team, role } = itemId ? await requireUser(request) : await requireRole(request, "builder");
  const kind = kindOf(params.kind);
  const units = user.units;
  const item = itemId ? await requireLibraryItem(kind, team.id, itemId) : null;
  const materials =
    kind === "fasteners"
      ? (await listMaterials(team.id, { includeArchived: true }))
          .filter((m) => !m.archivedAt || (item && "materialId" in item && item.materialId === m.id))
          .map((m) => ({ id: m.id, name: m.name, kind: m.kind }))
      : [];
  return {
    kind,
    units,
    canEdit: roleAtLeast(role, "builder"),
    materials,
    item: item
      ? { id: item.id, name: item.name, archived: Boolean(item.archivedAt), provenance: sourceLine(item), seeded: Boolean(item.source) }
      : null,
    values: item
      ? formValues(kind, item as unknown as Record<string, unknown>, units)
      : libraryDefaults(kind, new URL(request.url).searchParams.get("type"), units),
    typicalFor: !item && kind === "gaskets" ? typicalGasketType(new URL(request.url).searchParams.get("type")) : null,
    files: item && kind !== "materials" ? await listFiles(team.id, libraryOwner(kind, item.id)) : [],
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, team } = await requireRole(request, "builder");
  const kind = kindOf(params.kind);
  const itemId = itemIdOf(params);
  // Another team's row is a 404 before anything is read from the form.
  const item = itemId ? await requireLibraryItem(kind, team.id, itemId) : null;
  const formData = await request.formData();
  const intent = readIntent(formData, ["save", "archive", "unarchive"], "save");
  const back = `/libraries/${kind}`;
  const done = (message: string, to = back) => redirectWithToast(request, to, message);

  if (intent === "archive" || intent === "unarchive") {
    if (!item) throw data("Save it first; only a saved row can be archived.", { status: 400 });
    await setLibraryArchived(kind, team.id, item.id, user.id, intent === "archive");
    return done(
      intent === "archive" ? `Archived “${item.name}”. It no longer appears in pickers.` : `“${item.name}” is back in the library.`,
    );
  }

  const submission = parseSubmission(formData, libraryFormSchema(kind, user.units));
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: submission.status === "error" ? 400 : 200 });
  const value = submission.value;
  if ("materialId" in value && !(await getMaterial(team.id, value.materialId)))
    return data({ result: submission.reply({ fieldErrors: { materialId: ["Pick one of this shop's materials"] } }) }, { status: 400 });
  if (item) {
    await updateLibraryItem(kind, team.id, item.id, user.id, value);
    return done(`Saved “${value.name}”.`);
  }
  await createLibraryItem(kind, team.id, user.id, value);
  return done(`Added “${value.name}” to the ${kind}.`);
}

export default function LibraryEdit({ loaderData, actionData }: Route.ComponentProps) {
  const { kind, units, materials, item, canEdit, typicalFor } = loaderData;
  // the one form path: the server parses with the schema, Conform carries its answer (values as typed)
  const [form] = useForm<Record<string, string>>({
    id: `library-${kind}`,
    defaultValue: loaderData.values,
    lastResult: actionData?.result,
    shouldValidate: "onSubmit",
  });
  const values = (form.initialValue ?? loaderData.values) as Record<string, string>;
  const errors: Record<string, string> = Object.fromEntries(
    Object.entries(form.allErrors).flatMap(([name, list]) => (list[0] ? [[name, list[0]]] : [])),
  );
  const busy = useNavigation().state === "submitting";
  const what = SINGULAR[kind];
  const count = Object.keys(errors).length;
  const props = { values, errors, units };
  return (
    <section aria-labelledby="edit-heading" className="max-w-4xl">
      <p className="mb-2 text-sm">
        <Link to={`/libraries/${kind}`} className="text-copper-700 underline">
          ← All {kind}
        </Link>
      </p>
      <h2 id="edit-heading" className="text-2xl font-bold">
        {item ? `${canEdit ? "Edit " : ""}${what}: ${item.name}` : `New ${what}`}
        {item?.archived ? <span className="ml-2 rounded border border-forge-300 px-1 text-sm font-normal">⊘ Archived</span> : null}
      </h2>
      <p className="mb-4 text-sm text-forge-700">
        {item ? <>Source: {item.provenance}. </> : null}
        Figures in your units ({units}); the shop's data is stored in SI.
      </p>
      <Caution className="mb-4" />
      <ErrorSummary
        errors={errors}
        message={count > 0 ? `Nothing was saved: ${count === 1 ? "one field needs" : `${count} fields need`} attention.` : null}
        answer={actionData?.result}
      />

      <Form method="post" className="mt-4" {...getFormProps(form)}>
        <fieldset disabled={!canEdit} className="space-y-6">
          <legend className="sr-only">{canEdit ? `Edit the ${what}` : `The ${what} (read only)`}</legend>
          <Field label="Name" name="name" defaultValue={values.name ?? ""} error={errors.name} required maxLength={120} />
          {kind === "materials" ? (
            <>
              <SelectField
                name="kind"
                label="Kind"
                defaultValue={values.kind}
                error={errors.kind}
                options={MATERIAL_KINDS.map((k) => [k, MATERIAL_KIND_LABELS[k]])}
              />
              <Grid fields={MATERIAL_NUMBER_FIELDS} {...props} />
            </>
          ) : null}
          {kind === "gaskets" ? (
            <>
              {!item ? (
                <div className="rounded border border-forge-300 bg-white p-3 text-sm" data-testid="typical">
                  <p className="font-medium">Start from typical figures for a family:</p>
                  <p className="mt-1 flex flex-wrap gap-3">
                    {LIBRARY_GASKET_TYPES.map((t) => (
                      <Link key={t} to={`?type=${t}`} className="text-copper-700 underline">
                        {GASKET_TYPE_LABELS[t]}
                      </Link>
                    ))}
                  </p>
                  {typicalFor ? (
                    <p className="mt-2 rounded border border-caution bg-caution-50 px-2 py-1" role="note">
                      ⚠ Typical figures for {TYPICAL_GASKETS[typicalFor].label.toLowerCase()} — replace each with the gasket maker's figure.{" "}
                      {TYPICAL_GASKETS[typicalFor].notes}
                    </p>
                  ) : null}
                </div>
              ) : null}
              <SelectField
                name="type"
                label="Type"
                defaultValue={values.type}
                error={errors.type}
                options={LIBRARY_GASKET_TYPES.map((t) => [t, GASKET_TYPE_LABELS[t]])}
              />
              <Grid fields={GASKET_NUMBER_FIELDS} {...props} />
            </>
          ) : null}
          {kind === "fasteners" ? (
            <>
              <fieldset className="rounded border-2 border-copper-600 bg-copper-50 p-4">
                <legend className="px-1 text-lg font-bold">From the fastener maker's sheet</legend>
                <p className="mb-3 text-sm">
                  Record the maker's own torque, lubricant, stages and stretch exactly as the sheet gives them. Wherever our estimate shows
                  a torque, these figures stand beside it, and they govern.
                </p>
                <div className="grid gap-4 sm:grid-cols-2">
                  <NumberInput field={FASTENER_MAKER_FIELDS[0]!} {...props} />
                  <Field
                    label="Maker's lubricant"
                    name="makerLubricant"
                    defaultValue={values.makerLubricant ?? ""}
                    error={errors.makerLubricant}
                    maxLength={120}
                  />
                  <Field
                    label="Maker's stages"
                    name="makerStages"
                    defaultValue={values.makerStages ?? ""}
                    error={errors.makerStages}
                    maxLength={200}
                    hint="As the sheet words it, e.g. “40, 80, then 115 lbf·ft, centre outward”."
                  />
                  <NumberInput field={FASTENER_MAKER_FIELDS[1]!} {...props} />
                </div>
                <p className="mt-3 text-sm text-forge-700">Keep the maker's sheet itself below the form, once the fastener is saved.</p>
              </fieldset>
              <fieldset className="rounded border border-forge-300 bg-white p-4">
                <legend className="px-1 font-bold">Thread, shank and washer</legend>
                <div className="mb-4 grid gap-4 sm:grid-cols-2">
                  <SelectField
                    name="threadSystem"
                    label="Thread system"
                    defaultValue={values.threadSystem}
                    error={errors.threadSystem}
                    options={[
                      ["unified", "Unified inch (UNF/UNC)"],
                      ["metric", "Metric (ISO)"],
                    ]}
                  />
                  <SelectField
                    name="materialId"
                    label="Stud material"
                    defaultValue={values.materialId}
                    error={errors.materialId}
                    options={[["", "Pick a material…"], ...materials.map((m): [string, string] => [String(m.id), m.name])]}
                  />
                </div>
                <Grid fields={FASTENER_GEOMETRY_FIELDS} {...props} />
              </fieldset>
              <fieldset className="rounded border border-forge-300 bg-white p-4">
                <legend className="px-1 font-bold">Friction for our estimate</legend>
                <Grid fields={FASTENER_FRICTION_FIELDS} {...props} />
              </fieldset>
            </>
          ) : null}
        </fieldset>
        {canEdit ? (
          <div className="mt-6 flex flex-wrap items-center gap-3 border-t border-forge-100 pt-4">
            <Button type="submit" name="intent" value="save" disabled={busy}>
              {item ? "Save" : `Add ${what}`}
            </Button>
            {item ? (
              <Button
                type="submit"
                kind="plain"
                name="intent"
                value={item.archived ? "unarchive" : "archive"}
                formNoValidate
                disabled={busy}
              >
                {item.archived ? "Bring back from archive" : "Archive"}
              </Button>
            ) : null}
            <Link to={`/libraries/${kind}`} className="text-copper-700 underline">
              Cancel
            </Link>
          </div>
        ) : (
          <p className="mt-4 text-sm text-forge-700">You can read the shop's library; builders and owners change it.</p>
        )}
      </Form>
      {item && kind !== "materials" ? <ItemFiles kind={kind} itemId={item.id} files={loaderData.files} canEdit={canEdit} /> : null}
    </section>
  );
}

interface InputProps {
  values: Record<string, string>;
  errors: Record<string, string>;
  units: UnitSystem;
}

function Grid({ fields, ...props }: InputProps & { fields: NumberField[] }) {
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {fields.map((f) => (
        <NumberInput key={f.name} field={f} {...props} />
      ))}
    </div>
  );
}

function NumberInput({ field, values, errors, units }: InputProps & { field: NumberField }) {
  const unit = field.special === "pitch" ? "" : unitFor(field.quantity, units);
  const label = `${field.label}${unit ? ` (${unit})` : ""}${field.optional ? " — optional" : ""}`;
  return (
    <Field
      label={label}
      name={field.name}
      inputMode="decimal"
      autoComplete="off"
      defaultValue={values[field.name] ?? ""}
      error={errors[field.name]}
      hint={field.hint}
    />
  );
}
