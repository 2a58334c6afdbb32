"use client";

import { createFlangeTemplateAction } from "../actions";
import { StockroomForm, type FieldSpec } from "./stockroom-form";

// A flange template from the standard in hand (circular outline): dimensions in mm.
const FIELDS: FieldSpec[] = [
  { label: "Standard", name: "standard", required: true, hint: "e.g. EN 1092-1" },
  { label: "Class or PN", name: "pressure_class", required: true, hint: "e.g. PN 16, Class 300" },
  { label: "Size", name: "size", required: true, hint: "e.g. DN 150, NPS 6" },
  { label: "Outside diameter (mm)", name: "outside_diameter_mm", decimal: true, required: true },
  { label: "Bore (mm)", name: "bore_diameter_mm", decimal: true },
  { label: "Bolt circle (mm)", name: "bolt_circle_diameter_mm", decimal: true, required: true },
  { label: "Number of bolts", name: "bolt_count", whole: true, required: true },
  { label: "Bolt size", name: "bolt_designation", required: true, hint: "M20, 3/4 …" },
  { label: "Bolt diameter (mm)", name: "bolt_diameter_mm", decimal: true, required: true },
  { label: "Hole diameter (mm)", name: "hole_diameter_mm", decimal: true, required: true },
  { label: "Source", name: "source", required: true },
  { label: "Edition", name: "edition" },
];

export function FlangeForm() {
  return (
    <StockroomForm
      action={createFlangeTemplateAction}
      title="Add a flange template"
      submitLabel="Add flange template"
      fields={FIELDS}
    />
  );
}
