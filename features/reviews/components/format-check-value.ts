import type { UnitSystem } from "@/features/analysis/core/design";
import {
  formatArea,
  formatForce,
  formatLength,
  formatStress,
  formatTorque,
  roundSignificant,
} from "@/features/analysis/core/units";

// Check values are stored in the core's units (mm, N, MPa, mm², N·mm); shown in the viewer's.
export function formatCheckValue(value: number | string | null, unit: string, units: UnitSystem): string {
  if (value === null) return "—";
  if (typeof value === "string") return value;
  switch (unit) {
    case "mm":
      return formatLength(value, units);
    case "N":
      return formatForce(value, units);
    case "MPa":
      return formatStress(value, units);
    case "mm²":
    case "mm2":
      return formatArea(value, units);
    case "N·mm":
    case "Nmm":
      return formatTorque(value, units);
    default:
      return `${roundSignificant(value, 4)}${unit ? ` ${unit}` : ""}`;
  }
}
