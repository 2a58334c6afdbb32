/**
 * Display units per kind of quantity. The design stores mm, N, MPa, N·mm and °C (see
 * core/design.ts); the form and the results convert at the edge with the core's units.ts.
 */
import type { UnitSystem } from "@/features/analysis/core/design";
import {
  inToMm,
  lbfToN,
  mmToIn,
  mpaToPsi,
  nmmToFtLb,
  nmmToNm,
  nToLbf,
  nmToNmm,
  ftLbToNmm,
  psiToMpa,
} from "@/features/analysis/core/units";

export type Quantity =
  "length" | "stress" | "force" | "moment" | "torque" | "temperature" | "ratio" | "angle" | "count";

interface Conversion {
  unit: string;
  toDisplay: (internal: number) => number;
  fromDisplay: (display: number) => number;
}

const same = (v: number) => v;
const conversion = (unit: string, toDisplay = same, fromDisplay = same): Conversion => ({
  unit,
  toDisplay,
  fromDisplay,
});
const both = (SI: Conversion, US: Conversion): Record<UnitSystem, Conversion> => ({ SI, US });
// Ratios, angles and counts read the same in both systems.
const sameInBoth = (unit: string) => both(conversion(unit), conversion(unit));
// Moments and torques are stored in N·mm and shown in N·m or ft·lb.
const moment = both(conversion("N·m", nmmToNm, nmToNmm), conversion("ft·lb", nmmToFtLb, ftLbToNmm));

// Temperatures are not in the core's units.ts; °F = °C·9/5 + 32 is an exact definition.
const TABLE: Record<Quantity, Record<UnitSystem, Conversion>> = {
  length: both(conversion("mm"), conversion("in", mmToIn, inToMm)),
  stress: both(conversion("MPa"), conversion("psi", mpaToPsi, psiToMpa)),
  force: both(conversion("N"), conversion("lbf", nToLbf, lbfToN)),
  moment,
  torque: moment,
  temperature: both(
    conversion("°C"),
    conversion(
      "°F",
      (c) => (c * 9) / 5 + 32,
      (f) => ((f - 32) * 5) / 9,
    ),
  ),
  ratio: sameInBoth(""),
  angle: sameInBoth("°"),
  count: sameInBoth(""),
};

export function unitLabel(q: Quantity, units: UnitSystem): string {
  return TABLE[q][units].unit;
}

export function toDisplay(q: Quantity, internal: number, units: UnitSystem): number {
  return TABLE[q][units].toDisplay(internal);
}

export function fromDisplay(q: Quantity, display: number, units: UnitSystem): number {
  return TABLE[q][units].fromDisplay(display);
}

/** Maps the unit strings the core writes into check records ("mm", "MPa", "N") to a quantity. */
export function quantityOfUnit(unit: string): Quantity | null {
  switch (unit) {
    case "mm":
      return "length";
    case "MPa":
      return "stress";
    case "N":
      return "force";
    case "N·mm":
    case "N*mm":
    case "Nmm":
      return "moment";
    case "°C":
      return "temperature";
    default:
      return null;
  }
}

/** A number for an input box: 5 significant digits, no exponent for ordinary sizes. */
export function formatInputNumber(v: number): string {
  if (!Number.isFinite(v)) return "";
  if (v === 0) return "0";
  const digits = Math.max(0, 5 - 1 - Math.floor(Math.log10(Math.abs(v))));
  return String(Number(v.toFixed(Math.min(digits, 10))));
}

/** A converted number with its unit for read-only display. */
export function formatQuantity(q: Quantity, internal: number, units: UnitSystem, digits = 4): string {
  const v = toDisplay(q, internal, units);
  const unit = unitLabel(q, units);
  const text = Number.isFinite(v) ? String(Number(v.toPrecision(digits))) : "—";
  return unit ? `${text} ${unit}` : text;
}
