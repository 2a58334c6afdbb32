"use client";
import { useEffect, useState } from "react";
import { parseNumberField, type NumberFieldSpec } from "../model/field-specs";
import { formatInputNumber, toDisplay, unitLabel } from "../model/quantities";
import { FieldFrame } from "@/features/ui/field-frame";
import { typedInputProps } from "./form-parts";
import { fieldDomId, type FormContext } from "./form-context";

interface Props {
  ctx: FormContext;
  spec: NumberFieldSpec;
  value: number;
  /** Default: set the value at spec.path. */
  onCommit?: (internal: number) => void;
}

/**
 * A numeric field in display units. What is typed stays in the box; only a value that parses and
 * lies within the field's bounds is committed (on blur or Enter), so a refused value never
 * reaches the document. The message sits under the field and is tied to it by aria-describedby.
 */
export function NumberField({ ctx, spec, value, onCommit }: Props) {
  const { units } = ctx;
  const shown =
    spec.quantity === "count" ? String(value) : formatInputNumber(toDisplay(spec.quantity, value, units));
  const [raw, setRaw] = useState(shown);
  const [error, setError] = useState<string | null>(null);
  const [focused, setFocused] = useState(false);
  const [shownFor, setShownFor] = useState(shown);
  if (shown !== shownFor) {
    // The document changed from elsewhere (undo, unit switch, a drag): show it, unless the user is typing here.
    setShownFor(shown);
    if (!focused) {
      setRaw(shown);
      setError(null);
    }
  }
  // The workspace's list of refused fields (which blocks saving) follows this field's message.
  const { setInvalid } = ctx;
  useEffect(() => setInvalid(spec.path, error !== null), [setInvalid, spec.path, error]);
  const id = fieldDomId(spec.path);
  const serverError = ctx.errorFor(spec.path);
  const message = error ?? serverError;
  const commit = () => {
    const r = parseNumberField(spec, raw, units);
    if (!r.ok) {
      setError(r.message);
      return;
    }
    setError(null);
    if (r.value !== value)
      (onCommit ?? ((v: number) => ctx.dispatch({ type: "set-field", path: spec.path, value: v })))(r.value);
    else setRaw(shown);
  };
  const unit = unitLabel(spec.quantity, units);
  return (
    <FieldFrame look="dense" id={id} label={`${spec.label}${unit ? ` (${unit})` : ""}`} message={message}>
      <input
        {...typedInputProps(id, message, "num ")}
        inputMode="decimal"
        value={raw}
        disabled={ctx.readOnly}
        onFocus={() => setFocused(true)}
        onChange={(e) => {
          setRaw(e.target.value);
          const r = parseNumberField(spec, e.target.value, units);
          setError(r.ok ? null : r.message);
        }}
        onBlur={() => {
          setFocused(false);
          commit();
        }}
        onKeyDown={(e) => {
          if (e.key === "Enter") commit();
        }}
      />
    </FieldFrame>
  );
}
