/**
 * Hex nut sizes. Inch heavy hex from the ASME B18.2.2 rule F = 1.5·D + 1/8 in [pub2]; metric
 * across-flats for ISO 4032 and the older ISO series, which differ at M10, M12, M14 and M22 [mem].
 * Across corners of a regular hexagon = F / cos 30°.
 */
import { inToMm } from "../units";
import type { Provenance } from "./confidence";
import * as fm from "../fixed-math";

export type NutSeries = "asme-b18.2.2-heavy-hex" | "iso-4032" | "iso-old";

export interface NutRow extends Provenance {
  id: string;
  /** Thread designation the nut fits, e.g. "M20" or "3/4". */
  designation: string;
  series: NutSeries;
  acrossFlatsMm: number;
  acrossCornersMm: number;
}

/** Across corners from across flats: AC = AF / cos 30°. Example: AF 30 mm → 34.64 mm. */
export function acrossCornersFromFlatsMm(acrossFlatsMm: number): number {
  return acrossFlatsMm / fm.cos(Math.PI / 6);
}

/** ASME B18.2.2 heavy hex: F = 1.5·D + 1/8 in. Example: D = 3/4 in → 1.25 in. */
export function heavyHexAcrossFlatsIn(nominalDiameterIn: number): number {
  return 1.5 * nominalDiameterIn + 0.125;
}

const ISO_4032_AF: [string, number][] = [
  ["M10", 16],
  ["M12", 18],
  ["M14", 21],
  ["M16", 24],
  ["M20", 30],
  ["M22", 34],
  ["M24", 36],
  ["M27", 41],
  ["M30", 46],
  ["M33", 50],
  ["M36", 55],
  ["M39", 60],
  ["M42", 65],
  ["M45", 70],
  ["M48", 75],
  ["M52", 80],
  ["M56", 85],
  ["M60", 90],
  ["M64", 95],
];
const ISO_OLD_CHANGES: Record<string, number> = { M10: 17, M12: 19, M14: 22, M22: 32 };

const INCH: [string, number][] = [
  ["1/2", 0.5],
  ["5/8", 0.625],
  ["3/4", 0.75],
  ["7/8", 0.875],
  ["1", 1],
  ["1-1/8", 1.125],
  ["1-1/4", 1.25],
  ["1-3/8", 1.375],
  ["1-1/2", 1.5],
  ["1-5/8", 1.625],
  ["1-3/4", 1.75],
  ["1-7/8", 1.875],
  ["2", 2],
  ["2-1/4", 2.25],
  ["2-1/2", 2.5],
];

export const NUTS: readonly NutRow[] = [
  ...INCH.map(([des, d]): NutRow => {
    const af = inToMm(heavyHexAcrossFlatsIn(d));
    return {
      id: `heavy-hex-${des}`,
      designation: des,
      series: "asme-b18.2.2-heavy-hex",
      acrossFlatsMm: af,
      acrossCornersMm: acrossCornersFromFlatsMm(af),
      source: "ASME B18.2.2 heavy hex nut rule F = 1.5D + 1/8 in",
      edition: "ASME B18.2.2 (as reproduced; edition not verified)",
      confidence: "pub2",
    };
  }),
  ...ISO_4032_AF.map(([des, af]): NutRow => ({
    id: `iso-4032-${des}`,
    designation: des,
    series: "iso-4032",
    acrossFlatsMm: af,
    acrossCornersMm: acrossCornersFromFlatsMm(af),
    source: "ISO 4032 hexagon nut, style 1 (across flats s)",
    edition: "ISO 4032 (from memory; verify)",
    confidence: "mem",
  })),
  ...ISO_4032_AF.map(([des, af]): NutRow => {
    const old = ISO_OLD_CHANGES[des] ?? af;
    return {
      id: `iso-old-${des}`,
      designation: des,
      series: "iso-old",
      acrossFlatsMm: old,
      acrossCornersMm: acrossCornersFromFlatsMm(old),
      source: "older ISO/DIN hexagon series (before ISO 4032 changed M10, M12, M14, M22)",
      edition: "pre-ISO 4032 series (from memory; verify)",
      confidence: "mem",
    };
  }),
];

export function getNutById(id: string): NutRow | undefined {
  return NUTS.find((n) => n.id === id);
}

/** Nut for a bolt size: inch sizes use heavy hex; metric uses the given series (default ISO 4032). */
export function findNut(
  designation: string,
  metricSeries: "iso-4032" | "iso-old" = "iso-4032",
): NutRow | undefined {
  const isMetric = designation.startsWith("M");
  const series: NutSeries = isMetric ? metricSeries : "asme-b18.2.2-heavy-hex";
  return NUTS.find((n) => n.designation === designation && n.series === series);
}
