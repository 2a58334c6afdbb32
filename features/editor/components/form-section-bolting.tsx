"use client";
import { findThreadIn } from "@/features/analysis/core/catalogue/lookups";
import type { Fastener } from "@/features/analysis/core/design";
import { inToMm } from "@/features/analysis/core/units";
import { FIELD_SPECS } from "../model/field-specs";
import { FormSection } from "./form-parts";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { SelectField } from "./select-field";

/** Bolt size, material, count, length, hole, washers and the nut or tapped hole. */
export function FormSectionBolting({ ctx }: { ctx: FormContext }) {
  const d = ctx.design;
  const f = d.fastener;
  const { threads, boltMaterials } = ctx.choices;
  const setFastener = (next: Fastener) => ctx.dispatch({ type: "set-field", path: "fastener", value: next });
  const size =
    threads.find((t) => t.designation === f.designation && t.series === f.threadSeries)?.value ?? "";
  const chooseSize = (id: string) => {
    const t = threads.find((x) => x.value === id);
    if (!t) return;
    // A new size brings its usual clearance hole (ISO 273 medium ≈ d + 2/3 mm; inch d + 1/8 in) [practice].
    const hole =
      t.series === "metric-coarse"
        ? t.nominalDiameterMm + (t.nominalDiameterMm <= 24 ? 2 : 3)
        : t.nominalDiameterMm + inToMm(0.125);
    const washer =
      f.washer && f.washer.outerDiameterMm <= hole
        ? { ...f.washer, outerDiameterMm: 2 * t.nominalDiameterMm }
        : f.washer;
    setFastener({ ...f, designation: t.designation, threadSeries: t.series, holeDiameterMm: hole, washer });
  };
  const nominal = findThreadIn(threads, f.designation, f.threadSeries)?.nominalDiameterMm ?? 20;
  return (
    <FormSection title="Bolting">
      <SelectField
        path="fastener.designation"
        label="Bolt size"
        value={size}
        disabled={ctx.readOnly}
        onChange={chooseSize}
        options={threads.map((t) => ({ value: t.value, label: t.label }))}
      />
      <SelectField
        path="fastener.materialId"
        label="Bolt material"
        value={f.materialId}
        disabled={ctx.readOnly}
        onChange={(materialId) => {
          if (materialId === f.materialId) return;
          // A catalogue material replaces the Stockroom copy the design carried.
          const { stockedMaterial: _copy, ...rest } = f;
          setFastener({ ...rest, materialId });
        }}
        options={[
          ...(f.stockedMaterial
            ? [{ value: f.materialId, label: `${f.stockedMaterial.name} (copied from our Stockroom)` }]
            : []),
          ...boltMaterials.map((m) => ({ value: m.value, label: m.label })),
        ]}
      />
      <NumberField
        ctx={ctx}
        spec={FIELD_SPECS.boltCount}
        value={d.bolts.length}
        onCommit={(n) => ctx.dispatch({ type: "place-equally", count: n })}
      />
      <SelectField
        path="fastener.form"
        label="Bolt form"
        value={f.form}
        disabled={ctx.readOnly}
        onChange={(form) => setFastener({ ...f, form })}
        options={[
          { value: "stud", label: "Stud (threaded full length)" },
          { value: "hex-bolt", label: "Hex bolt" },
        ]}
      />
      <NumberField ctx={ctx} spec={FIELD_SPECS.boltLength} value={f.lengthMm} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.holeDiameter} value={f.holeDiameterMm} />
      <SelectField
        path="fastener.washer"
        label="Washers"
        value={f.washer ? "yes" : "no"}
        disabled={ctx.readOnly}
        onChange={(v) =>
          setFastener({
            ...f,
            washer:
              v === "yes"
                ? {
                    thicknessMm: Math.max(2, 0.15 * nominal),
                    outerDiameterMm: Math.max(2 * nominal, f.holeDiameterMm + 4),
                  }
                : null,
          })
        }
        options={[
          { value: "no", label: "None" },
          { value: "yes", label: "One under each nut/head" },
        ]}
      />
      <SelectField
        path="fastener.washerActsAs"
        label="Washer acts as"
        value={f.washerActsAs ?? "rigid"}
        disabled={ctx.readOnly}
        onChange={(v) => setFastener({ ...f, washerActsAs: v === "flexible" ? "flexible" : "rigid" })}
        options={[
          { value: "rigid", label: "Rigid (flat bearing face)" },
          { value: "flexible", label: "Flexible (uniform pressure)" },
        ]}
      />
      <SelectField
        path="fastener.termination.kind"
        label="Nut or tapped hole"
        value={f.termination.kind}
        disabled={ctx.readOnly}
        onChange={(k) =>
          setFastener({
            ...f,
            termination:
              k === "nut"
                ? { kind: "nut" }
                : {
                    kind: "tapped-hole",
                    engagementMm: 1.5 * nominal,
                    memberThicknessMm: 3 * nominal,
                    memberModulusMpa: 200_000,
                  },
          })
        }
        options={[
          { value: "nut", label: "Nut" },
          { value: "tapped-hole", label: "Tapped hole" },
        ]}
      />
      {f.washer && (
        <>
          <NumberField ctx={ctx} spec={FIELD_SPECS.washerThickness} value={f.washer.thicknessMm} />
          <NumberField ctx={ctx} spec={FIELD_SPECS.washerOuter} value={f.washer.outerDiameterMm} />
        </>
      )}
      {f.termination.kind === "tapped-hole" && (
        <>
          <NumberField ctx={ctx} spec={FIELD_SPECS.engagement} value={f.termination.engagementMm} />
          <NumberField ctx={ctx} spec={FIELD_SPECS.memberThickness} value={f.termination.memberThicknessMm} />
          <NumberField ctx={ctx} spec={FIELD_SPECS.memberModulus} value={f.termination.memberModulusMpa} />
        </>
      )}
    </FormSection>
  );
}
