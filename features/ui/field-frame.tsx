import type { ReactNode } from "react";

// Two looks: "form" for the page forms (sign-in, New design, Stockroom), "dense" for the Layout
// desk's joint data form, whose refused values are announced at once (role="alert").
const LOOKS = {
  form: {
    frame: "flex flex-col gap-1",
    label: "text-table font-medium text-ink-800",
    error: "text-table text-verdict-fail",
    alert: false,
  },
  dense: {
    frame: "flex flex-col gap-0.5",
    label: "text-micro text-ink-600",
    error: "text-micro text-verdict-fail",
    alert: true,
  },
} as const;

/**
 * One labelled field: the label above the control (`children`, whose id is `id`), and under it the
 * field's message (`<id>-error`) or else its hint (`<id>-hint`), for the control's aria-describedby.
 */
export function FieldFrame({
  id,
  label,
  message,
  hint,
  look = "form",
  children,
}: {
  id: string;
  label: ReactNode;
  message?: string | null;
  hint?: string;
  look?: keyof typeof LOOKS;
  children: ReactNode;
}) {
  const style = LOOKS[look];
  return (
    <div className={style.frame}>
      <label htmlFor={id} className={style.label}>
        {label}
      </label>
      {children}
      {message ? (
        <p id={`${id}-error`} role={style.alert ? "alert" : undefined} className={style.error}>
          {message}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-micro text-ink-500">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
