import type { FastenerInfo, GasketInfo } from "~/models/plan.server";
import { METHOD_LABEL, WIRE_LABEL } from "~/lib/plan/form";
import { unitFor, type UnitSystem } from "~/lib/units";
import { Field, SelectField } from "./form";

interface Props {
  values: Record<string, string>;
  errors: Record<string, string>;
  choices: { fasteners: Pick<FastenerInfo, "id" | "name">[]; gaskets: Pick<GasketInfo, "id" | "name">[] };
  units: UnitSystem;
  sleeved: boolean;
  engineProtrusion: string;
}

// The seal plan's inputs. Names match parsePlanForm in app/lib/plan/form.ts.
export function PlanFields({ values, errors, choices, units, sleeved, engineProtrusion }: Props) {
  const torqueUnit = unitFor("torque", units);
  const smallUnit = unitFor("smallLength", units);
  return (
    <div className="space-y-4">
      <Field label="Plan name" name="name" defaultValue={values.name} error={errors.name} required />
      <SelectField label="Gasket" name="gasketId" defaultValue={values.gasketId} error={errors.gasketId} options={choices.gaskets.map((g) => [String(g.id), g.name])} />
      <fieldset className="space-y-3 rounded border border-forge-100 p-3">
        <legend className="px-1 font-bold">Sealing details</legend>
        <SelectField label="Wire ring" name="wireLocation" defaultValue={values.wireLocation} error={errors.wireLocation} options={Object.entries(WIRE_LABEL)} />
        <div className="grid grid-cols-2 gap-3">
          <Field label={`Wire projection (${smallUnit})`} name="wireProjection" inputMode="decimal" defaultValue={values.wireProjection} error={errors.wireProjection} hint="How far the wire stands above its face." />
          <Field label={`Receiver groove depth (${smallUnit})`} name="receiverGrooveDepth" inputMode="decimal" defaultValue={values.receiverGrooveDepth} error={errors.receiverGrooveDepth} />
        </div>
        {sleeved ? (
          <Field label={`Sleeve protrusion (${smallUnit})`} name="sleeveProtrusion" inputMode="decimal" defaultValue={values.sleeveProtrusion} error={errors.sleeveProtrusion} hint={`Blank: the engine's machined ${engineProtrusion}.`} />
        ) : (
          <input type="hidden" name="sleeveProtrusion" value="" />
        )}
      </fieldset>
      <fieldset className="space-y-3 rounded border border-forge-100 p-3">
        <legend className="px-1 font-bold">Fastener and tightening</legend>
        <SelectField label="Fastener" name="fastenerId" defaultValue={values.fastenerId} error={errors.fastenerId} options={choices.fasteners.map((f) => [String(f.id), f.name])} />
        <Field label="Lubricant" name="lubricant" defaultValue={values.lubricant} error={errors.lubricant} hint="Use the fastener maker's lubricant; friction below should match it." />
        <div className="grid grid-cols-2 gap-3">
          <Field label="Thread friction μG" name="threadFriction" inputMode="decimal" defaultValue={values.threadFriction} error={errors.threadFriction} />
          <Field label="Bearing friction μK" name="bearingFriction" inputMode="decimal" defaultValue={values.bearingFriction} error={errors.bearingFriction} />
        </div>
        <SelectField label="Tightening method" name="method" defaultValue={values.method} error={errors.method} options={Object.entries(METHOD_LABEL)} />
        <div className="grid grid-cols-2 gap-3">
          <Field label={`Final torque (${torqueUnit})`} name="torque" inputMode="decimal" defaultValue={values.torque} error={errors.torque} required />
          <Field label={`Stages (${torqueUnit}, comma-separated)`} name="stages" defaultValue={values.stages} error={errors.stages} hint="Rising, ending at the final torque." />
        </div>
      </fieldset>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Target seal margin" name="targetMargin" inputMode="decimal" defaultValue={values.targetMargin} error={errors.targetMargin} hint="1 = just meets the criterion." />
      </div>
      <div>
        <label htmlFor="f-notes" className="block text-sm font-medium text-forge-800">
          Notes
        </label>
        <textarea id="f-notes" name="notes" defaultValue={values.notes} rows={3} className="mt-1 block w-full rounded border border-forge-300 bg-white px-3 py-2" />
      </div>
    </div>
  );
}

