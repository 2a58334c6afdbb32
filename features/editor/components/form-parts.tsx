import type { ReactNode } from "react";

/** The class and aria attributes of a typed-in control whose value may be refused (`message`). */
export function typedInputProps(id: string, message: string | null | undefined, extraClass = "") {
  return {
    id,
    className: `${extraClass}rounded border px-2 py-1 text-table ${message ? "border-verdict-fail bg-verdict-fail-bg" : "border-ink-200"}`,
    "aria-invalid": message ? true : undefined,
    "aria-describedby": message ? `${id}-error` : undefined,
  };
}

/** One section of the joint data form (Service, Gasket, Bolting, Tightening, Flange and cover): two columns under its legend. */
export function FormSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="grid grid-cols-2 gap-2">
      <legend className="mb-1 text-table font-semibold text-ink-800">{title}</legend>
      {children}
    </fieldset>
  );
}
