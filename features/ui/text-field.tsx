import type { InputHTMLAttributes } from "react";

/** A labelled input with its field message (first error only) tied to it for screen readers. */
export function TextField({
  label,
  name,
  errors,
  hint,
  ...input
}: {
  label: string;
  name: string;
  errors?: string[];
  hint?: string;
} & InputHTMLAttributes<HTMLInputElement>) {
  const id = `field-${name}`;
  const message = errors?.[0];
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-table font-medium text-ink-800">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={message ? true : undefined}
        aria-describedby={message ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className="rounded-plate border border-ink-200 bg-white px-3 py-2 text-body text-ink-900 aria-[invalid=true]:border-verdict-fail"
        {...input}
      />
      {hint && !message ? (
        <p id={`${id}-hint`} className="text-micro text-ink-500">
          {hint}
        </p>
      ) : null}
      {message ? (
        <p id={`${id}-error`} className="text-table text-verdict-fail">
          {message}
        </p>
      ) : null}
    </div>
  );
}
