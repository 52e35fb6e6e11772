import type { FieldMetadata, FormMetadata } from "@conform-to/react";
import { formatShare, readStudRow, shareSum, sharesAddUp, type EngineFormValues, type StudRow } from "~/lib/engine";

type StudRows = NonNullable<EngineFormValues["studs"]>;

// The stud pattern editor: one row per stud, the cylinders it serves, its share of each, and
// whether the shares add up (in words and an icon, not colour alone). The rows are a Conform list:
// Remove is a list intent, so it works without JavaScript too.
export function StudTable({
  form,
  studs,
}: {
  form: FormMetadata<EngineFormValues, string[]>;
  studs: FieldMetadata<StudRows, EngineFormValues, string[]>;
}) {
  return (
    // relative: the screen-reader-only labels inside are positioned, and must scroll with the table, not widen the page
    <div className="relative my-3 overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm tabular">
        <caption className="sr-only">Studs, the cylinders each serves and its share of each</caption>
        <thead className="bg-forge-100">
          <tr>
            <th scope="col" className="px-2 py-1">
              Stud label
            </th>
            <th scope="col" className="px-2 py-1">
              Cylinders served
            </th>
            <th scope="col" className="px-2 py-1">
              Share of each
            </th>
            <th scope="col" className="px-2 py-1">
              Sum
            </th>
            <th scope="col" className="px-2 py-1">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {studs.getFieldList().map((stud, i) => {
            const row = stud.getFieldset();
            // every message about this stud is filed under the row (studs[i]); the first is shown
            const error = Object.entries(stud.allErrors).find(([, list]) => list.length > 0)?.[1][0];
            const errorId = `stud-${i}-error`;
            const live = { label: text(row.label.value), cylinders: text(row.cylinders.value), shares: text(row.shares.value) };
            const name = live.label.trim() || `${i + 1}`;
            return (
              <tr key={stud.key} className="border-t border-forge-100 align-top">
                <td className="px-2 py-1">
                  <input
                    name={row.label.name}
                    defaultValue={text(row.label.initialValue)}
                    aria-label={`Stud ${i + 1} label`}
                    maxLength={40}
                    className="w-24 rounded border border-forge-300 px-2 py-1"
                  />
                </td>
                <td className="px-2 py-1">
                  <input
                    // the error summary's link for this stud lands here
                    id={`f-${stud.name}`}
                    name={row.cylinders.name}
                    defaultValue={text(row.cylinders.initialValue)}
                    aria-label={`Stud ${name}: cylinders served`}
                    aria-invalid={error ? true : undefined}
                    aria-describedby={error ? errorId : undefined}
                    className="w-28 rounded border border-forge-300 px-2 py-1 aria-[invalid]:border-failed"
                  />
                </td>
                <td className="px-2 py-1">
                  <input
                    name={row.shares.name}
                    defaultValue={text(row.shares.initialValue)}
                    aria-label={`Stud ${name}: share of each cylinder`}
                    aria-invalid={error ? true : undefined}
                    aria-describedby={error ? errorId : undefined}
                    className="w-36 rounded border border-forge-300 px-2 py-1 aria-[invalid]:border-failed"
                  />
                  {error ? (
                    <p id={errorId} className="mt-1 max-w-xs text-sm font-medium text-failed">
                      ✖ {error}
                    </p>
                  ) : null}
                </td>
                <td className="px-2 py-1">
                  <ShareSum row={live} />
                </td>
                <td className="px-2 py-1">
                  <button
                    {...form.remove.getButtonProps({ name: studs.name, index: i })}
                    className="rounded border border-forge-300 px-2 py-1 hover:bg-forge-100"
                  >
                    Remove<span className="sr-only"> stud {name}</span>
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

const text = (v: unknown) => (typeof v === "string" ? v : "");

function ShareSum({ row }: { row: StudRow }) {
  const stud = readStudRow(row);
  if (!stud || stud.serves.length === 0) return <span className="text-forge-700">—</span>;
  const sum = shareSum(stud);
  if (!Number.isFinite(sum)) return <span className="font-medium text-failed">✖ unreadable</span>;
  const ok = sharesAddUp(stud);
  return ok ? (
    <span className="whitespace-nowrap font-medium text-held">✔ {formatShare(sum)} adds up</span>
  ) : (
    <span className="whitespace-nowrap font-medium text-failed">✖ {formatShare(sum)}, needs 1</span>
  );
}
