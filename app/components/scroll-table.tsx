import type { ReactNode } from "react";

/**
 * A figures table that scrolls sideways on a narrow screen (a focusable, labelled region), with a
 * header row whose first column names the row and the rest hold figures (right-aligned).
 */
export function ScrollTable({
  region,
  label,
  caption,
  columns,
  className = "",
  children,
}: {
  region: string;
  label?: string;
  caption: ReactNode;
  columns: string[];
  className?: string;
  children: ReactNode;
}) {
  return (
    <div className={`overflow-x-auto ${className}`.trim()} tabIndex={0} role="region" aria-label={`${region} (scrolls sideways)`}>
      <table className="border-collapse tabular" aria-label={label}>
        <caption className="text-left text-xs text-forge-700">{caption}</caption>
        <thead>
          <tr>
            {columns.map((c, i) => (
              <th key={c} scope="col" className={`px-2 ${i === 0 ? "text-left" : "text-right"}`}>
                {c}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
