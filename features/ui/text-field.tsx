import type { InputHTMLAttributes } from "react";
import { FieldFrame } from "./field-frame";

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
    <FieldFrame id={id} label={label} message={message} hint={hint}>
      <input
        id={id}
        name={name}
        aria-invalid={message ? true : undefined}
        aria-describedby={message ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className="rounded-plate border border-ink-200 bg-white px-3 py-2 text-body text-ink-900 aria-[invalid=true]:border-verdict-fail"
        {...input}
      />
    </FieldFrame>
  );
}
