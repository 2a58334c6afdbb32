/**
 * ASME VIII-1 Appendix 2 gasket seating width and reaction diameter for a flat ring gasket
 * (facing sketch 1a: b0 = N/2, N = (contact OD − contact ID)/2). The effective width rule is
 * unit-dependent and has two branches that must not be mixed:
 * inch: b = b0 if b0 ≤ 1/4 in, else 0.5·√b0 (b0 in inches);
 * metric: b = b0 if b0 ≤ 6 mm, else 2.5·√b0 (b0 in mm).
 * G = mean contact diameter when b0 is at or below the limit, else contact OD − 2b.
 */
import { inToMm, mmToIn } from "./units";

export type WidthBranch = "inch" | "metric";

/** Example (inch): b0 = 0.265 → 0.2574; (metric): b0 = 8 mm → 7.071 mm. */
export function effectiveGasketWidth(b0: number, branch: WidthBranch): number {
  if (branch === "inch") return b0 <= 0.25 ? b0 : 0.5 * Math.sqrt(b0);
  return b0 <= 6 ? b0 : 2.5 * Math.sqrt(b0);
}

export interface AsmeGasketGeometry {
  branch: WidthBranch;
  /** In the branch's own unit (in or mm). */
  unit: "in" | "mm";
  n: number;
  b0: number;
  b: number;
  g: number;
  /** The same, in mm (converted from the inch branch where that branch was used). */
  b0Mm: number;
  bMm: number;
  gMm: number;
}

/**
 * Computes b0, b and G in the branch's own unit, from the contact OD/ID given in that unit.
 * Example (B16.20 NPS 6 Class 150, inch): OD 8.25, ID 7.19 → b0 0.265, b 0.2574, G 7.735.
 */
export function asmeGasketGeometryNative(
  contactOd: number,
  contactId: number,
  branch: WidthBranch,
): { n: number; b0: number; b: number; g: number } {
  const n = (contactOd - contactId) / 2;
  const b0 = n / 2;
  const b = effectiveGasketWidth(b0, branch);
  const limit = branch === "inch" ? 0.25 : 6;
  const g = b0 <= limit ? (contactOd + contactId) / 2 : contactOd - 2 * b;
  return { n, b0, b, g };
}

/** Same, from mm inputs, choosing the branch from the display units (US → inch branch). */
export function asmeGasketGeometry(
  contactOdMm: number,
  contactIdMm: number,
  branch: WidthBranch,
): AsmeGasketGeometry {
  if (branch === "inch") {
    const r = asmeGasketGeometryNative(mmToIn(contactOdMm), mmToIn(contactIdMm), "inch");
    return { branch, unit: "in", ...r, b0Mm: inToMm(r.b0), bMm: inToMm(r.b), gMm: inToMm(r.g) };
  }
  const r = asmeGasketGeometryNative(contactOdMm, contactIdMm, "metric");
  return { branch, unit: "mm", ...r, b0Mm: r.b0, bMm: r.b, gMm: r.g };
}
