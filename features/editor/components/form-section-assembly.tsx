"use client";
import type { ConeAngleSetting, PreloadRule, TighteningMethod } from "@/features/analysis/core/design";
import { DEFAULT_FIXED_CONE_ANGLE_DEG } from "@/features/analysis/core/design";
import { FIELD_SPECS, fromBound } from "../model/field-specs";
import { FormSection } from "./form-parts";
import type { FormContext } from "./form-context";
import { NumberField } from "./number-field";
import { SelectField } from "./select-field";
import { TextField } from "./text-field";

const PRELOAD_DEFAULTS: Record<PreloadRule["kind"], number> = {
  "fraction-of-proof": 0.7,
  "fraction-of-yield": 0.5,
  "bolt-stress": 345,
};

/** Tightening method, preload rule, nut factor (with its source), cone angle and estimator. */
export function FormSectionAssembly({ ctx }: { ctx: FormContext }) {
  const a = ctx.design.assembly;
  const e = ctx.design.estimator;
  const methods = ctx.choices.tighteningMethods;
  const method = methods.find((m) => m.value === a.method);
  const preloadSpec =
    a.preload.kind === "bolt-stress"
      ? { ...FIELD_SPECS.preloadValue, label: "Target bolt stress", quantity: "stress" as const }
      : {
          ...FIELD_SPECS.preloadValue,
          ...fromBound("preloadFraction"),
          label: a.preload.kind === "fraction-of-proof" ? "Fraction of proof load" : "Fraction of yield",
        };
  return (
    <FormSection title="Tightening">
      <div className="col-span-2">
        <SelectField
          path="assembly.method"
          label="Tightening method"
          value={a.method}
          disabled={ctx.readOnly}
          onChange={(m: TighteningMethod) =>
            ctx.dispatch({ type: "set-field", path: "assembly.method", value: m })
          }
          options={methods.map((m) => ({ value: m.value, label: m.label }))}
          hint={method?.hint}
        />
      </div>
      <SelectField
        path="assembly.preload.kind"
        label="Preload rule"
        value={a.preload.kind}
        disabled={ctx.readOnly}
        onChange={(k: PreloadRule["kind"]) =>
          ctx.dispatch({
            type: "set-field",
            path: "assembly.preload",
            value: { kind: k, value: PRELOAD_DEFAULTS[k] },
          })
        }
        options={[
          { value: "fraction-of-proof", label: "Fraction of proof load" },
          { value: "fraction-of-yield", label: "Fraction of yield" },
          { value: "bolt-stress", label: "Bolt stress" },
        ]}
      />
      <NumberField ctx={ctx} spec={preloadSpec} value={a.preload.value} />
      <NumberField ctx={ctx} spec={FIELD_SPECS.nutFactor} value={a.nutFactor.value} />
      <TextField
        path="assembly.nutFactor.source"
        label="Nut factor source"
        value={a.nutFactor.source}
        required
        maxLength={300}
        disabled={ctx.readOnly}
        onInvalid={(v) => ctx.setInvalid("assembly.nutFactor.source", v)}
        onCommit={(v) => ctx.dispatch({ type: "set-field", path: "assembly.nutFactor.source", value: v })}
      />
      <SelectField
        path="estimator.coneAngle.mode"
        label="Cone angle"
        value={e.coneAngle.mode}
        disabled={ctx.readOnly}
        onChange={(m) =>
          ctx.dispatch({
            type: "set-field",
            path: "estimator.coneAngle",
            value: (m === "fixed"
              ? { mode: "fixed", degrees: DEFAULT_FIXED_CONE_ANGLE_DEG }
              : { mode: "thickness-dependent" }) as ConeAngleSetting,
          })
        }
        options={[
          { value: "thickness-dependent", label: "Thickness-dependent" },
          { value: "fixed", label: "Fixed angle" },
        ]}
      />
      {e.coneAngle.mode === "fixed" ? (
        <NumberField ctx={ctx} spec={FIELD_SPECS.coneDegrees} value={e.coneAngle.degrees} />
      ) : (
        <span />
      )}
      <SelectField
        path="estimator.estimator"
        label="Gasket stress estimate"
        value={e.estimator}
        disabled={ctx.readOnly}
        onChange={(v) => ctx.dispatch({ type: "set-field", path: "estimator.estimator", value: v })}
        options={[
          { value: "auto", label: "Choose by stiffness" },
          { value: "cone", label: "Cone superposition" },
          { value: "beam", label: "Beam on elastic foundation" },
        ]}
      />
    </FormSection>
  );
}
