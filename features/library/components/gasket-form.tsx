"use client";

import { startTransition, useActionState, useEffect, useRef } from "react";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { saveGasketAction } from "../actions";
import type { GasketChoiceDto } from "../model/dto";

// Add or edit one of our own gaskets. Values in MPa and mm; tightness parameters per leakage
// class are optional (from an EN 13555 test report).
const num = (v: number | null | undefined) => (v === null || v === undefined ? "" : String(v));

export function GasketForm({ editing, onDone }: { editing?: GasketChoiceDto | null; onDone?: () => void }) {
  const [state, action, pending] = useActionState(saveGasketAction, null);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok) {
      if (!editing) form.current?.reset();
      onDone?.();
    }
  }, [state, editing, onDone]);
  const e = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const g = editing;
  const t = g?.tightness ?? {};
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
      aria-label={g ? `Edit ${g.name}` : "Add a gasket"}
    >
      <h2 className="text-lead font-semibold">{g ? `Edit ${g.name}` : "Add a gasket"}</h2>
      {g ? <input type="hidden" name="rowId" value={g.rowId} /> : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Name" name="name" required defaultValue={g?.name} errors={e.name} />
        <TextField
          label="Gasket type"
          name="gasket_type"
          required
          defaultValue={g?.gasketType}
          errors={e.gasket_type}
          hint="e.g. PTFE sheet, spiral-wound"
        />
        <TextField
          label="Gasket factor m"
          name="m"
          inputMode="decimal"
          required
          defaultValue={num(g?.m)}
          errors={e.m}
        />
        <TextField
          label="Seating stress y (MPa)"
          name="y_mpa"
          inputMode="decimal"
          required
          defaultValue={num(g?.yMpa)}
          errors={e.y_mpa}
        />
        <TextField
          label="Modulus (MPa)"
          name="modulus_mpa"
          inputMode="decimal"
          required
          defaultValue={num(g?.modulusMpa)}
          errors={e.modulus_mpa}
        />
        <TextField
          label="Thickness (mm)"
          name="thickness_mm"
          inputMode="decimal"
          required
          defaultValue={num(g?.thicknessMm)}
          errors={e.thickness_mm}
        />
        <TextField
          label="Source"
          name="source"
          required
          defaultValue={g?.source}
          errors={e.source}
          hint="test report, data sheet, standard table"
        />
        <TextField label="Edition" name="edition" defaultValue={g?.edition} errors={e.edition} />
      </div>
      <fieldset className="grid gap-3 sm:grid-cols-3 lg:grid-cols-6">
        <legend className="mb-2 text-table font-medium text-ink-700">
          Tightness parameters (optional, MPa)
        </legend>
        <TextField
          label="Qmin L1.0"
          name="qmin_l1"
          inputMode="decimal"
          defaultValue={num(t["L1.0"]?.qMinMpa)}
          errors={e.qmin_l1}
        />
        <TextField
          label="QSmin L1.0"
          name="qsmin_l1"
          inputMode="decimal"
          defaultValue={num(t["L1.0"]?.qsMinMpa)}
          errors={e.qsmin_l1}
        />
        <TextField
          label="Qmin L0.1"
          name="qmin_l01"
          inputMode="decimal"
          defaultValue={num(t["L0.1"]?.qMinMpa)}
          errors={e.qmin_l01}
        />
        <TextField
          label="QSmin L0.1"
          name="qsmin_l01"
          inputMode="decimal"
          defaultValue={num(t["L0.1"]?.qsMinMpa)}
          errors={e.qsmin_l01}
        />
        <TextField
          label="Qmin L0.01"
          name="qmin_l001"
          inputMode="decimal"
          defaultValue={num(t["L0.01"]?.qMinMpa)}
          errors={e.qmin_l001}
        />
        <TextField
          label="QSmin L0.01"
          name="qsmin_l001"
          inputMode="decimal"
          defaultValue={num(t["L0.01"]?.qsMinMpa)}
          errors={e.qsmin_l001}
        />
        <TextField
          label="Qsmax"
          name="qsmax_mpa"
          inputMode="decimal"
          defaultValue={num(g?.qsMaxMpa)}
          errors={e.qsmax_mpa}
        />
        <TextField
          label="PQR"
          name="pqr"
          inputMode="decimal"
          defaultValue={num(g?.pqr)}
          errors={e.pqr}
          hint="creep relaxation factor, 0–1"
        />
        <TextField
          label="EG"
          name="eg_mpa"
          inputMode="decimal"
          defaultValue={num(g?.egMpa)}
          errors={e.eg_mpa}
          hint="unloading modulus"
        />
      </fieldset>
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonStyles.primary} disabled={pending}>
          {g ? "Save changes" : "Add gasket"}
        </button>
        {g && onDone ? (
          <button type="button" className={buttonStyles.quiet} onClick={onDone}>
            Cancel
          </button>
        ) : null}
      </div>
      <FormStatus
        state={state}
        success={g ? "Saved. Designs that used the old values keep their copy." : "Added to the Stockroom."}
      />
    </form>
  );
}
