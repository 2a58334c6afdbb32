"use client";

import { saveGasketAction } from "../actions";
import type { GasketChoiceDto } from "../model/dto";
import { Fields, StockroomForm, type FieldSpec } from "./stockroom-form";

// Add or edit one of our own gaskets. Values in MPa and mm; tightness parameters per leakage
// class are optional (from an EN 13555 test report).
const num = (v: number | null | undefined) => (v === null || v === undefined ? "" : String(v));

function mainFields(g: GasketChoiceDto | null | undefined): FieldSpec[] {
  return [
    { label: "Name", name: "name", required: true, defaultValue: g?.name },
    {
      label: "Gasket type",
      name: "gasket_type",
      required: true,
      defaultValue: g?.gasketType,
      hint: "e.g. PTFE sheet, spiral-wound",
    },
    { label: "Gasket factor m", name: "m", decimal: true, required: true, defaultValue: num(g?.m) },
    {
      label: "Seating stress y (MPa)",
      name: "y_mpa",
      decimal: true,
      required: true,
      defaultValue: num(g?.yMpa),
    },
    {
      label: "Modulus (MPa)",
      name: "modulus_mpa",
      decimal: true,
      required: true,
      defaultValue: num(g?.modulusMpa),
    },
    {
      label: "Thickness (mm)",
      name: "thickness_mm",
      decimal: true,
      required: true,
      defaultValue: num(g?.thicknessMm),
    },
    {
      label: "Source",
      name: "source",
      required: true,
      defaultValue: g?.source,
      hint: "test report, data sheet, standard table",
    },
    { label: "Edition", name: "edition", defaultValue: g?.edition },
  ];
}

// Qmin and QSmin per leakage class, in the order of the CSV columns.
const CLASSES = [
  ["L1.0", "l1"],
  ["L0.1", "l01"],
  ["L0.01", "l001"],
] as const;

function tightnessFields(g: GasketChoiceDto | null | undefined): FieldSpec[] {
  const t = g?.tightness ?? {};
  return [
    ...CLASSES.flatMap(([c, suffix]) => [
      { label: `Qmin ${c}`, name: `qmin_${suffix}`, decimal: true, defaultValue: num(t[c]?.qMinMpa) },
      { label: `QSmin ${c}`, name: `qsmin_${suffix}`, decimal: true, defaultValue: num(t[c]?.qsMinMpa) },
    ]),
    { label: "Qsmax", name: "qsmax_mpa", decimal: true, defaultValue: num(g?.qsMaxMpa) },
    {
      label: "PQR",
      name: "pqr",
      decimal: true,
      defaultValue: num(g?.pqr),
      hint: "creep relaxation factor, 0–1",
    },
    { label: "EG", name: "eg_mpa", decimal: true, defaultValue: num(g?.egMpa), hint: "unloading modulus" },
  ];
}

export function GasketForm({ editing, onDone }: { editing?: GasketChoiceDto | null; onDone?: () => void }) {
  const g = editing;
  return (
    <StockroomForm
      action={saveGasketAction}
      title={g ? `Edit ${g.name}` : "Add a gasket"}
      submitLabel={g ? "Save changes" : "Add gasket"}
      success={g ? "Saved. Designs that used the old values keep their copy." : undefined}
      keepValues={Boolean(g)}
      onSaved={onDone}
      onCancel={g ? onDone : undefined}
      hiddenFields={g ? { rowId: g.rowId } : undefined}
      fields={mainFields(g)}
    >
      {(e) => (
        <fieldset className="grid gap-3 sm:grid-cols-3 lg:grid-cols-6">
          <legend className="mb-2 text-table font-medium text-ink-700">
            Tightness parameters (optional, MPa)
          </legend>
          <Fields specs={tightnessFields(g)} errors={e} />
        </fieldset>
      )}
    </StockroomForm>
  );
}
