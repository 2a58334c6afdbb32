/**
 * The estimate-against-FE table as text (command line; the screens and the sheet lay out the same
 * rows themselves). Pure.
 */
import type { UnitSystem } from "@/features/analysis/core/design";
import { formatLength, formatStress, MM_PER_IN, nToLbf } from "@/features/analysis/core/units";
import type { FeCheckResult, FeComparisonRow } from "./fe-check-result";

const num = (v: number | null) => (v === null ? "—" : Number(v.toPrecision(4)).toString());

export function formatDifference(row: Pick<FeComparisonRow, "difference">): string {
  if (row.difference === null) return "—";
  const pct = row.difference * 100;
  return `${pct >= 0 ? "+" : "−"}${Math.abs(pct).toFixed(1)} %`;
}

export function formatComparisonTable(result: FeCheckResult): string {
  const rows = result.comparison.map((r) => [
    `${r.quantity} (${r.unit})`,
    num(r.estimate),
    num(r.fe),
    formatDifference(r),
  ]);
  const head = ["Quantity", "Estimate", "FE", "FE vs estimate"];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i])).join("  ");
  const notes = [result.stackError, result.gasketPathError].filter((e): e is string => !!e);
  return [line(head), ...rows.map(line), ...notes.map((n) => `note: ${n}`)].join("\n");
}

/** One value of the comparison in the viewer's units ("—" when missing). */
export function formatComparisonValue(unit: string, value: number | null, units: UnitSystem): string {
  if (value === null) return "—";
  switch (unit) {
    case "MPa":
      return formatStress(value, units);
    case "mm":
      return formatLength(value, units);
    case "N/mm":
      return units === "US"
        ? `${Number((nToLbf(value) * MM_PER_IN).toPrecision(4))} lbf/in`
        : `${Number((value / 1000).toPrecision(4))} kN/mm`;
    default:
      return `${Number(value.toPrecision(4))} ${unit}`;
  }
}
