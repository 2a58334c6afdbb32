"use client";

import { startTransition, useActionState, useEffect, useRef } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { createBoltingAction } from "../actions";

// A bolting material with up to three size ranges (strengths apply up to and including the
// range's largest nominal diameter). Values in mm and MPa.
export function BoltingForm() {
  const [state, action, pending] = useActionState(createBoltingAction, null);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok) form.current?.reset();
  }, [state]);
  const e = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    // Submitted through onSubmit, not the action prop: React resets a form after an action, which
    // would wipe what the user typed when the server refuses a field.
    <form
      ref={form}
      onSubmit={(ev) => {
        ev.preventDefault();
        const data = new FormData(ev.currentTarget);
        startTransition(() => action(data));
      }}
      className="flex flex-col gap-4 rounded-plate border border-ink-100 bg-white p-panel shadow-plate"
      aria-label="Add a bolting material"
    >
      <h2 className="text-lead font-semibold">Add a bolting material</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Name" name="name" required errors={e.name} />
        <TextField
          label="Modulus (MPa)"
          name="modulus_mpa"
          inputMode="decimal"
          required
          defaultValue="205000"
          errors={e.modulus_mpa}
        />
        <TextField label="Source" name="source" required errors={e.source} />
        <TextField label="Edition" name="edition" errors={e.edition} />
      </div>
      {[1, 2, 3].map((i) => (
        <fieldset key={i} className="grid gap-3 sm:grid-cols-5">
          <legend className="mb-1 text-table font-medium text-ink-700">
            Size range {i}
            {i > 1 ? " (optional)" : ""}
          </legend>
          <TextField
            label={`Up to diameter (mm) ${i}`}
            name={`max_diameter_mm_${i}`}
            inputMode="decimal"
            required={i === 1}
            errors={e[`max_diameter_mm_${i}`]}
          />
          <TextField
            label={`Proof (MPa) ${i}`}
            name={`proof_mpa_${i}`}
            inputMode="decimal"
            errors={e[`proof_mpa_${i}`]}
          />
          <TextField
            label={`Yield (MPa) ${i}`}
            name={`yield_mpa_${i}`}
            inputMode="decimal"
            required={i === 1}
            errors={e[`yield_mpa_${i}`]}
          />
          <TextField
            label={`Tensile (MPa) ${i}`}
            name={`tensile_mpa_${i}`}
            inputMode="decimal"
            required={i === 1}
            errors={e[`tensile_mpa_${i}`]}
          />
          <TextField
            label={`Allowable (MPa) ${i}`}
            name={`allowable_mpa_${i}`}
            inputMode="decimal"
            errors={e[`allowable_mpa_${i}`]}
          />
        </fieldset>
      ))}
      <button type="submit" className={`${buttonStyles.primary} self-start`} disabled={pending}>
        Add bolting material
      </button>
      <FormStatus state={state} success="Added to the Stockroom." />
    </form>
  );
}
