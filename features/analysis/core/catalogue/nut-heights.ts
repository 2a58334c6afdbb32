/**
 * Hex nut heights, for the length of stud or bolt to order (never for a pass/fail check), and the
 * nut grade usually paired with each bolting material. All remembered, to be checked against the
 * standard in hand:
 * - ISO 4032 hexagon nuts, style 1: maximum height m [mem].
 * - The older ISO/DIN series (DIN 934): m = 0.8·d, rounded to the millimetre [mem].
 * - ASME B18.2.2 heavy hex nuts: thickness H = D − 1/64 in up to 1-1/8 in, D − 1/32 in from 1-1/4
 *   to 2 in, D − 3/64 in above [mem] (e.g. 3/4 in → 47/64 in, 1-1/4 in → 1-7/32 in).
 */
import { inToMm } from "../units";
import type { Provenance } from "./confidence";
import type { NutSeries } from "./nuts";

export interface NutHeightRow extends Provenance {
  designation: string;
  series: NutSeries;
  heightMm: number;
}

const ISO_4032_M: Record<string, number> = {
  M10: 8.4,
  M12: 10.8,
  M14: 12.8,
  M16: 14.8,
  M20: 18.0,
  M22: 19.4,
  M24: 21.5,
  M27: 23.8,
  M30: 25.6,
  M33: 28.7,
  M36: 31.0,
  M39: 33.4,
  M42: 34.0,
  M45: 36.0,
  M48: 38.0,
  M52: 42.0,
  M56: 45.0,
  M60: 48.0,
  M64: 51.0,
};

/** ASME B18.2.2 heavy hex nut thickness, in. Example: 3/4 → 47/64 = 0.734375; 1-1/4 → 1.21875. */
export function heavyHexNutThicknessIn(nominalDiameterIn: number): number {
  const d = nominalDiameterIn;
  return d <= 1.125 + 1e-9 ? d - 1 / 64 : d <= 2 + 1e-9 ? d - 1 / 32 : d - 3 / 64;
}

/**
 * The height of the nut that fits a bolt size, given its nominal diameter (from the thread
 * catalogue). Examples: ("M20", 20, "iso-4032") → 18.0 mm; ("M20", 20, "iso-old") → 16 mm;
 * ("3/4", 19.05) → 47/64 in = 18.653 mm. Undefined for a metric size the table does not hold.
 */
export function findNutHeight(
  designation: string,
  nominalDiameterMm: number,
  metricSeries: "iso-4032" | "iso-old" = "iso-4032",
): NutHeightRow | undefined {
  if (designation.startsWith("M")) {
    const m = ISO_4032_M[designation];
    if (m === undefined) return undefined;
    if (metricSeries === "iso-old")
      return {
        designation,
        series: "iso-old",
        heightMm: Math.round(0.8 * nominalDiameterMm),
        source: "older ISO/DIN hexagon nut height m = 0.8·d (DIN 934)",
        edition: "DIN 934 (from memory; verify)",
        confidence: "mem",
      };
    return {
      designation,
      series: "iso-4032",
      heightMm: m,
      source: "ISO 4032 hexagon nut, style 1 (height m, maximum)",
      edition: "ISO 4032 (from memory; verify)",
      confidence: "mem",
    };
  }
  return {
    designation,
    series: "asme-b18.2.2-heavy-hex",
    heightMm: inToMm(heavyHexNutThicknessIn(nominalDiameterMm / 25.4)),
    source: "ASME B18.2.2 heavy hex nut thickness H",
    edition: "ASME B18.2.2 (from memory; verify)",
    confidence: "mem",
  };
}

/** The nut grade usually paired with a bolting material of bolt-materials.ts [mem]. */
export const MATING_NUT_GRADES: Readonly<Record<string, string>> = {
  "iso-898-1-8.8": "ISO 898-2 property class 8",
  "iso-898-1-10.9": "ISO 898-2 property class 10",
  "iso-898-1-12.9": "ISO 898-2 property class 12",
  "astm-a193-b7": "ASTM A194 grade 2H",
  "astm-a193-b7m": "ASTM A194 grade 2HM",
  "astm-a193-b16": "ASTM A194 grade 4 or 7",
  "astm-a193-b8-cl1": "ASTM A194 grade 8",
  "astm-a193-b8-cl2": "ASTM A194 grade 8 (strain hardened, 8B)",
  "astm-a320-l7": "ASTM A194 grade 4 or 7, impact tested (S3)",
};
