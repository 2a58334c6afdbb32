/**
 * Unit conversions and display formatting. The core computes in mm, N, MPa and N·mm throughout;
 * these helpers are used only at the edges (form input, display, the inch branch of ASME
 * Appendix 2). Conversion factors are exact definitions (inch, pound-force) or derived from them.
 */
import type { UnitSystem } from "./design";

export const MM_PER_IN = 25.4;
/** 1 lbf = 0.45359237 kg × 9.80665 m/s². */
export const N_PER_LBF = 4.4482216152605;
// Derived factors are written out as the doubles they evaluate to (N_PER_LBF / 25.4², then
// 12 · 25.4 · N_PER_LBF left to right): a bundler that folds the expression in another order
// (12 · (25.4 · N_PER_LBF) is one unit in the last place higher) would make the browser's result
// differ from the server's. tests/features/analysis/core/fixed-math.test.ts pins both.
/** 1 psi = 1 lbf/in². */
export const MPA_PER_PSI = 0.006894757293168361;
/** 1 ft·lb = 12 in × 1 lbf, in N·mm. */
export const NMM_PER_FTLB = 1355.8179483314;

export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mm2ToIn2 = (mm2: number): number => mm2 / (MM_PER_IN * MM_PER_IN);
export const in2ToMm2 = (in2: number): number => in2 * MM_PER_IN * MM_PER_IN;
export const nToLbf = (n: number): number => n / N_PER_LBF;
export const lbfToN = (lbf: number): number => lbf * N_PER_LBF;
export const mpaToPsi = (mpa: number): number => mpa / MPA_PER_PSI;
export const psiToMpa = (psi: number): number => psi * MPA_PER_PSI;
export const ksiToMpa = (ksi: number): number => ksi * 1000 * MPA_PER_PSI;
export const mpaToKsi = (mpa: number): number => mpa / MPA_PER_PSI / 1000;
export const nmmToFtLb = (nmm: number): number => nmm / NMM_PER_FTLB;
export const ftLbToNmm = (ftLb: number): number => ftLb * NMM_PER_FTLB;
export const nmmToNm = (nmm: number): number => nmm / 1000;
export const nmToNmm = (nm: number): number => nm * 1000;

/** Rounds to a number of significant digits; keeps 0 as 0. Example: `roundSignificant(1234.5, 3)` → 1230. */
export function roundSignificant(value: number, digits = 4): number {
  if (value === 0 || !Number.isFinite(value)) return 0;
  // toPrecision is exactly specified (the nearest decimal of that many digits), so every engine
  // agrees and no binary residue such as 55.00000000000001 survives.
  return Number(value.toPrecision(Math.min(100, Math.max(1, Math.round(digits)))));
}

/** A fraction as a percentage for text, without binary residue: `percent(0.55)` → "55" (not 55.00000000000001). */
export function percent(fraction: number, decimals = 1): string {
  return String(Number((fraction * 100).toFixed(decimals)));
}

function fmt(value: number, digits: number): string {
  return String(roundSignificant(value, digits));
}

/** `formatLength(25.4, "US")` → "1 in"; `formatLength(25.4, "SI")` → "25.4 mm". */
export function formatLength(mm: number, units: UnitSystem, digits = 4): string {
  return units === "US" ? `${fmt(mmToIn(mm), digits)} in` : `${fmt(mm, digits)} mm`;
}

/** `formatForce(4448.2, "US")` → "1000 lbf"; SI shows kN above 10 kN. */
export function formatForce(n: number, units: UnitSystem, digits = 4): string {
  if (units === "US") return `${fmt(nToLbf(n), digits)} lbf`;
  return Math.abs(n) >= 10_000 ? `${fmt(n / 1000, digits)} kN` : `${fmt(n, digits)} N`;
}

/** `formatStress(172.4, "US")` → "25000 psi"; `formatStress(172.4, "SI")` → "172.4 MPa". */
export function formatStress(mpa: number, units: UnitSystem, digits = 4): string {
  return units === "US" ? `${fmt(mpaToPsi(mpa), digits)} psi` : `${fmt(mpa, digits)} MPa`;
}

/** `formatTorque(284_700, "SI")` → "284.7 N·m"; `formatTorque(284_700, "US")` → "210 ft·lb". */
export function formatTorque(nmm: number, units: UnitSystem, digits = 4): string {
  return units === "US" ? `${fmt(nmmToFtLb(nmm), digits)} ft·lb` : `${fmt(nmmToNm(nmm), digits)} N·m`;
}

/** `formatArea(245, "US")` → "0.3798 in²". */
export function formatArea(mm2: number, units: UnitSystem, digits = 4): string {
  return units === "US" ? `${fmt(mm2ToIn2(mm2), digits)} in²` : `${fmt(mm2, digits)} mm²`;
}
