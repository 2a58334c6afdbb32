/**
 * The estimate-against-FE table as text (command line; the screens and the sheet lay out the same
 * rows themselves). Pure.
 */
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
