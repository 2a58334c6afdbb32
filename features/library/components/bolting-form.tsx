"use client";

import { createBoltingAction } from "../actions";
import { Fields, StockroomForm, type FieldSpec } from "./stockroom-form";

// A bolting material with up to three size ranges (strengths apply up to and including the
// range's largest nominal diameter). Values in mm and MPa.
const MATERIAL: FieldSpec[] = [
  { label: "Name", name: "name", required: true },
  { label: "Modulus (MPa)", name: "modulus_mpa", decimal: true, required: true, defaultValue: "205000" },
  { label: "Source", name: "source", required: true },
  { label: "Edition", name: "edition" },
];

/** Range i's inputs (`<name>_i`); the first range needs its diameter and its yield and tensile strengths. */
function rangeFields(i: number): FieldSpec[] {
  const first = i === 1;
  return [
    { label: `Up to diameter (mm) ${i}`, name: `max_diameter_mm_${i}`, decimal: true, required: first },
    { label: `Proof (MPa) ${i}`, name: `proof_mpa_${i}`, decimal: true },
    { label: `Yield (MPa) ${i}`, name: `yield_mpa_${i}`, decimal: true, required: first },
    { label: `Tensile (MPa) ${i}`, name: `tensile_mpa_${i}`, decimal: true, required: first },
    { label: `Allowable (MPa) ${i}`, name: `allowable_mpa_${i}`, decimal: true },
  ];
}

export function BoltingForm() {
  return (
    <StockroomForm
      action={createBoltingAction}
      title="Add a bolting material"
      submitLabel="Add bolting material"
      fields={MATERIAL}
    >
      {(e) =>
        [1, 2, 3].map((i) => (
          <fieldset key={i} className="grid gap-3 sm:grid-cols-5">
            <legend className="mb-1 text-table font-medium text-ink-700">
              Size range {i}
              {i > 1 ? " (optional)" : ""}
            </legend>
            <Fields specs={rangeFields(i)} errors={e} />
          </fieldset>
        ))
      }
    </StockroomForm>
  );
}
