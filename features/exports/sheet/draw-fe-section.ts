import "server-only";
import { formatComparisonValue, formatDifference } from "@/features/fe-check/comparison-text";
import { drawTable, type Cell } from "./draw-table";
import { heading, type SheetContext } from "./sheet-context";
import type { SheetFeCheck } from "./sheet-input";

/**
 * The "FE cross-check" section of the bolt-spacing sheet, printed only when the revision has one:
 * for an approved revision the run its approval cites, otherwise the latest finished run of the
 * saved document. The estimate against FE, the run's assumptions and its cautions.
 */
export function drawFeSection(ctx: SheetContext, fe: SheetFeCheck | null | undefined): void {
  if (!fe) return;
  const units = ctx.input.units;
  heading(
    ctx,
    "FE cross-check",
    `${fe.cited ? "cited by the approval" : "latest run of the saved document"}, finished ${fe.finishedAt.slice(0, 16).replace("T", " ")} UTC, result sha-256 ${fe.resultHash.slice(0, 16)}…`,
  );
  drawTable(
    ctx,
    [
      { header: "Quantity", width: 3, wrap: true },
      { header: "Estimate", width: 1.4, align: "right", mono: true },
      { header: "FE", width: 1.4, align: "right", mono: true },
      { header: "FE vs estimate", width: 1.1, align: "right", mono: true },
    ],
    fe.result.comparison.map((r): Cell[] => [
      `${r.quantity} (${r.note})`,
      formatComparisonValue(r.unit, r.estimate, units),
      r.fe === null ? "not solved" : formatComparisonValue(r.unit, r.fe, units),
      formatDifference(r),
    ]),
  );
  const notes = [
    ...(fe.result.stackError ? [`Bolt stack: ${fe.result.stackError}`] : []),
    ...(fe.result.gasketPathError ? [`Gasket path: ${fe.result.gasketPathError}`] : []),
    ...(fe.result.gasketPath?.warnings ?? []).map((w) => `Gasket path: ${w}`),
    ...fe.result.cautions,
  ];
  drawTable(
    ctx,
    [{ header: "Assumptions and cautions of the FE run", width: 1, wrap: true }],
    notes.map((n): Cell[] => [n]),
  );
}
