/**
 * Pressure–temperature ratings of standard flanges: maximum working pressure (bar gauge) against
 * temperature (°C) by standard, class and material group.
 * - ASME B16.5 Tables 2-1.1 (Group 1.1: A105, A350 LF2, A216 WCB) and 2-2.2 (Group 2.2: A182 F316,
 *   A240 316, A351 CF8M), Classes 150, 300, 600 [mem: remembered, verify against the edition in hand].
 * - EN 1092-1 PN 10, 16, 25, 40: only the reference-temperature row is listed (PN is the allowable
 *   pressure in bar at the reference temperature, by the definition of PN in EN 1333); the reduced
 *   pressures at higher temperatures depend on the material group table of EN 1092-1 Annex G and are
 *   not in the catalogue — above the reference temperature the lookup says "not listed".
 * Between listed temperatures the ratings are interpolated linearly, as B16.5 permits.
 */
import type { Provenance } from "./confidence";

export interface RatingTable extends Provenance {
  id: string;
  standard: "ASME B16.5" | "EN 1092-1";
  /** "Class 150" or "PN 16". */
  rating: string;
  materialGroup: string;
  /** [°C, bar], ascending. */
  rows: readonly (readonly [number, number])[];
}

const T_B165 = [38, 50, 100, 150, 200, 250, 300, 325, 350, 375, 400, 425, 450] as const;
const b165 = (values: number[]) => T_B165.map((t, i) => [t, values[i]] as const);

const B165 = {
  source: "ASME B16.5 Tables 2-1.1 and 2-2.2 (ratings for Group 1.1 and Group 2.2 materials)",
  edition: "ASME B16.5 (edition not verified; values remembered)",
  confidence: "mem" as const,
};
const EN = {
  source: "EN 1092-1 (PN at the reference temperature; PN as defined in EN 1333)",
  edition: "EN 1092-1 (reference-temperature row only)",
  confidence: "calc" as const,
};

export const RATING_TABLES: readonly RatingTable[] = [
  {
    id: "b16.5-cl150-g1.1",
    standard: "ASME B16.5",
    rating: "Class 150",
    materialGroup: "1.1",
    rows: b165([19.6, 19.2, 17.7, 15.8, 13.8, 12.1, 10.2, 9.3, 8.4, 7.4, 6.5, 5.5, 4.6]),
    ...B165,
  },
  {
    id: "b16.5-cl300-g1.1",
    standard: "ASME B16.5",
    rating: "Class 300",
    materialGroup: "1.1",
    rows: b165([51.1, 50.1, 46.6, 45.1, 43.8, 41.9, 39.8, 38.7, 37.6, 36.4, 34.7, 28.8, 23.0]),
    ...B165,
  },
  {
    id: "b16.5-cl600-g1.1",
    standard: "ASME B16.5",
    rating: "Class 600",
    materialGroup: "1.1",
    rows: b165([102.1, 100.2, 93.2, 90.2, 87.6, 83.9, 79.6, 77.4, 75.1, 72.7, 69.4, 57.5, 46.0]),
    ...B165,
  },
  {
    id: "b16.5-cl150-g2.2",
    standard: "ASME B16.5",
    rating: "Class 150",
    materialGroup: "2.2",
    rows: b165([19.0, 18.4, 16.2, 14.8, 13.7, 12.1, 10.2, 9.3, 8.4, 7.4, 6.5, 5.5, 4.6]),
    ...B165,
  },
  {
    id: "b16.5-cl300-g2.2",
    standard: "ASME B16.5",
    rating: "Class 300",
    materialGroup: "2.2",
    rows: b165([49.6, 48.1, 42.2, 38.5, 35.7, 33.4, 31.6, 30.9, 30.3, 29.9, 29.4, 29.1, 28.8]),
    ...B165,
  },
  {
    id: "b16.5-cl600-g2.2",
    standard: "ASME B16.5",
    rating: "Class 600",
    materialGroup: "2.2",
    rows: b165([99.3, 96.2, 84.4, 77.0, 71.3, 66.8, 63.2, 61.8, 60.7, 59.8, 58.9, 58.3, 57.7]),
    ...B165,
  },
  ...[10, 16, 25, 40].map((pn): RatingTable => ({
    id: `en1092-1-pn${pn}-ref`,
    standard: "EN 1092-1",
    rating: `PN ${pn}`,
    materialGroup: "reference material (PN definition)",
    rows: [[20, pn]],
    ...EN,
  })),
];

export function getRatingTable(
  standard: RatingTable["standard"],
  rating: string,
  group: string,
): RatingTable | undefined {
  return RATING_TABLES.find(
    (t) => t.standard === standard && t.rating === rating && t.materialGroup === group,
  );
}

/**
 * Rated pressure (bar) at a temperature: the first row's value at or below the first temperature
 * (B16.5 lists −29 to 38 °C as one row), linear between rows, null above the last row.
 */
export function ratedPressureBar(table: RatingTable, tempC: number): number | null {
  const r = table.rows;
  if (tempC <= r[0][0]) return r[0][1];
  for (let k = 1; k < r.length; k++) {
    if (tempC <= r[k][0]) {
      const [t0, p0] = r[k - 1];
      const [t1, p1] = r[k];
      return p0 + ((p1 - p0) * (tempC - t0)) / (t1 - t0);
    }
  }
  return null;
}

/** B16.5 material group of a flange material of catalogue/flange-materials.ts [mem: B16.5 Table 1A]. */
export const B165_GROUP_OF_MATERIAL: Readonly<Record<string, string>> = {
  "sa-105": "1.1",
  "sa-516-70": "1.1",
  "sa-182-f316": "2.2",
  "sa-240-316": "2.2",
  "sa-182-f304": "2.1",
  "sa-240-304": "2.1",
};
