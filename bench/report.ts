/**
 * What a bench section measured, for the README's performance table (bench/readme-table.ts).
 * bench/run.ts names the section before it runs each module; the module calls `figure()` beside
 * the line it prints. Labels are the table's `figure` cells: keep them stable, or the old row
 * stays with its old value and a new row appears.
 */
import type { BenchFigure } from "./readme-table";

const collected: BenchFigure[] = [];
let section = "";

export function beginSection(name: string): void {
  section = name;
}

export function figure(label: string, measured: string, extra: { goal?: string; ratio?: string } = {}): void {
  collected.push({ section, label, measured, ...extra });
}

export function collectedFigures(): BenchFigure[] {
  return [...collected];
}

/** A duration as the table shows it: three significant figures, seconds from 1 s on. */
export function formatMs(ms: number): string {
  if (!Number.isFinite(ms)) return "—";
  if (ms >= 1000) return `${(ms / 1000).toFixed(ms >= 10_000 ? 1 : 2)} s`;
  if (ms >= 100) return `${ms.toFixed(0)} ms`;
  if (ms >= 10) return `${ms.toFixed(1)} ms`;
  return `${ms.toFixed(2)} ms`;
}
