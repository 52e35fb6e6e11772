import type { FormMetadata } from "@conform-to/react";
import { useState, type ChangeEvent } from "react";
import { followFastener, lubricantWarning, type MakerFigures } from "~/lib/plan/fastener-figures";
import { gasketsByFit } from "~/lib/plan/parts";
import {
  METHOD_HELP,
  METHOD_LABEL,
  PLAN_FORM_FIELDS,
  WIRE_LABEL,
  type PlanFormField,
  type PlanFormValues,
  type PlanWrite,
} from "~/lib/plan/form-fields";
import type { StretchLine } from "~/lib/plan/stretch";
import { formatQuantity, toDisplay, unitFor, type UnitSystem } from "~/lib/units";
import { Button, Field, SelectField } from "./form";

export interface GasketChoice {
  id: number;
  name: string;
  boreMm: number;
}

/** The plan form's Conform fields (useForm<PlanFormValues> in the page). */
export type PlanFormFieldset = ReturnType<FormMetadata<PlanFormValues>["getFieldset"]>;

/** The first message per field of a Conform answer (the form's own, under "", left out). */
export function firstErrors(all: Record<string, string[] | undefined>): Record<string, string> {
  return Object.fromEntries(Object.entries(all).flatMap(([name, list]) => (name !== "" && list?.[0] ? [[name, list[0]]] : [])));
}

/** What the fields start from (the stored plan's values, or the last answer's), every field a string. */
export function initialValues(fields: PlanFormFieldset): Record<PlanFormField, string> {
  return Object.fromEntries(
    PLAN_FORM_FIELDS.map((k) => {
      const v = fields[k].initialValue;
      return [k, typeof v === "string" ? v : ""];
    }),
  ) as Record<PlanFormField, string>;
}

/**
 * A piece of state that starts from `initial` and starts from it again whenever `seed` changes (the
 * form was re-seeded from a changed stored plan), without remounting anything.
 */
export function useSeededState<T>(initial: T, seed: string): [T, (next: T) => void] {
  const [state, setState] = useState({ seed, value: initial });
  if (state.seed !== seed) {
    setState({ seed, value: initial });
    return [initial, (value) => setState({ seed, value })];
  }
  return [state.value, (value) => setState({ seed, value })];
}

interface Props {
  /** The form's fields: names and the values to start from (the stored plan, or the last answer's). */
  fields: PlanFormFieldset;
  /** Changes when the form is re-seeded (Conform's form id): the choices held here start again from the fields. */
  seed: string;
  errors: Record<string, string>;
  choices: { fasteners: MakerFigures[]; gaskets: GasketChoice[] };
  units: UnitSystem;
  sleeved: boolean;
  engineProtrusion: string;
  engineBoreMm: number;
  /** Said after the figures followed a new fastener (by the server without JavaScript). */
  note?: string | null;
  /** The stretch the torque gives, or the torque the target stretch takes, by the estimate. */
  stretch?: StretchLine | null;
  /** After a new fastener's figures were filled in (with JavaScript), the form's values. */
  onFiguresFollowed?: (values: Record<string, string>) => void;
}

type Method = PlanWrite["method"];

// The seal plan's inputs, named by the form's Conform fields (planFormSchema in app/lib/plan/form.ts).
// Works without JavaScript (the server answers a changed fastener and "Show all gaskets" with a Conform
// update of the values); with it, both happen here.
export function PlanFields({
  fields,
  seed,
  errors,
  choices,
  units,
  sleeved,
  engineProtrusion,
  engineBoreMm,
  note: serverNote,
  stretch,
  onFiguresFollowed,
}: Props) {
  const torqueUnit = unitFor("torque", units);
  const smallUnit = unitFor("smallLength", units);
  const values = initialValues(fields);
  const [note, setNote] = useSeededState<string | null>(serverNote ?? null, seed);
  const [fastenerId, setFastenerId] = useSeededState(values.fastenerId, seed);
  const [lubricant, setLubricant] = useSeededState(values.lubricant, seed);
  const [method, setMethod] = useSeededState<Method>((values.method as Method) || "torque-estimated-friction", seed);
  const [showAllGaskets, setShowAllGaskets] = useSeededState(values.showAllGaskets === "1", seed);
  const fastener = choices.fasteners.find((f) => String(f.id) === fastenerId);
  const lubeWarning = lubricantWarning(lubricant, fastener);

  const length = (mm: number) => formatQuantity(mm, "length", units);
  const { fitting, others } = gasketsByFit(choices.gaskets, engineBoreMm);
  const shownOthers = showAllGaskets ? others : others.filter((g) => String(g.id) === values.gasketId);

  // A new fastener brings its maker's torque, stages, lubricant and friction (and stretch figure).
  const fastenerChanged = (e: ChangeEvent<HTMLSelectElement>) => {
    const id = e.target.value;
    setFastenerId(id);
    const form = e.target.form;
    const next = choices.fasteners.find((f) => String(f.id) === id);
    if (!form || !next) return;
    const current = Object.fromEntries([...new FormData(form)].map(([k, v]) => [k, String(v)]));
    const followed = followFastener(current, next, units);
    for (const [name, value] of Object.entries(followed.values)) {
      const field = form.elements.namedItem(name);
      if (field instanceof HTMLInputElement && field.value !== value) field.value = value;
    }
    setLubricant(followed.values.lubricant ?? "");
    setNote(followed.note);
    onFiguresFollowed?.(followed.values);
  };

  // Turning to the stretch gauge with no target yet: start from the maker's stretch figure.
  const methodChanged = (e: ChangeEvent<HTMLSelectElement>) => {
    const next = e.target.value as Method;
    setMethod(next);
    const field = e.target.form?.elements.namedItem("targetStretch");
    if (next === "stretch-measured" && field instanceof HTMLInputElement && field.value.trim() === "" && fastener?.makerStretchMm)
      field.value = String(Number(toDisplay("smallLength", fastener.makerStretchMm, smallUnit).toFixed(units === "metric" ? 3 : 2)));
  };

  return (
    <div className="space-y-4">
      <Field label="Plan name" name={fields.name.name} defaultValue={values.name} error={errors.name} required />
      <div>
        <SelectField
          label="Gasket"
          name={fields.gasketId.name}
          defaultValue={values.gasketId}
          error={errors.gasketId}
          aria-describedby={errors.gasketId ? "f-gasketId-error f-gasketId-hint" : "f-gasketId-hint"}
        >
          {fitting.map((g) => (
            <option key={g.id} value={g.id}>
              {g.name}
            </option>
          ))}
          {shownOthers.length > 0 ? (
            <optgroup label={`Not for a ${length(engineBoreMm)} bore`}>
              {shownOthers.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.name} (does not fit this bore)
                </option>
              ))}
            </optgroup>
          ) : null}
        </SelectField>
        <input type="hidden" name={fields.showAllGaskets.name} value={showAllGaskets ? "1" : ""} />
        <p id="f-gasketId-hint" className="mt-1 text-xs text-forge-700">
          {fitting.length === 0
            ? `No gasket in the library fits a ${length(engineBoreMm)} bore; add one in Libraries → Gaskets.`
            : `Gaskets whose bore suits the ${length(engineBoreMm)} cylinder bore.`}{" "}
          {!showAllGaskets && others.length > 0 ? (
            <Button
              type="submit"
              kind="plain"
              name="intent"
              value="show-all-gaskets"
              formNoValidate
              className="ml-1 rounded border border-forge-300 bg-white px-2 py-0.5 text-xs font-medium"
              onClick={(e) => {
                e.preventDefault();
                setShowAllGaskets(true);
              }}
            >
              Show all gaskets ({others.length} more)
            </Button>
          ) : null}
        </p>
      </div>
      <fieldset className="min-w-0 space-y-3 rounded border border-forge-100 p-3">
        <legend className="px-1 font-bold">Sealing details</legend>
        <SelectField
          label="Wire ring"
          name={fields.wireLocation.name}
          defaultValue={values.wireLocation}
          error={errors.wireLocation}
          options={Object.entries(WIRE_LABEL)}
        />
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            label={`Wire projection (${smallUnit})`}
            name={fields.wireProjection.name}
            inputMode="decimal"
            defaultValue={values.wireProjection}
            error={errors.wireProjection}
            hint="How far the wire stands above its face."
          />
          <Field
            label={`Receiver groove depth (${smallUnit})`}
            name={fields.receiverGrooveDepth.name}
            inputMode="decimal"
            defaultValue={values.receiverGrooveDepth}
            error={errors.receiverGrooveDepth}
            hint="The groove opposite the wire; 0 for none."
          />
        </div>
        {sleeved ? (
          <Field
            label={`Sleeve protrusion (${smallUnit})`}
            name={fields.sleeveProtrusion.name}
            inputMode="decimal"
            defaultValue={values.sleeveProtrusion}
            error={errors.sleeveProtrusion}
            hint={`Sleeve top above the deck. Blank: the engine's machined ${engineProtrusion}.`}
          />
        ) : (
          <input type="hidden" name={fields.sleeveProtrusion.name} value="" />
        )}
      </fieldset>
      <fieldset className="group/tighten min-w-0 space-y-3 rounded border border-forge-100 p-3">
        <legend className="px-1 font-bold">Fastener and tightening</legend>
        <input type="hidden" name={fields.figuresFastenerId.name} defaultValue={values.figuresFastenerId || values.fastenerId} />
        <input type="hidden" name={fields.figuresSeen.name} defaultValue={values.figuresSeen} />
        <SelectField
          label="Fastener"
          name={fields.fastenerId.name}
          defaultValue={values.fastenerId}
          error={errors.fastenerId}
          onChange={fastenerChanged}
          options={choices.fasteners.map((f) => [String(f.id), f.name])}
        />
        {note ? (
          <p role="status" data-testid="figures-followed" className="rounded border border-copper-600 bg-white px-3 py-2 text-sm">
            ↻ {note}
          </p>
        ) : null}
        <Field
          label="Lubricant"
          name={fields.lubricant.name}
          defaultValue={values.lubricant}
          error={errors.lubricant}
          onChange={(e) => setLubricant(e.target.value)}
          hint="Use the fastener maker's lubricant; the friction below should be for it."
        />
        {lubeWarning ? (
          <p data-testid="lubricant-warning" className="rounded border border-caution bg-caution-50 px-3 py-2 text-sm">
            ⚠ {lubeWarning}
          </p>
        ) : null}
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            label="Thread friction"
            name={fields.threadFriction.name}
            inputMode="decimal"
            defaultValue={values.threadFriction}
            error={errors.threadFriction}
            hint="Friction in the threads (μG in the standards): about 0.10–0.14 with moly paste, 0.14–0.18 with engine oil."
          />
          <Field
            label="Washer-face friction"
            name={fields.bearingFriction.name}
            inputMode="decimal"
            defaultValue={values.bearingFriction}
            error={errors.bearingFriction}
            hint="Friction under the nut, where the washer face turns (μK in the standards)."
          />
        </div>
        <div>
          <SelectField
            label="How the studs are tightened"
            name={fields.method.name}
            value={method}
            onChange={methodChanged}
            error={errors.method}
            options={Object.entries(METHOD_LABEL)}
            aria-describedby={errors.method ? "f-method-error f-method-hint" : "f-method-hint"}
          />
          <p id="f-method-hint" className="mt-1 text-xs text-forge-700">
            {METHOD_HELP[method]}
          </p>
        </div>
        {/* Shown while "Stretch gauge" is picked: by CSS, so it works before and without JavaScript too. */}
        <div className="hidden group-has-[option[value=stretch-measured]:checked]/tighten:block" data-testid="target-stretch">
          <Field
            label={`Target stretch (${smallUnit})`}
            name={fields.targetStretch.name}
            inputMode="decimal"
            defaultValue={values.targetStretch}
            error={errors.targetStretch}
            hint={`What the stretch gauge reads on the stud at the final pull. ${fastener?.makerStretchMm ? `The maker's figure for this stud: ${formatQuantity(fastener.makerStretchMm, "smallLength", units, { decimals: units === "metric" ? 3 : 1 })}.` : "No maker's stretch figure is recorded for this stud."} Blank: plan by torque and check the stretch.`}
          />
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            label={`Final torque (${torqueUnit})`}
            name={fields.torque.name}
            inputMode="decimal"
            defaultValue={values.torque}
            error={errors.torque}
            required
            hint={method === "stretch-measured" ? "The torque you expect to reach the stretch." : undefined}
          />
          <Field
            label={`Stages (${torqueUnit})`}
            name={fields.stages.name}
            defaultValue={values.stages}
            error={errors.stages}
            hint="Rising, ending at the final torque, commas between them. With decimal commas, separate the stages with semicolons: 54,5; 108; 156."
          />
        </div>
        {stretch ? <StretchSentence line={stretch} units={units} makerStretchMm={fastener?.makerStretchMm ?? null} /> : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          label="Target seal margin"
          name={fields.targetMargin.name}
          inputMode="decimal"
          defaultValue={values.targetMargin}
          error={errors.targetMargin}
          hint="1 = just enough clamp on the seal, hot and under firing; 1.5 leaves half as much again in hand."
        />
      </div>
      <div>
        <label htmlFor="f-notes" className="block text-sm font-medium text-forge-800">
          Notes
        </label>
        <textarea
          id="f-notes"
          name={fields.notes.name}
          defaultValue={values.notes}
          rows={3}
          className="mt-1 block w-full rounded border border-forge-500 bg-white px-3 py-2"
        />
      </div>
    </div>
  );
}

function StretchSentence({ line, units, makerStretchMm }: { line: StretchLine; units: UnitSystem; makerStretchMm: number | null }) {
  const stretch = (mm: number) => formatQuantity(mm, "smallLength", units, { decimals: units === "metric" ? 3 : 1 });
  const preload = formatQuantity(line.preloadN, "force", units);
  const torque = formatQuantity(line.torqueNm, "torque", units);
  const maker = makerStretchMm ? ` The maker's stretch figure: ${stretch(makerStretchMm)}.` : "";
  return (
    <p data-testid="stretch-line" className="rounded bg-forge-100 px-3 py-2 text-sm">
      {line.mode === "stretch"
        ? `By the estimate, a stretch of ${stretch(line.stretchMm)} is ${preload} of preload per stud, about ${torque} with this friction.`
        : `By the estimate, ${torque} stretches each stud about ${stretch(line.stretchMm)} (${preload} of preload).`}
      {maker} An estimate: the maker's figures govern.
    </p>
  );
}
