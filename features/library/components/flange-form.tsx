"use client";

import { startTransition, useActionState, useEffect, useRef } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { createFlangeTemplateAction } from "../actions";

// A flange template from the standard in hand (circular outline): dimensions in mm.
export function FlangeForm() {
  const [state, action, pending] = useActionState(createFlangeTemplateAction, null);
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
      aria-label="Add a flange template"
    >
      <h2 className="text-lead font-semibold">Add a flange template</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Standard" name="standard" required errors={e.standard} hint="e.g. EN 1092-1" />
        <TextField
          label="Class or PN"
          name="pressure_class"
          required
          errors={e.pressure_class}
          hint="e.g. PN 16, Class 300"
        />
        <TextField label="Size" name="size" required errors={e.size} hint="e.g. DN 150, NPS 6" />
        <TextField
          label="Outside diameter (mm)"
          name="outside_diameter_mm"
          inputMode="decimal"
          required
          errors={e.outside_diameter_mm}
        />
        <TextField
          label="Bore (mm)"
          name="bore_diameter_mm"
          inputMode="decimal"
          errors={e.bore_diameter_mm}
        />
        <TextField
          label="Bolt circle (mm)"
          name="bolt_circle_diameter_mm"
          inputMode="decimal"
          required
          errors={e.bolt_circle_diameter_mm}
        />
        <TextField
          label="Number of bolts"
          name="bolt_count"
          inputMode="numeric"
          required
          errors={e.bolt_count}
        />
        <TextField
          label="Bolt size"
          name="bolt_designation"
          required
          errors={e.bolt_designation}
          hint="M20, 3/4 …"
        />
        <TextField
          label="Bolt diameter (mm)"
          name="bolt_diameter_mm"
          inputMode="decimal"
          required
          errors={e.bolt_diameter_mm}
        />
        <TextField
          label="Hole diameter (mm)"
          name="hole_diameter_mm"
          inputMode="decimal"
          required
          errors={e.hole_diameter_mm}
        />
        <TextField label="Source" name="source" required errors={e.source} />
        <TextField label="Edition" name="edition" errors={e.edition} />
      </div>
      <button type="submit" className={`${buttonStyles.primary} self-start`} disabled={pending}>
        Add flange template
      </button>
      <FormStatus state={state} success="Added to the Stockroom." />
    </form>
  );
}
