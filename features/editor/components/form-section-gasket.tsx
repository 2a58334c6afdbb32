"use client";
import { GASKET_TYPES, getGasketTypeById } from "@/features/analysis/core/catalogue/gaskets";
import type { Gasket } from "@/features/analysis/core/design";
import { FIELD_SPECS } from "../model/field-specs";
import { formatQuantity } from "../model/quantities";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { SelectField } from "./select-field";

const CUSTOM = "custom";

/** Gasket type from the catalogue (m, y and source shown), its dimensions and stiffness data. */
export function FormSectionGasket({ ctx }: { ctx: FormContext }) {
  const g = ctx.design.gasket;
  const mat = g.material;
  const row = mat.catalogueId ? getGasketTypeById(mat.catalogueId) : undefined;
  const choose = (id: string) => {
    const r = getGasketTypeById(id);
    if (!r) return;
    const material = { name: r.name, catalogueId: r.id, m: r.m, yMpa: r.yMpa, modulusMpa: r.typicalModulusMpa, thicknessMm: r.typicalThicknessMm, source: `${r.source}; ${r.edition}` };
    ctx.dispatch({ type: "set-field", path: "gasket", value: { ...g, material } as Gasket });
  };
  const options = [...(row ? [] : [{ value: CUSTOM, label: `${mat.name} (own data)` }]), ...GASKET_TYPES.map((t) => ({ value: t.id, label: t.name }))];
  return (
    <fieldset className="grid grid-cols-2 gap-2">
      <legend className="mb-1 text-table font-semibold text-ink-800">Gasket</legend>
      <div className="col-span-2">
        <SelectField path="gasket.material.catalogueId" label="Gasket type" value={row ? row.id : CUSTOM} options={options} disabled={ctx.readOnly} onChange={choose} />
        <p className="num mt-0.5 text-micro text-ink-600" data-testid="gasket-factors">
          m = {mat.m}, y = {formatQuantity("stress", mat.yMpa, ctx.units)}{mat.qMinMpa !== undefined ? `, Qmin = ${formatQuantity("stress", mat.qMinMpa, ctx.units)}` : ""}
          {mat.qsMaxMpa !== undefined ? `, Qsmax = ${formatQuantity("stress", mat.qsMaxMpa, ctx.units)}` : ""} — {mat.source}
        </p>
      </div>
      <p className="col-span-2 text-micro text-ink-500">{g.kind === "full-face" ? "Full-face gasket: covers the face inside the outline, less the bore and the holes." : g.geometry.kind === "annulus" ? "Ring gasket (circular)." : "Ring gasket band along the outline."}</p>
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
    </fieldset>
  );
}
