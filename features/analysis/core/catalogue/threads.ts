/**
 * Thread catalogue: ISO metric coarse M10–M64 and unified inch 1/2–2-1/2 in (UNC up to 1 in,
 * 8UN above, the usual flange-bolting series). Areas are computed from the standard formulas,
 * never typed in; tests compare them with the tabulated values of ISO 898-1 and ASME PCC-1 H-1.
 */
import { in2ToMm2, inToMm } from "../units";
import type { ThreadSeries } from "../design";
import type { Provenance } from "./confidence";
import { findThreadIn } from "./lookups";

export interface ThreadRow extends Provenance {
  id: string;
  designation: string;
  series: ThreadSeries;
  nominalDiameterMm: number;
  pitchMm: number;
  /** Threads per inch (unified only). */
  threadsPerInch: number | null;
  /** Tensile stress area As (metric) / At (unified), mm²: used for bolt stress, preload, torque. */
  tensileStressAreaMm2: number;
  /** Root (minor-diameter) area, mm²: used for Ab in ASME VIII-1 Appendix 2. */
  rootAreaMm2: number;
}

/** ISO 898-1 / ISO 261: As = π/4·(d − 0.9382·P)², d and P in mm. Example: M20×2.5 → 244.8 mm². */
export function metricTensileStressAreaMm2(dMm: number, pitchMm: number): number {
  return (Math.PI / 4) * (dMm - 0.9382 * pitchMm) ** 2;
}

/**
 * Metric root area from the external-thread minor diameter d3 = d − 1.226869·P (ISO 724 basic
 * profile with the rounded root; [mem] constant). Example: M20×2.5 → d3 = 16.93, 225.2 mm².
 */
export function metricRootAreaMm2(dMm: number, pitchMm: number): number {
  return (Math.PI / 4) * (dMm - 1.226869 * pitchMm) ** 2;
}

/** ASME B1.1: At = 0.7854·(D − 0.9743/n)², in². Example: 3/4-10 → 0.3345 in². */
export function unifiedTensileStressAreaIn2(dIn: number, threadsPerInch: number): number {
  return 0.7854 * (dIn - 0.9743 / threadsPerInch) ** 2;
}

/** Root area Ar = π/4·(D − 1.299038/n)², in². Example: 3/4-10 → 0.3020 in². */
export function unifiedRootAreaIn2(dIn: number, threadsPerInch: number): number {
  return (Math.PI / 4) * (dIn - 1.299038 / threadsPerInch) ** 2;
}

const METRIC: [string, number, number][] = [
  ["M10", 10, 1.5],
  ["M12", 12, 1.75],
  ["M14", 14, 2],
  ["M16", 16, 2],
  ["M20", 20, 2.5],
  ["M22", 22, 2.5],
  ["M24", 24, 3],
  ["M27", 27, 3],
  ["M30", 30, 3.5],
  ["M33", 33, 3.5],
  ["M36", 36, 4],
  ["M39", 39, 4],
  ["M42", 42, 4.5],
  ["M45", 45, 4.5],
  ["M48", 48, 5],
  ["M52", 52, 5],
  ["M56", 56, 5.5],
  ["M60", 60, 5.5],
  ["M64", 64, 6],
];

const UNIFIED: [string, number, number][] = [
  ["1/2", 0.5, 13],
  ["5/8", 0.625, 11],
  ["3/4", 0.75, 10],
  ["7/8", 0.875, 9],
  ["1", 1, 8],
  ["1-1/8", 1.125, 8],
  ["1-1/4", 1.25, 8],
  ["1-3/8", 1.375, 8],
  ["1-1/2", 1.5, 8],
  ["1-5/8", 1.625, 8],
  ["1-3/4", 1.75, 8],
  ["1-7/8", 1.875, 8],
  ["2", 2, 8],
  ["2-1/4", 2.25, 8],
  ["2-1/2", 2.5, 8],
];

export const THREADS: readonly ThreadRow[] = [
  ...METRIC.map(([des, d, p]): ThreadRow => ({
    id: `${des}x${p}`,
    designation: des,
    series: "metric-coarse",
    nominalDiameterMm: d,
    pitchMm: p,
    threadsPerInch: null,
    tensileStressAreaMm2: metricTensileStressAreaMm2(d, p),
    rootAreaMm2: metricRootAreaMm2(d, p),
    source: "ISO 261/262 pitches; As formula of ISO 898-1; root area from d3 = d − 1.226869·P",
    edition: "ISO 898-1:2013 (formula as reproduced)",
    confidence: "pub2",
  })),
  ...UNIFIED.map(([des, d, n]): ThreadRow => ({
    id: `${des}-${n}${d <= 1 ? "UNC" : "UN"}`,
    designation: des,
    series: d <= 1 ? "unc" : "unified-8un",
    nominalDiameterMm: inToMm(d),
    pitchMm: 25.4 / n,
    threadsPerInch: n,
    tensileStressAreaMm2: in2ToMm2(unifiedTensileStressAreaIn2(d, n)),
    rootAreaMm2: in2ToMm2(unifiedRootAreaIn2(d, n)),
    source: "ASME B1.1 area formulas; values checked against ASME PCC-1 Table H-1",
    edition: "ASME B1.1 / ASME PCC-1-2013 Table H-1",
    confidence: "pub",
  })),
];

/** Lookup by id, e.g. `getThreadById("M20x2.5")`, `getThreadById("3/4-10UNC")`. */
export function getThreadById(id: string): ThreadRow | undefined {
  return THREADS.find((t) => t.id === id);
}

/**
 * Lookup by size and series. 1 in is both 1-8UNC and 1-8UN, so the two unified series accept
 * each other's rows when the thread pitch is 8 TPI.
 * Example: `findThread("1-1/8", "unified-8un")?.id` → "1-1/8-8UN".
 */
export function findThread(designation: string, series: ThreadSeries): ThreadRow | undefined {
  return findThreadIn(THREADS, designation, series);
}
