import type { ReactNode } from "react";

export interface BeforeAfterRow {
  key: string;
  label: ReactNode;
  before: string;
  after: string;
}

/** A three-column table of what something was and what it is now; a changed value is set bold. */
export function BeforeAfterTable({
  label,
  headers,
  rows,
}: {
  label: string;
  headers: [string, string, string];
  rows: BeforeAfterRow[];
}) {
  const th = "py-1 pr-3 text-left text-micro font-semibold text-ink-500";
  const td = "border-t border-ink-100 py-1 pr-3 align-top";
  return (
    <div className="max-w-full overflow-x-auto">
      <table className="mt-2 w-full text-table" aria-label={label}>
        <thead>
          <tr>
            {headers.map((h) => (
              <th key={h} className={th}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key}>
              <td className={td}>{r.label}</td>
              <td className={`${td} num break-words`}>{r.before}</td>
              <td className={`${td} num break-words ${r.before !== r.after ? "font-semibold" : ""}`}>
                {r.after}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
