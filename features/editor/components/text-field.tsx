"use client";
import { useState } from "react";
import { FieldFrame } from "@/features/ui/field-frame";
import { typedInputProps } from "./form-parts";
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
    <FieldFrame look="dense" id={id} label={label} message={message}>
      <input
        {...typedInputProps(id, message)}
        value={raw}
        disabled={disabled}
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
    </FieldFrame>
  );
}
