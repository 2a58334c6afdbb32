/**
 * Pressure-cone half-angle. Fixed (default 30°, Osgood's 25°–33° range [pub2]) or
 * thickness-dependent, after the VDI 2230 Part 1 substitute cone for through-bolted joints:
 * tanφ = 0.362 + 0.032·ln(βL/2) + 0.153·ln y, βL = lK/dW, y = DA/dW [mem: verify against
 * VDI 2230-1:2015]. This makes thin plates narrower than 30° and thick ones wider, as interface
 * measurements show. Clamped to 15°–45°.
 */
import type { ConeAngleSetting } from "./design";
import * as fm from "./fixed-math";

export const CONE_ANGLE_RULE_TEXT =
  "thickness-dependent: tanφ = 0.362 + 0.032·ln(βL/2) + 0.153·ln y, βL = grip/dW, y = DA/dW (DA: available bearing diameter, capped at 3·dW), φ clamped to 15°–45° (VDI 2230-1 substitute cone) [mem]";

/**
 * Example: grip 50, dW 27, DA 60 → βL = 1.85, y = 2.22 → φ ≈ 25.7°.
 */
export function thicknessDependentConeAngleDeg(
  gripMm: number,
  bearingDiameterMm: number,
  availableDiameterMm: number,
): number {
  const betaL = gripMm / bearingDiameterMm;
  const y = Math.min(Math.max(availableDiameterMm / bearingDiameterMm, 1), 3);
  const tanPhi = 0.362 + 0.032 * fm.log(betaL / 2) + 0.153 * fm.log(y);
  const deg = (fm.atan(tanPhi) * 180) / Math.PI;
  return Math.min(Math.max(Number.isFinite(deg) ? deg : 30, 15), 45);
}

/** The angle a design uses, and a sentence saying which rule produced it. */
export function resolveConeAngle(
  setting: ConeAngleSetting,
  gripMm: number,
  bearingDiameterMm: number,
  availableDiameterMm: number,
): { degrees: number; rule: string } {
  if (setting.mode === "fixed")
    return { degrees: setting.degrees, rule: `fixed ${setting.degrees}° (design input)` };
  return {
    degrees: thicknessDependentConeAngleDeg(gripMm, bearingDiameterMm, availableDiameterMm),
    rule: CONE_ANGLE_RULE_TEXT,
  };
}
