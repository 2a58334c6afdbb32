"use client";
import type { Gasket } from "@/features/analysis/core/design";
import { choiceIdOfMaterial, useGasketChoices } from "@/features/library/hooks/use-gasket-choices";
import { LEAKAGE_CLASSES, type GasketChoiceDto, type LeakageClass } from "@/features/library/model/dto";
import { toGasketMaterial } from "@/features/library/model/gasket-material";
import { FIELD_SPECS } from "../model/field-specs";
import { withGasketForm } from "../model/gasket-form";
import { formatQuantity } from "../model/quantities";
import { FormSection } from "./form-parts";
import { fieldDomId, type FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { SelectField } from "./select-field";

const CUSTOM = "custom";

/** The tightness class whose Qmin/QSmin the design's copy carries (L0.1 when none matches). */
function copiedClass(row: GasketChoiceDto | undefined, qMinMpa: number | undefined): LeakageClass {
  if (!row || qMinMpa === undefined) return "L0.1";
  return LEAKAGE_CLASSES.find((c) => row.tightness[c]?.qMinMpa === qMinMpa) ?? "L0.1";
}

/**
 * Gasket material picked from the organisation's Stockroom (its own rows first, then the
 * built-in generic rows it did not hide), its dimensions and stiffness data. Picking copies the
 * row's values into the design; later Stockroom edits do not reach a saved revision.
 */
export function FormSectionGasket({ ctx }: { ctx: FormContext }) {
  const g = ctx.design.gasket;
  const mat = g.material;
  const choices = useGasketChoices(ctx.choices.builtinGaskets, !ctx.readOnly);
  const currentId = choiceIdOfMaterial(mat.catalogueId);
  const row = currentId ? choices.rows.find((r) => r.id === currentId) : undefined;
  const hasTightness = !!row && LEAKAGE_CLASSES.some((c) => row.tightness[c]?.qMinMpa != null);
  const leakage = copiedClass(row, mat.qMinMpa);
  const pick = (r: GasketChoiceDto, cls: LeakageClass) =>
    ctx.dispatch({
      type: "set-field",
      path: "gasket",
      value: { ...g, material: toGasketMaterial(r, cls) } as Gasket,
    });
  const own = choices.rows.filter((r) => r.origin === "organization");
  const builtin = choices.rows.filter((r) => r.origin === "builtin");
  const id = fieldDomId("gasket.material.catalogueId");
  return (
    <FormSection title="Gasket">
      <div className="col-span-2 flex flex-col gap-0.5">
        <label htmlFor={id} className="text-micro text-ink-600">
          Gasket material
        </label>
        <select
          id={id}
          className="rounded border border-ink-200 bg-white px-1.5 py-1 text-table"
          value={row ? row.id : CUSTOM}
          disabled={ctx.readOnly}
          onChange={(e) => {
            const r = choices.rows.find((x) => x.id === e.target.value);
            if (r) pick(r, "L0.1");
          }}
        >
          {!row && <option value={CUSTOM}>{mat.name} (copied into this design)</option>}
          {own.length > 0 && (
            <optgroup label="Our Stockroom">
              {own.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.name}
                </option>
              ))}
            </optgroup>
          )}
          <optgroup label="Built-in generic values">
            {builtin.map((r) => (
              <option key={r.id} value={r.id}>
                {r.name}
              </option>
            ))}
          </optgroup>
        </select>
        {choices.error && (
          <p className="text-micro text-verdict-warn">
            {choices.error} The built-in rows are listed meanwhile.
          </p>
        )}
        <p className="num mt-0.5 text-micro text-ink-600" data-testid="gasket-factors">
          m = {mat.m}, y = {formatQuantity("stress", mat.yMpa, ctx.units)}
          {mat.qMinMpa !== undefined ? `, Qmin = ${formatQuantity("stress", mat.qMinMpa, ctx.units)}` : ""}
          {mat.qsMinMpa !== undefined ? `, QSmin = ${formatQuantity("stress", mat.qsMinMpa, ctx.units)}` : ""}
          {mat.qsMaxMpa !== undefined
            ? `, Qsmax = ${formatQuantity("stress", mat.qsMaxMpa, ctx.units)}`
            : ""}{" "}
          — {mat.source}
        </p>
        <p className="text-micro text-ink-500">
          Generic values are design values only; the gasket maker&apos;s data supersede them.
        </p>
      </div>
      {hasTightness && row && (
        <div className="col-span-2">
          <SelectField
            path="gasket.material.tightnessClass"
            label="Tightness class for Qmin and QSmin"
            value={leakage}
            disabled={ctx.readOnly}
            options={LEAKAGE_CLASSES.filter((c) => row.tightness[c]?.qMinMpa != null).map((c) => ({
              value: c,
              label: `${c} mg/(s·m)`,
            }))}
            onChange={(c) => pick(row, c)}
          />
        </div>
      )}
      <div role="radiogroup" aria-label="Gasket form" className="col-span-2 flex flex-wrap gap-3 text-table">
        {(["ring", "full-face"] as const).map((form) => (
          <label key={form} className="flex items-center gap-1">
            <input
              type="radio"
              name="gasket-form"
              value={form}
              checked={g.kind === form}
              disabled={ctx.readOnly}
              onChange={() =>
                ctx.dispatch({ type: "set-field", path: "gasket", value: withGasketForm(ctx.design, form) })
              }
            />
            {form === "ring" ? "Ring gasket" : "Full-face gasket"}
          </label>
        ))}
      </div>
      <p className="col-span-2 text-micro text-ink-500" data-testid="gasket-form-note">
        {g.kind === "full-face"
          ? "Full-face gasket: covers the face inside the outline, less the bore and the holes."
          : g.geometry.kind === "annulus"
            ? "Ring gasket (circular)."
            : "Ring gasket band along the outline."}
      </p>
      {g.kind === "ring" && g.geometry.kind === "annulus" && (
        <>
          <NumberField ctx={ctx} spec={FIELD_SPECS.gasketInner} value={g.geometry.innerDiameterMm} />
          <NumberField ctx={ctx} spec={FIELD_SPECS.gasketOuter} value={g.geometry.outerDiameterMm} />
        </>
      )}
      {g.kind === "ring" && g.geometry.kind === "band" && (
        <>
          <NumberField ctx={ctx} spec={FIELD_SPECS.bandOffset} value={g.geometry.centreOffsetMm} />
          <NumberField ctx={ctx} spec={FIELD_SPECS.bandWidth} value={g.geometry.widthMm} />
        </>
      )}
      <NumberField ctx={ctx} spec={FIELD_SPECS.gasketThickness} value={mat.thicknessMm} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.gasketModulus} value={mat.modulusMpa} />
    </FormSection>
  );
}
