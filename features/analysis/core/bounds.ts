/**
 * Plausible ranges of every physical input of a design document: the one table read by the zod
 * schema (features/analysis/schema.ts), the JSON Schema it publishes (/api/v1/schema/design), the
 * editor's field specs (features/editor/model/field-specs.ts) and the core's own validator
 * (validate.ts). A value outside its range is refused with the range and the reason, instead of
 * being computed into silent nonsense (a 1e-320 mm flange, a gasket modulus of 1e300 MPa).
 *
 * The ranges are deliberately wide: they bracket every real bolted, gasketed joint, not a design
 * rule. Internal units (mm, N, MPa, N·mm, °C). Each row says why its limits are where they are;
 * tags as in the README ([pub2], [mem], [practice]).
 */

export interface InputBound {
  min: number;
  /** When true the minimum itself is refused ("greater than"). */
  minExclusive?: boolean;
  max: number;
  integer?: boolean;
  /** Unit of min and max as shown in messages ("" for ratios and counts). */
  unit: string;
  /** Why the range is where it is (shown in the error and published in the JSON Schema). */
  why: string;
}

export const INPUT_BOUNDS = {
  planDimensionMm: {
    min: 1,
    max: 100_000,
    unit: "mm",
    why: "no part of a bolted flange is under 1 mm (the smallest bolt in the catalogue is M10); 100 m is beyond the largest vessel or duct flange [practice]",
  },
  planCoordinateMm: {
    min: -100_000,
    max: 100_000,
    unit: "mm",
    why: "outline points lie within the 100 m limit of a flange [practice]",
  },
  cornerRadiusMm: {
    min: 0,
    max: 100_000,
    unit: "mm",
    why: "0 for a sharp corner, at most the 100 m limit of a flange [practice]",
  },
  plateThicknessMm: {
    min: 0.5,
    max: 2000,
    unit: "mm",
    why: "thinner than 0.5 mm is foil, not a bolted cover; 2 m is beyond the thickest tube sheet or blind flange [practice]",
  },
  plateModulusMpa: {
    min: 1000,
    max: 500_000,
    unit: "MPa",
    why: "plastic and GRP flanges start near 1 GPa; the stiffest structural metal (tungsten) is about 400 GPa [mem]",
  },
  gasketThicknessMm: {
    min: 0.05,
    max: 100,
    unit: "mm",
    why: "coated and thin metal gaskets start near 0.1 mm; 100 mm is beyond any gasket or rubber pad [practice]",
  },
  gasketModulusMpa: {
    min: 0.1,
    max: 500_000,
    unit: "MPa",
    why: "sponge rubber is about 0.1–1 MPa; no gasket is stiffer than solid metal (steel about 200 GPa) [mem]",
  },
  gasketFactorM: {
    min: 0,
    max: 20,
    unit: "",
    why: "ASME VIII-1 Table 2-5.1 gasket factors m run from 0 to 6.5 [pub2]; 20 leaves room for maker's data",
  },
  gasketStressMpa: {
    min: 0,
    max: 1000,
    unit: "MPa",
    why: "seating stresses y, Qmin and QSmin of published gasket data stay below about 200 MPa (solid flat metal, ASME Table 2-5.1) [pub2]; 1000 MPa leaves room for maker's data",
  },
  gasketCrushMpa: {
    min: 0,
    minExclusive: true,
    max: 5000,
    unit: "MPa",
    why: "a crush limit is positive; no gasket bears more than the yield of hard metals, well under 5 GPa [practice]",
  },
  boltLengthMm: {
    min: 1,
    max: 5000,
    unit: "mm",
    why: "a bolt is longer than 1 mm; studs over 5 m do not occur in flanged joints [practice]",
  },
  holeDiameterMm: {
    min: 1,
    max: 300,
    unit: "mm",
    why: "the catalogue's largest bolt (M64, 2-1/2 in) needs a hole of about 70 mm; 300 mm leaves room for sleeves [practice]",
  },
  washerThicknessMm: {
    min: 0.1,
    max: 100,
    unit: "mm",
    why: "shims start near 0.1 mm; 100 mm is beyond any through-hardened washer or spacer [practice]",
  },
  washerOuterDiameterMm: {
    min: 1,
    max: 500,
    unit: "mm",
    why: "a washer for the largest catalogue bolt is about 130 mm across; 500 mm covers load spreaders [practice]",
  },
  engagementMm: {
    min: 0.5,
    max: 1000,
    unit: "mm",
    why: "thread engagement of at least one pitch; 1 m is beyond any tapped hole [practice]",
  },
  tappedMemberThicknessMm: {
    min: 0.5,
    max: 5000,
    unit: "mm",
    why: "a tapped part is at least as thick as its engagement; 5 m bounds a casting or nozzle forging [practice]",
  },
  allowableStressMpa: {
    min: 0,
    minExclusive: true,
    max: 2000,
    unit: "MPa",
    why: "an entered allowable stress of bolting, flange or cover; 2000 MPa is beyond the tensile strength of every catalogue material [practice]",
  },
  hubThicknessMm: {
    min: 0,
    minExclusive: true,
    max: 5000,
    unit: "mm",
    why: "a flange hub's wall thickness g0 or g1 is positive (Appendix 2 divides by g0); 5 m bounds the largest forged or fabricated hub [practice]",
  },
  hubDimensionMm: {
    min: 0,
    max: 5000,
    unit: "mm",
    why: "a flange hub's length; 5 m bounds the largest forged or fabricated hub [practice]",
  },
  designPressureMpa: {
    min: 0,
    max: 700,
    unit: "MPa",
    why: "700 MPa (about 100,000 psi) is beyond the highest-pressure process equipment [practice]",
  },
  designTemperatureC: {
    min: -273,
    max: 1000,
    unit: "°C",
    why: "absolute zero to beyond the limit of any gasket or bolting material [practice]",
  },
  axialLoadN: {
    min: 0,
    max: 1e9,
    unit: "N",
    why: "an external pull (0 or more); 1 GN is beyond any joint the catalogue's bolts can hold [practice]",
  },
  momentNmm: {
    min: 0,
    max: 1e12,
    unit: "N·mm",
    why: "an external bending moment (0 or more); 1e12 N·mm (1 GN·m) is beyond any flanged joint [practice]",
  },
  nutFactor: {
    min: 0.05,
    max: 0.5,
    unit: "",
    why: "published nut factors K run from about 0.1 (well lubricated) to 0.3 (dry steel); 0.05 and 0.5 bracket them with margin [practice]",
  },
  preloadFraction: {
    min: 0,
    minExclusive: true,
    max: 1.2,
    unit: "",
    why: "a fraction of proof or yield load; above 1.2 the bolt would yield while tightening [practice]",
  },
  preloadStressMpa: {
    min: 0,
    minExclusive: true,
    max: 2000,
    unit: "MPa",
    why: "a bolt stress; 2000 MPa is beyond the tensile strength of every catalogue bolt material (12.9: 1220 MPa) [pub2]",
  },
  scatter: {
    min: 0,
    max: 0.9,
    unit: "",
    why: "the widest method scatter is ±30 % (torque wrench) [pub2]; at ±90 % the minimum preload is a tenth of the target, which no method gives",
  },
  coneAngleDeg: {
    min: 5,
    max: 60,
    unit: "°",
    why: "pressure-cone half-angles in the literature lie between about 25° and 45° [pub2]; 5°–60° brackets them",
  },
  samplesPerPitch: {
    min: 8,
    max: 1024,
    integer: true,
    unit: "",
    why: "8 samples per pitch resolve the mid-span minimum only roughly, 32 well; more than 1024 add nothing [practice]",
  },
  gridCells: {
    min: 2,
    max: 2048,
    integer: true,
    unit: "",
    why: "cells per side of the heat map; 2048 is more than any screen shows [practice]",
  },
} as const satisfies Record<string, InputBound>;

export type BoundName = keyof typeof INPUT_BOUNDS;

/**
 * Limits on the work of one analysis (checked by the validator, so the API answers 422 naming
 * the limit): samples along the gasket path (bolts × samples per pitch) and heat-map cells. The
 * defaults (96 bolts × 64 samples, 256 × 256 cells) are a tenth and a sixteenth of them.
 */
export const WORK_LIMITS = {
  pathSamples: {
    max: 65_536,
    why: "bolts × samples per pitch; 65,536 samples take about 0.1 s and keep the result under 5 MB (e.g. 512 bolts at 128, or 64 bolts at 1024)",
  },
  gridCells: {
    max: 1_048_576,
    why: "heat-map cells nx × ny; 1,048,576 (1024 × 1024) take about 0.2 s",
  },
} as const;

const formatNumber = (v: number) =>
  Math.abs(v) >= 1e5 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential().replace("e+", "e") : String(v);
const withUnit = (v: number, unit: string) => `${formatNumber(v)}${unit ? ` ${unit}` : ""}`;

/** "from 0.5 mm to 2000 mm" / "greater than 0 and at most 1.2". */
export function describeBound(b: InputBound): string {
  return b.minExclusive
    ? `greater than ${withUnit(b.min, b.unit)} and at most ${withUnit(b.max, b.unit)}`
    : `from ${withUnit(b.min, b.unit)} to ${withUnit(b.max, b.unit)}`;
}

/** The message for a value outside the bound (the range and why). */
export function boundMessage(b: InputBound): string {
  return `must be ${b.integer ? "a whole number " : ""}${describeBound(b)} (${b.why})`;
}

/** True when v lies in the bound. */
export function withinBound(b: InputBound, v: number): boolean {
  if (!Number.isFinite(v)) return false;
  if (b.integer && !Number.isInteger(v)) return false;
  return (b.minExclusive ? v > b.min : v >= b.min) && v <= b.max;
}
