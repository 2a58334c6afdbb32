/**
 * Flange templates: ASME B16.5 Class 150 outside diameter, bolt circle and bolting [pub2, as
 * reproduced]. Hole diameters (bolt + 1/8 in) are [mem]. Other classes and EN 1092-1 PN tables are
 * to be entered from the standard in hand, with its edition.
 */
import { inToMm } from "../units";
import type { Confidence, Provenance } from "./confidence";

export interface FlangeTemplateRow extends Provenance {
  id: string;
  standard: "ASME B16.5";
  pressureClass: 150;
  nps: string;
  outsideDiameterMm: number;
  boltCircleDiameterMm: number;
  boltCount: number;
  /** Unified thread designation of the bolts, e.g. "3/4". */
  boltDesignation: string;
  boltDiameterMm: number;
  holeDiameterMm: number;
  holeDiameterConfidence: Confidence;
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

export const FLANGE_TEMPLATES: readonly FlangeTemplateRow[] = RAW.map(([nps, od, bc, n, bolt, d]) => ({
  id: `asme-b16.5-cl150-nps${nps}`,
  standard: "ASME B16.5",
  pressureClass: 150,
  nps,
  outsideDiameterMm: inToMm(od),
  boltCircleDiameterMm: inToMm(bc),
  boltCount: n,
  boltDesignation: bolt,
  boltDiameterMm: inToMm(d),
  holeDiameterMm: inToMm(d + 0.125),
  holeDiameterConfidence: "mem",
  source: "ASME B16.5 Class 150 flange dimensions (OD, bolt circle, number and size of bolts)",
  edition: "ASME B16.5 (as reproduced; edition not verified)",
  confidence: "pub2",
}));

export function getFlangeTemplateById(id: string): FlangeTemplateRow | undefined {
  return FLANGE_TEMPLATES.find((t) => t.id === id);
}
