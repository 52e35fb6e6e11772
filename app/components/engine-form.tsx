import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import type { ReactNode } from "react";
import { Form, Link } from "react-router";
import { Button, ErrorSummary, Field, SelectField } from "~/components/form";
import { StudTable } from "~/components/stud-table";
import { MATERIAL_KIND_LABELS } from "~/lib/library/labels";
import { BLANK_STUD_ROW, ENGINE_STATUSES, SLEEVE_KINDS, SLEEVE_LABEL, STATUS_LABEL, type EngineFormValues } from "~/lib/engine";
import { unitFor, type UnitSystem } from "~/lib/units";

export interface MaterialChoice {
  id: number;
  name: string;
  kind: string;
}

interface Props {
  /** The loader's values: the stored engine, or a blank one, in the person's units. */
  defaultValue: EngineFormValues;
  /** The action's last answer (Conform's reply): errors, the values as typed, a changed stud list. */
  result?: SubmissionResult<string[]>;
  materials: MaterialChoice[];
  units: UnitSystem;
  submitLabel: string;
  cancelTo: string;
  /** Shown on edit: archive this engine. */
  canArchive?: boolean;
}

// The engine record form, in the person's units. Works as a plain post without JavaScript: the server
// parses it with the form's schema (Conform), and the stud editor's buttons are Conform list intents
// (add, remove) or a post back ("Generate pattern") that the server answers with the changed rows.
export function EngineForm({ defaultValue, result, materials, units, submitLabel, cancelTo, canArchive }: Props) {
  const [form, fields] = useForm<EngineFormValues>({ id: "engine", defaultValue, lastResult: result, shouldValidate: "onSubmit" });
  const errors: Record<string, string | undefined> = Object.fromEntries(
    Object.entries(form.allErrors).map(([name, list]) => [name, list[0]]),
  );
  const initial = (name: keyof EngineFormValues) => {
    const v = fields[name].initialValue;
    return typeof v === "string" ? v : "";
  };
  const len = unitFor("length", units);
  const small = unitFor("smallLength", units);
  const n = (name: keyof EngineFormValues & string, label: string, extra: Partial<Parameters<typeof Field>[0]> = {}) => (
    <Field label={label} name={name} defaultValue={initial(name)} error={errors[name]} inputMode="decimal" {...extra} />
  );
  const layout = String(fields.layout.value ?? "inline");
  const perBank = Number(fields.cylinders.value ?? "") / (layout === "V" ? 2 : 1);
  const count = Object.keys(errors).filter((k) => k !== "").length;

  return (
    <Form method="post" className="space-y-6" {...getFormProps(form)}>
      <ErrorSummary
        errors={form.allErrors}
        message={count > 0 ? `The engine was not saved: ${count === 1 ? "one field needs" : `${count} fields need`} attention.` : null}
        answer={result}
      />
      <SaveOrCancel submitLabel={submitLabel} cancelTo={cancelTo} />
      <p className="text-sm text-forge-700">
        Figures are in your units ({units === "imperial" ? "inches, thou, psi, °F" : "millimetres, kPa, bar, °C"}). A figure may carry its
        own unit — “3.386 in”, “4 thou”, “230 °F”, “2 bar boost” — and that unit wins; a decimal comma (“86,5”) reads as a point.
      </p>

      <Fieldset legend="The engine">
        <Field label="Name" name="name" defaultValue={initial("name")} error={errors.name} required maxLength={120} />
        <Field label="Customer" name="customer" defaultValue={initial("customer")} error={errors.customer} maxLength={120} />
        <SelectField label="Status" name="status" defaultValue={initial("status")} error={errors.status}>
          {ENGINE_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_LABEL[s].word}
            </option>
          ))}
        </SelectField>
      </Fieldset>

      <Fieldset legend="Layout and geometry">
        <Field
          label="Cylinders"
          name="cylinders"
          defaultValue={initial("cylinders")}
          error={errors.cylinders}
          inputMode="numeric"
          hint="1 to 16; a V needs an even count."
        />
        <SelectField label="Layout" name="layout" defaultValue={initial("layout")} error={errors.layout}>
          <option value="inline">Inline (one bank)</option>
          <option value="V">V (two banks)</option>
        </SelectField>
        {n("boreMm", `Bore (${len})`)}
        {n("strokeMm", `Stroke (${len})`)}
        {n("rodLengthMm", `Rod length (${len}), optional`, { hint: "Centre to centre; longer than half the stroke." })}
        {n("headThicknessAtStudMm", `Head thickness at the stud (${len})`, { hint: "Deck face to the washer seat." })}
        {n("blockDepthToThreadMm", `Block depth to the engaged thread (${len})`, {
          hint: "Deck to the first engaged thread; 0 if the thread starts at the deck.",
        })}
      </Fieldset>

      <Fieldset legend="Materials and sleeves" className="group/sleeves">
        <MaterialSelect
          label="Block (deck) material"
          name="blockMaterialId"
          value={initial("blockMaterialId")}
          error={errors.blockMaterialId}
          materials={materials}
          kinds={CASTING_KINDS}
        />
        <MaterialSelect
          label="Head material"
          name="headMaterialId"
          value={initial("headMaterialId")}
          error={errors.headMaterialId}
          materials={materials}
          kinds={CASTING_KINDS}
        />
        <SelectField label="Sleeves" name="sleeveKind" defaultValue={initial("sleeveKind")} error={errors.sleeveKind}>
          {SLEEVE_KINDS.map((k) => (
            <option key={k} value={k}>
              {SLEEVE_LABEL[k]}
            </option>
          ))}
        </SelectField>
        {/* Shown by CSS from the picked sleeve kind, so they appear before and without JavaScript too;
            the server ignores them for an engine without sleeves. */}
        <div className="group-has-[#f-sleeveKind_option[value=none]:checked]/sleeves:hidden">
          <MaterialSelect
            label="Sleeve material"
            name="sleeveMaterialId"
            value={initial("sleeveMaterialId")}
            error={errors.sleeveMaterialId}
            materials={materials}
            kinds={SLEEVE_KINDS_OF_MATERIAL}
          />
        </div>
        {n("sleeveWallMm", `Sleeve wall at the top (${len})`, {
          className: "group-has-[#f-sleeveKind_option[value=none]:checked]/sleeves:hidden",
        })}
        {n("sleeveSupportLengthMm", `Support length, top to seat (${len})`, {
          className: "hidden group-has-[#f-sleeveKind_option[value=wet-mid]:checked]/sleeves:block",
        })}
        {n("sleeveProtrusionMm", `Sleeve protrusion as machined (${small})`, {
          hint: `Sleeve top above the deck; −0.5 to 1 mm${units === "imperial" ? " (−20 to 39 thou)" : ""}. 0 without sleeves.`,
        })}
      </Fieldset>

      <Fieldset legend="Boost and firing">
        <Field
          label="Fuel"
          name="fuel"
          defaultValue={initial("fuel")}
          error={errors.fuel}
          maxLength={60}
          hint="As the shop names it, e.g. E85, methanol, race gasoline."
        />
        {n("targetManifoldKpa", `Target manifold pressure, absolute (${unitFor("manifold", units).replace(" abs", "")})`, {
          hint:
            units === "imperial"
              ? "Absolute = what the boost gauge reads plus the atmosphere (about 14.7 psi): 20 psi of boost is about 34.7 psi absolute. You may type the boost itself, as “20 psi boost”."
              : "Absolute = what the boost gauge reads plus the atmosphere (about 101 kPa): 200 kPa (2 bar) of boost is about 301 kPa absolute. You may type the boost itself, as “2 bar boost”.",
        })}
        {n("peakPressureMpa", `Peak cylinder pressure (${unitFor("pressure", units)}), optional`, {
          hint: "Leave blank to let each plan estimate it from boost.",
        })}
        <fieldset aria-describedby={errors.peakPressureSource ? "f-peakPressureSource-error" : undefined}>
          <legend className="block text-sm font-medium text-forge-800">That peak pressure is</legend>
          <label className="mt-2 flex items-center gap-2">
            <input type="radio" name="peakPressureSource" value="measured" defaultChecked={initial("peakPressureSource") === "measured"} />{" "}
            measured (pressure trace)
          </label>
          <label className="mt-1 flex items-center gap-2">
            <input type="radio" name="peakPressureSource" value="estimated" defaultChecked={initial("peakPressureSource") !== "measured"} />{" "}
            an estimate
          </label>
          {errors.peakPressureSource ? (
            <p id="f-peakPressureSource-error" className="mt-1 text-sm font-medium text-failed">
              ✖ {errors.peakPressureSource}
            </p>
          ) : null}
        </fieldset>
        {n("pressureRiseFactor", "Pressure-rise factor", {
          hint: "How many times the compression pressure the firing peak reaches, 1 to 10 (3 unless you know better). Used only while the peak pressure is estimated.",
        })}
        {n("runningHeadC", `Running head temperature (${unitFor("temperature", units)})`)}
        {n("runningBlockC", `Running block temperature (${unitFor("temperature", units)})`)}
      </Fieldset>

      <Fieldset legend="Chamber (for compression and quench)">
        {n("chamberCc", "Head chamber volume (cc), optional")}
        {n("pistonVolumeCc", "Piston volume (cc)", { hint: "Dish or valve reliefs positive, dome negative." })}
        {n("deckClearanceMm", `Deck clearance (${small})`, { hint: "Piston below the deck at top centre is positive." })}
      </Fieldset>

      <section className="rounded border border-forge-100 bg-white p-4" aria-labelledby="studs-heading">
        <h2 id="studs-heading" className="text-xl font-bold">
          Stud pattern
        </h2>
        <p className="mt-1 text-sm text-forge-700">
          Each stud's preload is split among the bores it borders; its shares must add up to 1. Generate the usual pattern from the layout,
          then edit shares or add studs (e.g. extra studs in the valley). Shares may be typed as 0.5 or 1/2. Clear a row's cylinders and
          label to drop it.
        </p>
        <div className="mt-3 flex flex-wrap items-end gap-3">
          <Field
            label="Studs per side per bank"
            name="studsPerSide"
            defaultValue={initial("studsPerSide")}
            error={errors.studsPerSide}
            inputMode="numeric"
            placeholder={Number.isInteger(perBank) && perBank > 0 ? String(perBank + 1) : ""}
            hint={Number.isInteger(perBank) && perBank > 0 ? `Blank: ${perBank + 1} (bores per bank + 1).` : "Blank: bores per bank + 1."}
          />
          {/* posted to the server, which answers with the new rows (a Conform update of the list) */}
          <Button type="submit" kind="plain" name="intent" value="pattern" formNoValidate>
            Generate pattern
          </Button>
        </div>
        {errors.studs ? (
          <p id="f-studs" tabIndex={-1} role="alert" className="mt-3 text-sm font-medium text-failed">
            ✖ {errors.studs}
          </p>
        ) : null}
        <StudTable form={form} studs={fields.studs} />
        <Button kind="plain" {...form.insert.getButtonProps({ name: fields.studs.name, defaultValue: BLANK_STUD_ROW })}>
          Add a stud
        </Button>
      </section>

      <Fieldset legend="Notes">
        <div className="md:col-span-2">
          <label htmlFor="f-notes" className="block text-sm font-medium text-forge-800">
            Notes
          </label>
          <textarea
            id="f-notes"
            name="notes"
            rows={5}
            maxLength={4000}
            defaultValue={initial("notes")}
            aria-invalid={errors.notes ? true : undefined}
            aria-describedby={errors.notes ? "f-notes-error" : "f-notes-hint"}
            className="mt-1 block w-full rounded border border-forge-300 bg-white px-3 py-2"
          />
          <p id="f-notes-hint" className="mt-1 text-xs text-forge-700">
            Up to 4000 characters.
          </p>
          {errors.notes ? (
            <p id="f-notes-error" className="mt-1 text-sm font-medium text-failed">
              ✖ {errors.notes}
            </p>
          ) : null}
        </div>
      </Fieldset>

      <SaveOrCancel submitLabel={submitLabel} cancelTo={cancelTo} />
      {canArchive ? (
        <div className="rounded border border-failed/40 bg-white p-4">
          <h2 className="font-bold">Archive this engine</h2>
          <p className="mt-1 text-sm text-forge-700">
            It leaves the engine table and its pages; its plans stay in the database. Unsaved edits above are dropped.
          </p>
          <button
            type="submit"
            name="intent"
            value="archive"
            formNoValidate
            className="mt-3 rounded border border-failed px-4 py-2 font-medium text-failed hover:bg-failed-50"
          >
            Archive engine
          </button>
        </div>
      ) : null}
    </Form>
  );
}

// Save and Cancel, at the top and again at the foot of the long form.
function SaveOrCancel({ submitLabel, cancelTo }: { submitLabel: string; cancelTo: string }) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button type="submit" name="intent" value="save">
        {submitLabel}
      </Button>
      <Link to={cancelTo} className="rounded border border-forge-300 bg-white px-4 py-2 font-medium hover:bg-forge-100">
        Cancel
      </Link>
    </div>
  );
}

function Fieldset({ legend, children, className = "" }: { legend: string; children: ReactNode; className?: string }) {
  return (
    <fieldset className={`min-w-0 rounded border border-forge-100 bg-white p-4 ${className}`}>
      <legend className="px-1 text-xl font-bold">{legend}</legend>
      <div className="grid gap-4 md:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

// Blocks and heads are castings; sleeves are iron or steel. Stud steels, wire and copper stay out of those lists.
const CASTING_KINDS = ["aluminium", "iron", "other"];
const SLEEVE_KINDS_OF_MATERIAL = ["iron", "steel", "other"];

function MaterialSelect({
  label,
  name,
  value,
  error,
  materials: all,
  kinds: allowed,
}: {
  label: string;
  name: string;
  value?: string;
  error?: string;
  materials: MaterialChoice[];
  kinds: string[];
}) {
  // The current choice stays listed even if its kind is not one usually chosen here.
  const materials = all.filter((m) => allowed.includes(m.kind) || String(m.id) === value);
  const kinds = [...new Set(materials.map((m) => m.kind))];
  return (
    <SelectField label={label} name={name} defaultValue={value ?? ""} error={error}>
      <option value="">{materials.length === 0 ? "No materials in the library yet" : "Choose…"}</option>
      {kinds.map((k) => (
        <optgroup key={k} label={MATERIAL_KIND_LABELS[k as keyof typeof MATERIAL_KIND_LABELS] ?? k}>
          {materials
            .filter((m) => m.kind === k)
            .map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
        </optgroup>
      ))}
    </SelectField>
  );
}
