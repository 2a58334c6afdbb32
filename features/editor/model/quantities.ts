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

// Temperatures are not in the core's units.ts; °F = °C·9/5 + 32 is an exact definition.
const TABLE: Record<Quantity, Record<UnitSystem, Conversion>> = {
  length: {
    SI: { unit: "mm", toDisplay: same, fromDisplay: same },
    US: { unit: "in", toDisplay: mmToIn, fromDisplay: inToMm },
  },
  stress: {
    SI: { unit: "MPa", toDisplay: same, fromDisplay: same },
    US: { unit: "psi", toDisplay: mpaToPsi, fromDisplay: psiToMpa },
  },
  force: {
    SI: { unit: "N", toDisplay: same, fromDisplay: same },
    US: { unit: "lbf", toDisplay: nToLbf, fromDisplay: lbfToN },
  },
  // Moments and torques are stored in N·mm and shown in N·m or ft·lb.
  moment: {
    SI: { unit: "N·m", toDisplay: nmmToNm, fromDisplay: nmToNmm },
    US: { unit: "ft·lb", toDisplay: nmmToFtLb, fromDisplay: ftLbToNmm },
  },
  torque: {
    SI: { unit: "N·m", toDisplay: nmmToNm, fromDisplay: nmToNmm },
    US: { unit: "ft·lb", toDisplay: nmmToFtLb, fromDisplay: ftLbToNmm },
  },
  temperature: {
    SI: { unit: "°C", toDisplay: same, fromDisplay: same },
    US: { unit: "°F", toDisplay: (c) => (c * 9) / 5 + 32, fromDisplay: (f) => ((f - 32) * 5) / 9 },
  },
  ratio: {
    SI: { unit: "", toDisplay: same, fromDisplay: same },
    US: { unit: "", toDisplay: same, fromDisplay: same },
  },
  angle: {
    SI: { unit: "°", toDisplay: same, fromDisplay: same },
    US: { unit: "°", toDisplay: same, fromDisplay: same },
  },
  count: {
    SI: { unit: "", toDisplay: same, fromDisplay: same },
    US: { unit: "", toDisplay: same, fromDisplay: same },
  },
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
