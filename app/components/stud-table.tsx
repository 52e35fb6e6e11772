import { formatShare, readStudRow, shareSum, sharesAddUp, type StudRow } from "~/lib/engine";

// The stud pattern editor: one row per stud, the cylinders it serves, its share of each, and
// whether the shares add up (in words and an icon, not colour alone).
export function StudTable({
  studs,
  setStuds,
  errors,
}: {
  studs: StudRow[];
  setStuds: (update: (rows: StudRow[]) => StudRow[]) => void;
  errors: Record<string, string>;
}) {
  const edit = (i: number, key: keyof StudRow, value: string) =>
    setStuds((rows) => rows.map((r, j) => (j === i ? { ...r, [key]: value } : r)));
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
          {studs.map((row, i) => {
            const error = Object.entries(errors).find(([k]) => k === `studs.${i}` || k.startsWith(`studs.${i}.`))?.[1];
            const errorId = `stud-${i}-error`;
            const name = row.label.trim() || `${i + 1}`;
            return (
              <tr key={i} className="border-t border-forge-100 align-top">
                <td className="px-2 py-1">
                  <input
                    name={`stud-${i}-label`}
                    value={row.label}
                    onChange={(e) => edit(i, "label", e.target.value)}
                    aria-label={`Stud ${i + 1} label`}
                    maxLength={40}
                    className="w-24 rounded border border-forge-300 px-2 py-1"
                  />
                </td>
                <td className="px-2 py-1">
                  <input
                    name={`stud-${i}-cylinders`}
                    value={row.cylinders}
                    onChange={(e) => edit(i, "cylinders", e.target.value)}
                    aria-label={`Stud ${name}: cylinders served`}
                    aria-invalid={error ? true : undefined}
                    aria-describedby={error ? errorId : undefined}
                    className="w-28 rounded border border-forge-300 px-2 py-1 aria-[invalid]:border-failed"
                  />
                </td>
                <td className="px-2 py-1">
                  <input
                    name={`stud-${i}-shares`}
                    value={row.shares}
                    onChange={(e) => edit(i, "shares", e.target.value)}
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
                  <ShareSum row={row} />
                </td>
                <td className="px-2 py-1">
                  <button
                    type="submit"
                    name="intent"
                    value={`remove-stud:${i}`}
                    formNoValidate
                    onClick={(e) => {
                      e.preventDefault();
                      setStuds((rows) => rows.filter((_, j) => j !== i));
                    }}
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
