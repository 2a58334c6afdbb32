/**
 * Tightening torque from the short-form relation T = K·F·d. The nut factor K is empirical
 * (about 0.20 dry steel, 0.15–0.18 lubricated or coated [pub2]); it is a design input shown with
 * its source. Units: N, mm, N·mm.
 */
/** Example: K = 0.2, F = 100 kN, d = 20 mm → 400 000 N·mm = 400 N·m. */
export function torqueFromPreloadNmm(nutFactor: number, preloadN: number, nominalDiameterMm: number): number {
  return nutFactor * preloadN * nominalDiameterMm;
}
