/**
 * ASME VIII-1 UG-34 flat unstayed covers attached by bolts (sketches (j) and (k)), which carry an
 * edge moment from the bolting:
 *   circular, formula (2):      t = d·√(C·P/(S·E) + 1.9·W·hG/(S·E·d³))
 *   non-circular, formula (5):  t = d·√(Z·C·P/(S·E) + 6·W·hG/(S·E·L·d²)), Z = 3.4 − 2.4·d/D ≤ 2.5
 * d: diameter (circular: the gasket reaction diameter G) or short span, D: long span, L: perimeter
 * of the bolted cover along the bolt centres, hG: gasket moment arm. Both conditions are computed
 * and the greater thickness governs: operating (P = design pressure, S at design temperature,
 * W = Wm1) and gasket seating (P = 0, S at ambient temperature, W = (Am + Ab)·Sa/2).
 * Units: mm, N, MPa (the formulas are homogeneous: both unit branches share them).
 */

export interface CoverSketch {
  id: string;
  label: string;
  c: number;
  source: string;
}

/** Bolted cover sketches of Fig. UG-34 the designer can pick (C factors of UG-34(d)) [mem: verify in your edition]. */
export const COVER_SKETCHES: readonly CoverSketch[] = [
  {
    id: "ug34-j",
    label: "Fig. UG-34 sketch (j): bolted flat cover, ring gasket",
    c: 0.3,
    source: "ASME VIII-1 UG-34(d)(2), sketch (j): C = 0.3 [mem]",
  },
  {
    id: "ug34-k",
    label: "Fig. UG-34 sketch (k): bolted flat cover in a recess, ring gasket",
    c: 0.3,
    source: "ASME VIII-1 UG-34(d)(2), sketch (k): C = 0.3 [mem]",
  },
];

export function getCoverSketch(id: string): CoverSketch | undefined {
  return COVER_SKETCHES.find((s) => s.id === id);
}

/** Z = 3.4 − 2.4·d/D, not above 2.5 (UG-34 formula (4)). Example: d/D = 0.5 → 2.2; d = D → 1.0. */
export function nonCircularZ(shortSpanMm: number, longSpanMm: number): number {
  return Math.min(2.5, 3.4 - (2.4 * shortSpanMm) / longSpanMm);
}

export interface CoverConditionInput {
  pressureMpa: number;
  allowableMpa: number;
  boltLoadN: number;
}

export interface CoverGeometry {
  shape: "circular" | "non-circular";
  /** d: G for a circular cover, the short span otherwise (mm). */
  dMm: number;
  /** D: long span (non-circular) (mm). */
  longSpanMm?: number;
  /** L: bolt-centre perimeter (non-circular) (mm). */
  perimeterMm?: number;
  hGMm: number;
  c: number;
  jointEfficiency: number;
}

/** Required thickness for one condition (mm). */
export function coverThicknessMm(g: CoverGeometry, k: CoverConditionInput): number {
  const SE = k.allowableMpa * g.jointEfficiency;
  const d = g.dMm;
  if (g.shape === "circular") {
    return d * Math.sqrt((g.c * k.pressureMpa) / SE + (1.9 * k.boltLoadN * g.hGMm) / (SE * d * d * d));
  }
  const Z = nonCircularZ(d, g.longSpanMm ?? d);
  const L = g.perimeterMm ?? Math.PI * d;
  return d * Math.sqrt((Z * g.c * k.pressureMpa) / SE + (6 * k.boltLoadN * g.hGMm) / (SE * L * d * d));
}
