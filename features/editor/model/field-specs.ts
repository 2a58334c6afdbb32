/**
 * The numeric fields of the joint data form: where each lives in the design, its quantity, and
 * the bounds the form enforces before a value reaches the document. The bounds come from the
 * core's one table (core/bounds.ts), which the zod schema and the core's validator read too;
 * internal units as in core/design.ts.
 */
import { INPUT_BOUNDS, type BoundName, type InputBound } from "@/features/analysis/core/bounds";
import { MAX_BOLT_COUNT, type UnitSystem } from "@/features/analysis/core/design";
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
  /** Why the range is where it is (core/bounds.ts), added to out-of-range messages. */
  why?: string;
}

/** min, max and the reason from the core's bounds table (the same ranges the schema enforces). */
export function fromBound(name: BoundName): Pick<NumberFieldSpec, "min" | "minExclusive" | "max" | "why"> {
  const b: InputBound = INPUT_BOUNDS[name];
  return { min: b.min, minExclusive: b.minExclusive, max: b.max, why: b.why };
}

export const FIELD_SPECS = {
  designPressure: {
    path: "loads.designPressureMpa",
    label: "Design pressure",
    quantity: "stress",
    ...fromBound("designPressureMpa"),
  },
  designTemperature: {
    path: "loads.designTemperatureC",
    label: "Design temperature",
    quantity: "temperature",
    ...fromBound("designTemperatureC"),
  },
  axialLoad: {
    path: "loads.axialLoadN",
    label: "External axial load",
    quantity: "force",
    ...fromBound("axialLoadN"),
  },
  moment: {
    path: "loads.momentNmm",
    label: "External moment",
    quantity: "moment",
    ...fromBound("momentNmm"),
  },
  boltLength: {
    path: "fastener.lengthMm",
    label: "Bolt length",
    quantity: "length",
    ...fromBound("boltLengthMm"),
  },
  holeDiameter: {
    path: "fastener.holeDiameterMm",
    label: "Hole diameter",
    quantity: "length",
    ...fromBound("holeDiameterMm"),
  },
  washerThickness: {
    path: "fastener.washer.thicknessMm",
    label: "Washer thickness",
    quantity: "length",
    ...fromBound("washerThicknessMm"),
  },
  washerOuter: {
    path: "fastener.washer.outerDiameterMm",
    label: "Washer outer diameter",
    quantity: "length",
    ...fromBound("washerOuterDiameterMm"),
  },
  engagement: {
    path: "fastener.termination.engagementMm",
    label: "Thread engagement",
    quantity: "length",
    ...fromBound("engagementMm"),
  },
  memberThickness: {
    path: "fastener.termination.memberThicknessMm",
    label: "Tapped member thickness",
    quantity: "length",
    ...fromBound("tappedMemberThicknessMm"),
  },
  memberModulus: {
    path: "fastener.termination.memberModulusMpa",
    label: "Tapped member modulus",
    quantity: "stress",
    ...fromBound("plateModulusMpa"),
  },
  gasketThickness: {
    path: "gasket.material.thicknessMm",
    label: "Gasket thickness",
    quantity: "length",
    ...fromBound("gasketThicknessMm"),
  },
  gasketModulus: {
    path: "gasket.material.modulusMpa",
    label: "Gasket modulus",
    quantity: "stress",
    ...fromBound("gasketModulusMpa"),
  },
  gasketInner: {
    path: "gasket.geometry.innerDiameterMm",
    label: "Gasket inner diameter",
    quantity: "length",
    ...fromBound("planDimensionMm"),
  },
  gasketOuter: {
    path: "gasket.geometry.outerDiameterMm",
    label: "Gasket outer diameter",
    quantity: "length",
    ...fromBound("planDimensionMm"),
  },
  bandOffset: {
    path: "gasket.geometry.centreOffsetMm",
    label: "Gasket band centre from edge",
    quantity: "length",
    ...fromBound("planDimensionMm"),
  },
  bandWidth: {
    path: "gasket.geometry.widthMm",
    label: "Gasket band width",
    quantity: "length",
    ...fromBound("planDimensionMm"),
  },
  nutFactor: {
    path: "assembly.nutFactor.value",
    label: "Nut factor K",
    quantity: "ratio",
    ...fromBound("nutFactor"),
  },
  preloadValue: {
    path: "assembly.preload.value",
    label: "Target preload",
    quantity: "ratio",
    ...fromBound("preloadStressMpa"),
  },
  coneDegrees: {
    path: "estimator.coneAngle.degrees",
    label: "Cone angle",
    quantity: "angle",
    ...fromBound("coneAngleDeg"),
  },
  hubSmallEnd: {
    path: "flangeDesign.hub.g0Mm",
    label: "Hub at small end g0 / shell wall",
    quantity: "length",
    ...fromBound("hubThicknessMm"),
  },
  hubBack: {
    path: "flangeDesign.hub.g1Mm",
    label: "Hub at flange back g1",
    quantity: "length",
    ...fromBound("hubThicknessMm"),
  },
  hubLength: {
    path: "flangeDesign.hub.hMm",
    label: "Hub length h",
    quantity: "length",
    ...fromBound("hubDimensionMm"),
  },
  /** 0 clears the entry (null), so the field takes 0 although the document's range starts above it. */
  testPressure: {
    path: "flangeDesign.testPressureMpa",
    label: "Hydrostatic test pressure (0: not entered)",
    quantity: "stress",
    ...fromBound("designPressureMpa"),
  },
  /** 0 clears the entry (null), so the field takes 0 although the document's range starts above it. */
  boltAllowable: {
    path: "fastener.enteredAllowable.valueMpa",
    label: "Allowable bolt stress, entered (0: none)",
    quantity: "stress",
    ...fromBound("allowableStressMpa"),
    min: 0,
    minExclusive: false,
  },
  boltCount: {
    path: "bolts",
    label: "Bolt count",
    quantity: "count",
    min: 1,
    max: MAX_BOLT_COUNT,
    integer: true,
  },
} satisfies Record<string, NumberFieldSpec>;

export function layerThicknessSpec(index: number): NumberFieldSpec {
  return {
    path: `layers.${index}.thicknessMm`,
    label: "Flange thickness",
    quantity: "length",
    ...fromBound("plateThicknessMm"),
  };
}

export function layerModulusSpec(index: number): NumberFieldSpec {
  return {
    path: `layers.${index}.modulusMpa`,
    label: "Flange modulus",
    quantity: "stress",
    ...fromBound("plateModulusMpa"),
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
  const because = spec.why ? ` (${spec.why})` : "";
  if (spec.minExclusive ? !(value > spec.min) : !(value >= spec.min - 1e-12)) {
    return {
      ok: false,
      message:
        spec.minExclusive && spec.min === 0
          ? `${spec.label} must be greater than zero.`
          : `${spec.label} must be at least ${bound(spec.min)}${because}.`,
    };
  }
  if (value > spec.max * (1 + 1e-12))
    return { ok: false, message: `${spec.label} must be at most ${bound(spec.max)}${because}.` };
  return { ok: true, value };
}

function displayBound(spec: NumberFieldSpec, v: number, units: UnitSystem): number {
  if (spec.quantity === "count") return v;
  // toDisplay via the inverse of fromDisplay's factor (linear for every quantity but temperature).
  const one = fromDisplay(spec.quantity, 1, units);
  return one === 0 ? v : v / one;
}
