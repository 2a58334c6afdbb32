import type { UnitSystem } from "@/features/analysis/core/design";
import { MM_PER_IN } from "@/features/analysis/core/units";

/**
 * The length unit of the shop files (CSV, DXF): the design's own unit system, mm or in.
 * Decimals are chosen so that rounding stays far inside 0.001 mm (in: 1e-5 in = 0.000254 mm).
 */
export interface LengthUnit {
  suffix: "mm" | "in";
  decimals: number;
  fromMm: (mm: number) => number;
}

export function lengthUnitFor(units: UnitSystem): LengthUnit {
  return units === "US"
    ? { suffix: "in", decimals: 5, fromMm: (mm) => mm / MM_PER_IN }
    : { suffix: "mm", decimals: 4, fromMm: (mm) => mm };
}

/** Fixed decimals without a negative zero. Example: `fixed(-0.00001, 4)` → "0.0000". */
export function fixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}
