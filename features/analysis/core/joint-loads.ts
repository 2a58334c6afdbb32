/**
 * Load sharing by the joint constant (the joint diagram: VDI 2230 Part 1 load factor Φ; Bickford,
 * An Introduction to the Design and Behavior of Bolted Joints): C = kb/(kb + km); with preload Fi and an
 * external separating load P per bolt, bolt load Fb = Fi + C·P, member (clamp) load
 * Fm = Fi − (1 − C)·P, separation at P0 = Fi/(1 − C). Units: N, N/mm, mm.
 */
import type { PointMm } from "./design";

/** Example (Jindal Ex. 31-1): kb = 1.0688e6, km = 2.2458e6 → C = 0.322. */
export function jointConstant(boltStiffnessNPerMm: number, memberStiffnessNPerMm: number): number {
  return boltStiffnessNPerMm / (boltStiffnessNPerMm + memberStiffnessNPerMm);
}

/** Example: Fi = 100 kN, P = 30 kN, C = 0.3 → Fb = 109 kN, Fm = 79 kN, P0 = 142.9 kN. */
export function shareExternalLoad(
  preloadN: number,
  externalN: number,
  c: number,
): { boltN: number; clampN: number; separationLoadN: number } {
  return {
    boltN: preloadN + c * externalN,
    clampN: preloadN - (1 - c) * externalN,
    separationLoadN: preloadN / (1 - c),
  };
}

/**
 * Factors of safety with respect to the proof load Fp [practice]: yield factor np = Fp/(Fi + C·P),
 * load factor nL = (Fp − Fi)/(C·P), separation factor n0 = Fi/((1 − C)·P). A factor that does
 * not apply (no external load) is null.
 */
export function computeSafetyFactors(
  proofLoadN: number,
  preloadN: number,
  externalN: number,
  c: number,
): {
  yieldFactor: number;
  loadFactor: number | null;
  separationFactor: number | null;
} {
  const p = Math.max(externalN, 0);
  return {
    yieldFactor: proofLoadN / (preloadN + c * p),
    loadFactor: p > 0 ? (proofLoadN - preloadN) / (c * p) : null,
    separationFactor: p > 0 ? preloadN / ((1 - c) * p) : null,
  };
}

/**
 * Separating load on each bolt from a total axial force (shared equally) and a moment about the
 * x axis (shared in proportion to y, as for a rigid flange): Pi = F/n + M·yi/Σy².
 * Example: 4 bolts at y = ±100, F = 40 kN, M = 0 → 10 kN each.
 */
export function distributeExternalLoadN(bolts: PointMm[], totalAxialN: number, momentNmm: number): number[] {
  const n = bolts.length;
  const sumY2 = bolts.reduce((a, p) => a + p.y * p.y, 0);
  return bolts.map((p) => totalAxialN / n + (sumY2 > 0 ? (momentNmm * p.y) / sumY2 : 0));
}
