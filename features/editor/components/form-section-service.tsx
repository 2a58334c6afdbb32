"use client";
import { FIELD_SPECS, layerModulusSpec, layerThicknessSpec } from "../model/field-specs";
import { FormSection } from "./form-parts";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { TextField } from "./text-field";

interface Props {
  ctx: FormContext;
  meta: { name: string; equipmentTag: string };
  onMeta: (m: { name: string; equipmentTag: string }) => void;
}

/** Service, name and tag, design conditions and the plates of the stack. */
export function FormSectionService({ ctx, meta, onMeta }: Props) {
  const d = ctx.design;
  return (
    <FormSection title="Service">
      <div className="col-span-2">
        <TextField
          path="name"
          label="Name"
          value={meta.name}
          required
          maxLength={200}
          disabled={ctx.readOnly}
          serverError={ctx.errorFor("name")}
          onInvalid={(v) => ctx.setInvalid("name", v)}
          onCommit={(name) => {
            onMeta({ ...meta, name });
            ctx.dispatch({ type: "set-field", path: "name", value: name });
          }}
        />
      </div>
      <TextField
        path="equipmentTag"
        label="Equipment tag"
        value={meta.equipmentTag}
        maxLength={80}
        disabled={ctx.readOnly}
        onInvalid={(v) => ctx.setInvalid("equipmentTag", v)}
        onCommit={(equipmentTag) => onMeta({ ...meta, equipmentTag })}
      />
      <TextField
        path="description"
        label="Service / notes"
        value={d.description ?? ""}
        maxLength={2000}
        disabled={ctx.readOnly}
        onInvalid={(v) => ctx.setInvalid("description", v)}
        onCommit={(v) => ctx.dispatch({ type: "set-field", path: "description", value: v })}
      />
      <NumberField ctx={ctx} spec={FIELD_SPECS.designPressure} value={d.loads.designPressureMpa} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.designTemperature} value={d.loads.designTemperatureC} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.axialLoad} value={d.loads.axialLoadN} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.moment} value={d.loads.momentNmm} />
      {d.layers.map((l, i) =>
        l.role === "gasket" ? null : (
          <div key={i} className="col-span-2 grid grid-cols-2 gap-2 rounded border border-ink-100 p-1.5">
            <p className="col-span-2 text-micro font-medium text-ink-700">
              {l.role === "cover" ? "Cover" : "Flange"} plate{" "}
              {d.layers.slice(0, i + 1).filter((x) => x.role !== "gasket").length}
            </p>
            <NumberField
              ctx={ctx}
              spec={{
                ...layerThicknessSpec(i),
                label: `${l.role === "cover" ? "Cover" : "Flange"} thickness`,
              }}
              value={l.thicknessMm}
            />
            <NumberField ctx={ctx} spec={layerModulusSpec(i)} value={l.modulusMpa} />
            <div className="col-span-2">
              <TextField
                path={`layers.${i}.materialName`}
                label="Plate material"
                value={l.materialName}
                required
                maxLength={120}
                disabled={ctx.readOnly}
                onInvalid={(v) => ctx.setInvalid(`layers.${i}.materialName`, v)}
                onCommit={(v) =>
                  ctx.dispatch({ type: "set-field", path: `layers.${i}.materialName`, value: v })
                }
              />
            </div>
          </div>
        ),
      )}
    </FormSection>
  );
}
