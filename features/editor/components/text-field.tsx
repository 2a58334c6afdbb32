"use client";
import { useState } from "react";
import { fieldDomId } from "./form-context";

interface Props {
  path: string;
  label: string;
  value: string;
  required?: boolean;
  maxLength: number;
  disabled?: boolean;
  onCommit: (v: string) => void;
  onInvalid: (invalid: boolean) => void;
  serverError?: string;
}

/** A text field committed on blur; empty (when required) or too long is refused at the field. */
export function TextField({
  path,
  label,
  value,
  required,
  maxLength,
  disabled,
  onCommit,
  onInvalid,
  serverError,
}: Props) {
  const [raw, setRaw] = useState(value);
  const [error, setError] = useState<string | null>(null);
  const [valueFor, setValueFor] = useState(value);
  if (value !== valueFor) {
    // Changed from elsewhere (undo, a reload): show the new value.
    setValueFor(value);
    setRaw(value);
  }
  const id = fieldDomId(path);
  const check = (v: string) =>
    required && v.trim() === ""
      ? `${label} is required.`
      : v.length > maxLength
        ? `${label} must be at most ${maxLength} characters.`
        : null;
  const message = error ?? serverError;
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-micro text-ink-600">
        {label}
      </label>
      <input
        id={id}
        className={`rounded border px-2 py-1 text-table ${message ? "border-verdict-fail bg-verdict-fail-bg" : "border-ink-200"}`}
        value={raw}
        disabled={disabled}
        aria-invalid={message ? true : undefined}
        aria-describedby={message ? `${id}-error` : undefined}
        onChange={(e) => {
          setRaw(e.target.value);
          const m = check(e.target.value);
          setError(m);
          onInvalid(!!m);
        }}
        onBlur={() => {
          const m = check(raw);
          setError(m);
          onInvalid(!!m);
          if (!m && raw.trim() !== value) onCommit(raw.trim());
        }}
      />
      {message && (
        <p id={`${id}-error`} role="alert" className="text-micro text-verdict-fail">
          {message}
        </p>
      )}
    </div>
  );
}
