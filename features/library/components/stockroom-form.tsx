"use client";

import { startTransition, useActionState, useEffect, useRef, type ReactNode } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";

type FieldErrors = Record<string, string[] | undefined>;
type SaveAction = (
  prev: ActionResult<{ id: string }> | null,
  formData: FormData,
) => Promise<ActionResult<{ id: string }>>;

/** One input of a Stockroom form; `decimal`/`whole` set the on-screen keyboard. */
export interface FieldSpec {
  label: string;
  name: string;
  required?: boolean;
  decimal?: boolean;
  whole?: boolean;
  hint?: string;
  defaultValue?: string;
}

/** The Stockroom's inputs from their specs, each with its field message. */
export function Fields({ specs, errors }: { specs: FieldSpec[]; errors: FieldErrors }) {
  return specs.map(({ decimal, whole, ...spec }) => (
    <TextField
      key={spec.name}
      {...spec}
      inputMode={decimal ? "decimal" : whole ? "numeric" : undefined}
      errors={errors[spec.name]}
    />
  ));
}

/**
 * The frame of every Stockroom form: the action's state, the title, the main `fields` in four
 * columns, then `children` (a form's further fieldsets), the submit button (with Cancel when
 * `onCancel` is given) and the status line. A successful save clears the form unless `keepValues`,
 * then calls `onSaved`.
 */
export function StockroomForm({
  action,
  title,
  submitLabel,
  success = "Added to the Stockroom.",
  fields,
  keepValues = false,
  onSaved,
  onCancel,
  hiddenFields,
  children,
}: {
  action: SaveAction;
  title: string;
  submitLabel: string;
  success?: string;
  fields: FieldSpec[];
  keepValues?: boolean;
  onSaved?: () => void;
  onCancel?: () => void;
  hiddenFields?: Record<string, string>;
  children?: (errors: FieldErrors) => ReactNode;
}) {
  const [state, dispatch, pending] = useActionState(action, null);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok) {
      if (!keepValues) form.current?.reset();
      onSaved?.();
    }
  }, [state, keepValues, onSaved]);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    // Submitted through onSubmit, not the action prop: React resets a form after an action, which
    // would wipe what the user typed when the server refuses a field.
    <form
      ref={form}
      onSubmit={(ev) => {
        ev.preventDefault();
        const data = new FormData(ev.currentTarget);
        startTransition(() => dispatch(data));
      }}
      className="flex flex-col gap-4 rounded-plate border border-ink-100 bg-white p-panel shadow-plate"
      aria-label={title}
    >
      <h2 className="text-lead font-semibold">{title}</h2>
      {Object.entries(hiddenFields ?? {}).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Fields specs={fields} errors={errors} />
      </div>
      {children?.(errors)}
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonStyles.primary} disabled={pending}>
          {submitLabel}
        </button>
        {onCancel ? (
          <button type="button" className={buttonStyles.quiet} onClick={onCancel}>
            Cancel
          </button>
        ) : null}
      </div>
      <FormStatus state={state} success={success} />
    </form>
  );
}
