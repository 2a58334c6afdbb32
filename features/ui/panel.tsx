import type { ReactNode } from "react";

/**
 * A white plate of a screen with its heading (the Crew's sections, the Layout desk's Sign-off box
 * and Shop files): the section is named by its h2 for screen readers. `className` adds the padding
 * and any width.
 */
export function Panel({
  id,
  title,
  className,
  children,
}: {
  id: string;
  title: ReactNode;
  className: string;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className={`rounded-plate bg-white shadow-plate ${className}`}>
      <h2 id={id} className="text-lead font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * A table under a Panel's heading that scrolls sideways on a narrow screen. `commandsHeader` names
 * a last column of row commands for screen readers only.
 */
export function PanelTable({
  headers,
  commandsHeader,
  children,
}: {
  headers: string[];
  commandsHeader?: string;
  children: ReactNode;
}) {
  return (
    <div className="max-w-full overflow-x-auto">
      <table className="mt-3 w-full">
        <thead className="text-left text-ink-500">
          <tr>
            {headers.map((header) => (
              <th key={header} className="py-2">
                {header}
              </th>
            ))}
            {commandsHeader ? (
              <th className="py-2">
                <span className="sr-only">{commandsHeader}</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
