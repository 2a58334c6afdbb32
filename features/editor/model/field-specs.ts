/**
 * The numeric fields of the joint data form: where each lives in the design, its quantity, and
 * the bounds the form enforces before a value reaches the document. The bounds are the sane range
 * of the product (the zod schema and the core's validation remain the authority on the whole
 * document); internal units as in core/design.ts.
 */
import type { UnitSystem } from "@/features/analysis/core/design";
import { fromDisplay, unitLabel, type Quantity } from "./quantities";

export interface NumberFieldSpec {
  path: string;
  label: string;
  quantity: Quantity;
  /** Inclusive bounds in internal units; `minExclusive` for "greater than". */
  min: number;
  minExclusive?: boolean;
  max: number;
  integer?: boolean;
}

export const FIELD_SPECS = {
  designPressure: {
    path: "loads.designPressureMpa",
    label: "Design pressure",
    quantity: "stress",
    min: 0,
    max: 700,
  },
  designTemperature: {
    path: "loads.designTemperatureC",
    label: "Design temperature",
    quantity: "temperature",
    min: -273,
    max: 1000,
  },
  axialLoad: { path: "loads.axialLoadN", label: "External axial load", quantity: "force", min: 0, max: 1e9 },
  moment: { path: "loads.momentNmm", label: "External moment", quantity: "moment", min: 0, max: 1e12 },
  boltLength: {
    path: "fastener.lengthMm",
    label: "Bolt length",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 5000,
  },
  holeDiameter: {
    path: "fastener.holeDiameterMm",
    label: "Hole diameter",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 300,
  },
  washerThickness: {
    path: "fastener.washer.thicknessMm",
    label: "Washer thickness",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 100,
  },
  washerOuter: {
    path: "fastener.washer.outerDiameterMm",
    label: "Washer outer diameter",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 500,
  },
  engagement: {
    path: "fastener.termination.engagementMm",
    label: "Thread engagement",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 1000,
  },
  memberThickness: {
    path: "fastener.termination.memberThicknessMm",
    label: "Tapped member thickness",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 5000,
  },
  memberModulus: {
    path: "fastener.termination.memberModulusMpa",
    label: "Tapped member modulus",
    quantity: "stress",
    min: 0,
    minExclusive: true,
    max: 1e6,
  },
  gasketThickness: {
    path: "gasket.material.thicknessMm",
    label: "Gasket thickness",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 100,
  },
  gasketModulus: {
    path: "gasket.material.modulusMpa",
    label: "Gasket modulus",
    quantity: "stress",
    min: 0,
    minExclusive: true,
    max: 1e6,
  },
  gasketInner: {
    path: "gasket.geometry.innerDiameterMm",
    label: "Gasket inner diameter",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 20000,
  },
  gasketOuter: {
    path: "gasket.geometry.outerDiameterMm",
    label: "Gasket outer diameter",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 20000,
  },
  bandOffset: {
    path: "gasket.geometry.centreOffsetMm",
    label: "Gasket band centre from edge",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 10000,
  },
  bandWidth: {
    path: "gasket.geometry.widthMm",
    label: "Gasket band width",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 10000,
  },
  nutFactor: {
    path: "assembly.nutFactor.value",
    label: "Nut factor K",
    quantity: "ratio",
    min: 0.05,
    max: 0.6,
  },
  preloadValue: {
    path: "assembly.preload.value",
    label: "Target preload",
    quantity: "ratio",
    min: 0,
    minExclusive: true,
    max: 2000,
  },
  coneDegrees: {
    path: "estimator.coneAngle.degrees",
    label: "Cone angle",
    quantity: "angle",
    min: 5,
    max: 60,
  },
  boltCount: { path: "bolts", label: "Bolt count", quantity: "count", min: 1, max: 512, integer: true },
} satisfies Record<string, NumberFieldSpec>;

export function layerThicknessSpec(index: number): NumberFieldSpec {
  return {
    path: `layers.${index}.thicknessMm`,
    label: "Flange thickness",
    quantity: "length",
    min: 0,
    minExclusive: true,
    max: 2000,
  };
}

export function layerModulusSpec(index: number): NumberFieldSpec {
  return {
    path: `layers.${index}.modulusMpa`,
    label: "Flange modulus",
    quantity: "stress",
    min: 0,
    minExclusive: true,
    max: 1e6,
  };
}

export type ParsedField = { ok: true; value: number } | { ok: false; message: string };

/**
 * Parses what the user typed (in display units) into an internal value, or a message for the
 * field. Accepts a decimal comma; refuses empty, non-numeric, out-of-range and non-integer counts.
 */
export function parseNumberField(spec: NumberFieldSpec, raw: string, units: UnitSystem): ParsedField {
  const text = raw.trim().replace(",", ".");
  if (text === "") return { ok: false, message: `${spec.label} is required.` };
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text))
    return { ok: false, message: `${spec.label} must be a number.` };
  const display = Number(text);
  if (!Number.isFinite(display)) return { ok: false, message: `${spec.label} must be a finite number.` };
  if (spec.integer && !Number.isInteger(display))
    return { ok: false, message: `${spec.label} must be a whole number.` };
  const value = spec.quantity === "count" ? display : fromDisplay(spec.quantity, display, units);
  const unit = unitLabel(spec.quantity, units);
  const bound = (v: number) => {
    const d =
      spec.quantity === "temperature" && units === "US" ? (v * 9) / 5 + 32 : displayBound(spec, v, units);
    return `${Number(d.toPrecision(4))}${unit ? ` ${unit}` : ""}`;
  };
  if (spec.minExclusive ? !(value > spec.min) : !(value >= spec.min - 1e-12)) {
    return {
      ok: false,
      message:
        spec.minExclusive && spec.min === 0
          ? `${spec.label} must be greater than zero.`
          : `${spec.label} must be at least ${bound(spec.min)}.`,
    };
  }
  if (value > spec.max * (1 + 1e-12))
    return { ok: false, message: `${spec.label} must be at most ${bound(spec.max)}.` };
  return { ok: true, value };
}

function displayBound(spec: NumberFieldSpec, v: number, units: UnitSystem): number {
  if (spec.quantity === "count") return v;
  // toDisplay via the inverse of fromDisplay's factor (linear for every quantity but temperature).
  const one = fromDisplay(spec.quantity, 1, units);
  return one === 0 ? v : v / one;
}
