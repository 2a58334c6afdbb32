/**
 * Grip length and axial stiffness of the bolt as springs in series (unthreaded shank and
 * threaded part within the grip). Units: mm, mm², MPa, N/mm.
 */

/**
 * Grip for a through bolt (nut on each end or bolt head and nut): everything clamped, with one
 * washer per side if fitted. For a tapped hole the effective grip is h + t2/2 if t2 < d, else
 * h + d/2, h being the clamped thickness above the tapped member [pub2].
 * Example: two 25 mm flanges, 3 mm gasket, no washers, through bolt → 53 mm.
 */
export function computeGripMm(input: {
  clampedThicknessMm: number;
  washerThicknessMm: number;
  nominalDiameterMm: number;
  tappedMemberThicknessMm: number | null;
}): number {
  const { clampedThicknessMm, washerThicknessMm, nominalDiameterMm: d, tappedMemberThicknessMm: t2 } = input;
  if (t2 === null) return clampedThicknessMm + 2 * washerThicknessMm;
  const h = clampedThicknessMm + washerThicknessMm;
  return h + (t2 < d ? t2 / 2 : d / 2);
}

/**
 * Splits the grip into shank (ld) and threaded (lt) lengths: ld = L − LT clamped to [0, l],
 * lt = l − ld. A stud threaded full length has ld = 0.
 * Example: L = 100, LT = 46, l = 60 → ld = 54, lt = 6.
 */
export function splitGripMm(
  gripMm: number,
  lengthMm: number,
  threadLengthMm: number,
): { shankMm: number; threadMm: number } {
  const shankMm = Math.min(Math.max(lengthMm - threadLengthMm, 0), gripMm);
  return { shankMm, threadMm: gripMm - shankMm };
}

/**
 * kb = Ad·At·E / (Ad·lt + At·ld), Ad = π·d²/4: shank and threaded part as two springs in series
 * (the resilience sum of VDI 2230 Part 1, reduced to two segments [practice]).
 * Example (Jindal Ex. 31-1): d = 18, all 50 mm of grip unthreaded, E = 210 GPa → 1.0688e6 N/mm.
 */
export function computeBoltStiffnessNPerMm(input: {
  nominalDiameterMm: number;
  tensileStressAreaMm2: number;
  shankInGripMm: number;
  threadInGripMm: number;
  modulusMpa: number;
}): number {
  const ad = (Math.PI / 4) * input.nominalDiameterMm ** 2;
  const at = input.tensileStressAreaMm2;
  const den = ad * input.threadInGripMm + at * input.shankInGripMm;
  return (ad * at * input.modulusMpa) / den;
}
