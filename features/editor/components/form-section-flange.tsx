"use client";
import {
  findThreadIn,
  rangeForDiameter,
  sortedStrengthRanges,
} from "@/features/analysis/core/catalogue/lookups";
import type { FlangeDesignInputs } from "@/features/analysis/core/design";
import { FIELD_SPECS } from "../model/field-specs";
import { FormSection } from "./form-parts";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { SelectField } from "./select-field";
import { TextField } from "./text-field";

const KIND_OPTIONS: { value: FlangeDesignInputs["kind"]; label: string }[] = [
  { value: "not-entered", label: "Not entered (no flange stresses)" },
  { value: "integral-hub", label: "Integral, with tapered hub (weld neck)" },
  { value: "integral-no-hub", label: "Integral, no hub taper (g1 = g0)" },
  { value: "ring-loose", label: "Loose ring, no hub" },
];

const SPECS = {
  g0: FIELD_SPECS.hubSmallEnd,
  g1: FIELD_SPECS.hubBack,
  h: FIELD_SPECS.hubLength,
  test: FIELD_SPECS.testPressure,
  boltAllowable: FIELD_SPECS.boltAllowable,
};

/**
 * "Flange and cover" section: the Appendix 2 flange type and hub, flange and cover materials, the
 * UG-34 cover sketch, the test pressure, and an allowable bolt stress with its source for bolting
 * ASME lists none for.
 */
export function FormSectionFlange({ ctx }: { ctx: FormContext }) {
  const d = ctx.design;
  const fd: FlangeDesignInputs = d.flangeDesign ?? { kind: "not-entered" };
  const set = (next: Partial<FlangeDesignInputs>) =>
    ctx.dispatch({ type: "set-field", path: "flangeDesign", value: { ...fd, ...next } });
  const hub = fd.hub ?? { g0Mm: 6, g1Mm: 12, hMm: 40 };
  const hasCover = d.layers.some((l) => l.role === "cover");
  const f = d.fastener;
  const { threads, boltMaterials, flangeMaterials, coverSketches } = ctx.choices;
  const nominal = findThreadIn(threads, f.designation, f.threadSeries)?.nominalDiameterMm ?? 20;
  // The bolting's allowable: its embedded Stockroom copy's, else the catalogue row's (none: undefined).
  const catalogueRow = f.stockedMaterial ? undefined : boltMaterials.find((m) => m.value === f.materialId);
  const boltingName = f.stockedMaterial ? f.stockedMaterial.name : catalogueRow?.label;
  const allowables = f.stockedMaterial
    ? sortedStrengthRanges(f.stockedMaterial.ranges)
    : catalogueRow?.allowables;
  const catalogueAllowable = allowables
    ? (rangeForDiameter(allowables, nominal)?.allowableMpa ?? null)
    : null;
  const materialOptions = [{ value: "", label: "Not chosen" }, ...flangeMaterials];
  const entered = f.enteredAllowable ?? null;
  // The flange's and the cover's material: a catalogue row, or none chosen yet.
  const materialSelect = (key: "flangeMaterialId" | "coverMaterialId", label: string) => (
    <SelectField
      path={`flangeDesign.${key}`}
      label={label}
      value={fd[key] ?? ""}
      disabled={ctx.readOnly}
      onChange={(id) => set({ [key]: id === "" ? null : id })}
      options={materialOptions}
    />
  );
  const setBoltAllowable = (next: { valueMpa: number; source: string } | null) =>
    ctx.dispatch({ type: "set-field", path: "fastener", value: { ...f, enteredAllowable: next } });
  return (
    <FormSection title="Flange and cover">
      <SelectField
        path="flangeDesign.kind"
        label="Flange type (Appendix 2)"
        value={fd.kind}
        disabled={ctx.readOnly}
        onChange={(kind) =>
          set({ kind, hub: kind === "integral-hub" || kind === "integral-no-hub" ? hub : (fd.hub ?? null) })
        }
        options={KIND_OPTIONS}
      />
      {materialSelect("flangeMaterialId", "Flange material")}
      {(fd.kind === "integral-hub" || fd.kind === "integral-no-hub") && (
        <>
          <NumberField
            ctx={ctx}
            spec={SPECS.g0}
            value={hub.g0Mm}
            onCommit={(g0Mm) =>
              set({ hub: { ...hub, g0Mm, g1Mm: fd.kind === "integral-no-hub" ? g0Mm : hub.g1Mm } })
            }
          />
          {fd.kind === "integral-hub" && (
            <>
              <NumberField
                ctx={ctx}
                spec={SPECS.g1}
                value={hub.g1Mm}
                onCommit={(g1Mm) => set({ hub: { ...hub, g1Mm } })}
              />
              <NumberField
                ctx={ctx}
                spec={SPECS.h}
                value={hub.hMm}
                onCommit={(hMm) => set({ hub: { ...hub, hMm } })}
              />
            </>
          )}
        </>
      )}
      {hasCover && (
        <>
          <SelectField
            path="flangeDesign.coverSketch"
            label="Cover attachment (UG-34 sketch, C)"
            value={fd.coverSketch?.kind === "catalogue" ? fd.coverSketch.id : ""}
            disabled={ctx.readOnly}
            onChange={(id) => set({ coverSketch: id === "" ? null : { kind: "catalogue", id } })}
            options={[{ value: "", label: "Not chosen" }, ...coverSketches]}
          />
          {materialSelect("coverMaterialId", "Cover material")}
        </>
      )}
      <NumberField
        ctx={ctx}
        spec={SPECS.test}
        value={fd.testPressureMpa ?? 0}
        onCommit={(p) => set({ testPressureMpa: p > 0 ? p : null })}
      />
      {(catalogueAllowable === null || entered) && (
        <>
          <NumberField
            ctx={ctx}
            spec={SPECS.boltAllowable}
            value={entered?.valueMpa ?? 0}
            onCommit={(v) => setBoltAllowable(v > 0 ? { valueMpa: v, source: entered?.source ?? "" } : null)}
          />
          <TextField
            path="fastener.enteredAllowable.source"
            label="Source of the bolt allowable"
            value={entered?.source ?? ""}
            maxLength={300}
            required={!!entered}
            disabled={ctx.readOnly || !entered}
            onCommit={(source) => entered && setBoltAllowable({ ...entered, source })}
            onInvalid={(bad) => ctx.setInvalid("fastener.enteredAllowable.source", bad)}
            serverError={ctx.errorFor("fastener.enteredAllowable.source")}
          />
          <p className="col-span-2 text-micro text-ink-500">
            {boltingName ?? "This bolting"} has no ASME II-D allowable: the Appendix 2 bolt-area check runs
            only on an allowable you enter, with its source.
          </p>
        </>
      )}
    </FormSection>
  );
}
