"use client";
import { FieldFrame } from "@/features/ui/field-frame";
import { fieldDomId } from "./form-context";

interface Props<T extends string> {
  path: string;
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  disabled?: boolean;
  onChange: (v: T) => void;
  hint?: string;
}

export function SelectField<T extends string>({
  path,
  label,
  value,
  options,
  disabled,
  onChange,
  hint,
}: Props<T>) {
  const id = fieldDomId(path);
  return (
    <FieldFrame look="dense" id={id} label={label} hint={hint}>
      <select
        id={id}
        className="rounded border border-ink-200 bg-white px-1.5 py-1 text-table"
        value={value}
        disabled={disabled}
        aria-describedby={hint ? `${id}-hint` : undefined}
        onChange={(e) => onChange(e.target.value as T)}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}
