/**
 * The catalogue's lookup rules over any list of rows, without the tables themselves: the thread
 * catalogue and the Layout desk's choice lists (features/editor/model/editor-choices.ts, sent
 * from the server) use the same rule, so a client component finds a size or a strength range
 * without loading the catalogue.
 */
import type { BoltStrengthRange, ThreadSeries } from "../design";

export interface ThreadKey {
  designation: string;
  series: ThreadSeries;
  /** Threads per inch (unified only). */
  threadsPerInch: number | null;
}

/**
 * Lookup by size and series. 1 in is both 1-8UNC and 1-8UN, so the two unified series accept
 * each other's rows when the thread pitch is 8 TPI.
 */
export function findThreadIn<T extends ThreadKey>(
  rows: readonly T[],
  designation: string,
  series: ThreadSeries,
): T | undefined {
  const exact = rows.find((t) => t.designation === designation && t.series === series);
  if (exact) return exact;
  if (series === "metric-coarse") return undefined;
  return rows.find(
    (t) => t.designation === designation && t.series !== "metric-coarse" && t.threadsPerInch === 8,
  );
}

/** The range a nominal diameter falls in (the last range if the size is larger than all of them). */
export function rangeForDiameter<R extends { maxDiameterMm: number }>(
  ranges: readonly R[],
  nominalDiameterMm: number,
): R {
  return ranges.find((r) => nominalDiameterMm <= r.maxDiameterMm + 1e-9) ?? ranges[ranges.length - 1];
}

/** The five stored values of each strength range, in ascending order of size (a copy). */
export function sortedStrengthRanges(ranges: readonly BoltStrengthRange[]): BoltStrengthRange[] {
  return [...ranges]
    .sort((a, b) => a.maxDiameterMm - b.maxDiameterMm)
    .map((r) => ({
      maxDiameterMm: r.maxDiameterMm,
      proofMpa: r.proofMpa,
      yieldMpa: r.yieldMpa,
      tensileMpa: r.tensileMpa,
      allowableMpa: r.allowableMpa,
    }));
}
