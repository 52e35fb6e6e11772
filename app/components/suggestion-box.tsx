import { Form } from "react-router";
import type { Suggestion } from "~/lib/clamp";
import { formatQuantity, type UnitSystem } from "~/lib/units";
import { Button } from "./form";

// The answer to "what torque reaches my target margin?" and the buttons to use it.
export function SuggestionBox({ suggestion, units, canEdit }: { suggestion: Suggestion; units: UnitSystem; canEdit: boolean }) {
  const s = suggestion;
  return (
    <section
      aria-labelledby="suggest-title"
      className={`rounded border-2 p-4 ${s.reachable ? "border-held bg-held-50" : "border-caution bg-caution-50"}`}
      data-testid="suggestion"
    >
      <h2 id="suggest-title" tabIndex={-1} className="font-bold">
        {s.reachable ? "✔ Suggested torque" : "⚠ No torque reaches the target"}
      </h2>
      <p className="mt-1">{s.summary}</p>
      {s.changes.length > 0 ? (
        <ul className="mt-2 list-disc pl-5 text-sm">
          {s.changes.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      ) : null}
      {canEdit && s.torqueNm !== null ? (
        <div className="mt-3 flex flex-wrap gap-2">
          <Form method="post">
            <input type="hidden" name="torqueNm" value={s.torqueNm} />
            <Button type="submit" name="intent" value="apply-torque">
              Apply {formatQuantity(s.torqueNm, "torque", units)} to this plan
            </Button>
          </Form>
          <Form method="post">
            <input type="hidden" name="torqueNm" value={s.torqueNm} />
            <Button type="submit" name="intent" value="new-with-torque" kind="plain">
              New plan with it
            </Button>
          </Form>
        </div>
      ) : null}
      {canEdit && s.protrusion ? (
        <Form method="post" className="mt-2">
          <input type="hidden" name="torqueNm" value={s.protrusion.torqueNm} />
          <input type="hidden" name="protrusionMm" value={s.protrusion.protrusionMm} />
          <Button type="submit" name="intent" value="new-with-torque" kind="plain">
            New plan: {formatQuantity(s.protrusion.protrusionMm, "smallLength", units)} protrusion at{" "}
            {formatQuantity(s.protrusion.torqueNm, "torque", units)}
          </Button>
        </Form>
      ) : null}
    </section>
  );
}
