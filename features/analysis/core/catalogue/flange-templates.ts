/**
 * Flange templates: ASME B16.5 outside diameter, bolt circle and bolting. Class 150 [pub2, as
 * reproduced]; Classes 300 and 600 [mem: remembered, verify against the standard in hand]. Hole
 * diameters (bolt + 1/8 in) are [mem]. EN 1092-1 PN dimension tables are to be entered from the
 * standard in hand, with its edition. Every row names the B16.5 material group its rating is read
 * for (Group 1.1, the templates' A105 forgings).
 */
import { inToMm } from "../units";
import type { Confidence, Provenance } from "./confidence";

export interface FlangeTemplateRow extends Provenance {
  id: string;
  standard: "ASME B16.5";
  pressureClass: 150 | 300 | 600;
  nps: string;
  outsideDiameterMm: number;
  boltCircleDiameterMm: number;
  boltCount: number;
  /** Unified thread designation of the bolts, e.g. "3/4". */
  boltDesignation: string;
  boltDiameterMm: number;
  holeDiameterMm: number;
  holeDiameterConfidence: Confidence;
  /** ASME B16.5 material group whose pressure–temperature rating applies (catalogue/pt-ratings.ts). */
  materialGroup: string;
}

const RAW: [nps: string, odIn: number, bcIn: number, n: number, bolt: string, dIn: number][] = [
  ["2", 6.0, 4.75, 4, "5/8", 0.625],
  ["4", 9.0, 7.5, 8, "5/8", 0.625],
  ["6", 11.0, 9.5, 8, "3/4", 0.75],
  ["8", 13.5, 11.75, 8, "3/4", 0.75],
  ["10", 16.0, 14.25, 12, "7/8", 0.875],
  ["12", 19.0, 17.0, 12, "7/8", 0.875],
  ["16", 23.5, 21.25, 16, "1", 1],
  ["24", 32.0, 29.5, 20, "1-1/4", 1.25],
];

// Class 300 and 600 [mem]: NPS, OD, bolt circle (in), number and size of bolts.
const RAW_300: typeof RAW = [
  ["2", 6.5, 5.0, 8, "5/8", 0.625],
  ["4", 10.0, 7.88, 8, "3/4", 0.75],
  ["6", 12.5, 10.62, 12, "3/4", 0.75],
  ["8", 15.0, 13.0, 12, "7/8", 0.875],
  ["10", 17.5, 15.25, 16, "1", 1],
  ["12", 20.5, 17.75, 16, "1-1/8", 1.125],
  ["16", 25.5, 22.5, 20, "1-1/4", 1.25],
  ["24", 36.0, 32.0, 24, "1-1/2", 1.5],
];
const RAW_600: typeof RAW = [
  ["2", 6.5, 5.0, 8, "5/8", 0.625],
  ["4", 10.75, 8.5, 8, "7/8", 0.875],
  ["6", 14.0, 11.5, 12, "1", 1],
  ["8", 16.5, 13.75, 12, "1-1/8", 1.125],
  ["10", 20.0, 17.0, 16, "1-1/4", 1.25],
  ["12", 22.0, 19.25, 20, "1-1/4", 1.25],
  ["16", 27.0, 23.75, 20, "1-1/2", 1.5],
  ["24", 37.0, 33.0, 24, "1-7/8", 1.875],
];

function rows(
  cls: FlangeTemplateRow["pressureClass"],
  raw: typeof RAW,
  confidence: FlangeTemplateRow["confidence"],
): FlangeTemplateRow[] {
  return raw.map(([nps, od, bc, n, bolt, d]) => ({
    id: `asme-b16.5-cl${cls}-nps${nps}`,
    standard: "ASME B16.5",
    pressureClass: cls,
    nps,
    outsideDiameterMm: inToMm(od),
    boltCircleDiameterMm: inToMm(bc),
    boltCount: n,
    boltDesignation: bolt,
    boltDiameterMm: inToMm(d),
    holeDiameterMm: inToMm(d + 0.125),
    holeDiameterConfidence: "mem",
    materialGroup: "1.1",
    source: `ASME B16.5 Class ${cls} flange dimensions (OD, bolt circle, number and size of bolts)`,
    edition: `ASME B16.5 (${confidence === "mem" ? "remembered; verify" : "as reproduced"}; edition not verified)`,
    confidence,
  }));
}

export const FLANGE_TEMPLATES: readonly FlangeTemplateRow[] = [
  ...rows(150, RAW, "pub2"),
  ...rows(300, RAW_300, "mem"),
  ...rows(600, RAW_600, "mem"),
];

export function getFlangeTemplateById(id: string): FlangeTemplateRow | undefined {
  return FLANGE_TEMPLATES.find((t) => t.id === id);
}
