/**
 * Flange, cover and plate materials with allowable stress S against temperature (ASME II-D Table 1A)
 * and modulus E against temperature (ASME II-D Table TM-1). The numbers are remembered, not read from
 * an edition in hand: every row is [mem] — verify against the edition of Section II-D your design
 * is built to and enter the allowable with its source where it differs. Values between the listed
 * temperatures are interpolated linearly (as II-D permits); above the last one there is no allowable.
 * For austenitic stainless steels the lower of the two II-D lines is used: the higher line (note G5)
 * is not recommended for flanges of gasketed joints, where slight distortion can cause leakage.
 */
import { ksiToMpa } from "../units";
import type { Provenance } from "./confidence";

export interface FlangeMaterialRow extends Provenance {
  id: string;
  name: string;
  productForm: "forging" | "plate";
  /** Allowable stress S at temperature: [°C, MPa], ascending. */
  allowable: readonly (readonly [number, number])[];
  /** Modulus of elasticity at temperature: [°C, MPa], ascending. */
  modulus: readonly (readonly [number, number])[];
  /** Mean coefficient of thermal expansion from 20 °C, 1/K [mem]. */
  expansionPerK: number;
  /** Specified minimum yield strength at room temperature, MPa, and its source [mem]. */
  yieldMpa: number;
  yieldSource: string;
}

const fToC = (f: number) => ((f - 32) * 5) / 9;
const ksiRows = (rows: [number, number][]) => rows.map(([f, ksi]) => [fToC(f), ksiToMpa(ksi)] as const);
const msiRows = (rows: [number, number][]) =>
  rows.map(([f, msi]) => [fToC(f), ksiToMpa(msi * 1000)] as const);

// II-D Table TM-1 moduli [mem]: carbon steels C ≤ 0.30 %, and austenitic stainless steels (10⁶ psi).
const E_CARBON = msiRows([
  [70, 29.4],
  [200, 28.8],
  [300, 28.3],
  [400, 27.9],
  [500, 27.3],
  [600, 26.5],
  [700, 25.5],
  [800, 24.2],
]);
const E_AUSTENITIC = msiRows([
  [70, 28.3],
  [200, 27.6],
  [300, 27.0],
  [400, 26.5],
  [500, 25.8],
  [600, 25.3],
  [700, 24.8],
  [800, 24.1],
]);
// II-D Table 1A [mem], ksi at °F. Carbon steel 70 ksi tensile / 36–38 ksi yield (SA-105, SA-516-70).
const S_CARBON_70 = ksiRows([
  [100, 20.0],
  [200, 20.0],
  [300, 20.0],
  [400, 20.0],
  [500, 20.0],
  [600, 19.4],
  [650, 18.8],
  [700, 18.1],
  [750, 14.8],
  [800, 12.0],
]);
const S_316_LOWER = ksiRows([
  [100, 20.0],
  [200, 17.3],
  [300, 15.6],
  [400, 14.3],
  [500, 13.3],
  [600, 12.6],
  [650, 12.3],
  [700, 12.1],
  [750, 11.9],
  [800, 11.8],
]);
const S_304_LOWER = ksiRows([
  [100, 20.0],
  [200, 16.7],
  [300, 15.0],
  [400, 13.8],
  [500, 12.9],
  [600, 12.3],
  [650, 12.0],
  [700, 11.7],
  [750, 11.5],
  [800, 11.2],
]);

const IID = {
  source: "ASME II-D Table 1A (S), Table TM-1 (E), Table TE-1 (α)",
  edition: "ASME II-D (edition not verified; values remembered)",
  confidence: "mem" as const,
};

export const FLANGE_MATERIALS: readonly FlangeMaterialRow[] = [
  {
    id: "sa-105",
    name: "SA-105 carbon steel forging",
    productForm: "forging",
    allowable: S_CARBON_70,
    modulus: E_CARBON,
    expansionPerK: 11.7e-6,
    yieldMpa: 250,
    yieldSource: "ASTM A105 (SA-105) minimum yield 36 ksi = 250 MPa [mem]",
    ...IID,
  },
  {
    id: "sa-182-f316",
    name: "SA-182 F316 stainless forging",
    productForm: "forging",
    allowable: S_316_LOWER,
    modulus: E_AUSTENITIC,
    expansionPerK: 16.0e-6,
    yieldMpa: 205,
    yieldSource: "ASTM A182 (SA-182) F316 minimum yield 30 ksi = 205 MPa [mem]",
    ...IID,
  },
  {
    id: "sa-182-f304",
    name: "SA-182 F304 stainless forging",
    productForm: "forging",
    allowable: S_304_LOWER,
    modulus: E_AUSTENITIC,
    expansionPerK: 16.6e-6,
    yieldMpa: 205,
    yieldSource: "ASTM A182 (SA-182) F304 minimum yield 30 ksi = 205 MPa [mem]",
    ...IID,
  },
  {
    id: "sa-516-70",
    name: "SA-516 Grade 70 carbon steel plate",
    productForm: "plate",
    allowable: S_CARBON_70,
    modulus: E_CARBON,
    expansionPerK: 11.7e-6,
    yieldMpa: 260,
    yieldSource: "ASTM A516 (SA-516) Grade 70 minimum yield 38 ksi = 260 MPa [mem]",
    ...IID,
  },
  {
    id: "sa-240-316",
    name: "SA-240 Type 316 stainless plate",
    productForm: "plate",
    allowable: S_316_LOWER,
    modulus: E_AUSTENITIC,
    expansionPerK: 16.0e-6,
    yieldMpa: 205,
    yieldSource: "ASTM A240 (SA-240) Type 316 minimum yield 30 ksi = 205 MPa [mem]",
    ...IID,
  },
  {
    id: "sa-240-304",
    name: "SA-240 Type 304 stainless plate",
    productForm: "plate",
    allowable: S_304_LOWER,
    modulus: E_AUSTENITIC,
    expansionPerK: 16.6e-6,
    yieldMpa: 205,
    yieldSource: "ASTM A240 (SA-240) Type 304 minimum yield 30 ksi = 205 MPa [mem]",
    ...IID,
  },
];

export function getFlangeMaterialById(id: string): FlangeMaterialRow | undefined {
  return FLANGE_MATERIALS.find((m) => m.id === id);
}

/** Linear interpolation in a [°C, value] table; below the first row its value, above the last null. */
export function valueAtTemperature(
  rows: readonly (readonly [number, number])[],
  tempC: number,
): number | null {
  if (rows.length === 0) return null;
  if (tempC <= rows[0][0]) return rows[0][1];
  for (let k = 1; k < rows.length; k++) {
    const [t1, v1] = rows[k];
    if (tempC <= t1) {
      const [t0, v0] = rows[k - 1];
      return v0 + ((v1 - v0) * (tempC - t0)) / (t1 - t0);
    }
  }
  return null;
}

/** Ambient temperature for gasket seating (bolt-up) [practice]. */
export const AMBIENT_TEMPERATURE_C = 20;
