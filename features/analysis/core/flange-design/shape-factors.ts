import * as fm from "../fixed-math";
/**
 * ASME VIII-1 Appendix 2 flange shape factors, from their equations (never read off the curves).
 *
 * - K = A/B and T, U, Y, Z of Fig. 2-7.1, in closed form (2-7):
 *   T = [K²(1 + 8.55246 log10 K) − 1] / [(1.04720 + 1.9448 K²)(K − 1)]
 *   U = [K²(1 + 8.55246 log10 K) − 1] / [1.36136 (K² − 1)(K − 1)]
 *   Y = [0.66845 + 5.71690 K² log10 K / (K² − 1)] / (K − 1)
 *   Z = (K² + 1)/(K² − 1)
 * - F, V and f of integral flanges (Figs. 2-7.2, 2-7.3, 2-7.6) from the equations of Table 2-7.1
 *   (A = g1/g0 − 1, C = 43.68 (h/h0)⁴, coefficients C1…C37, E1…E6); f is not taken below 1.
 *   With no hub taper (g1 = g0) the figures give F = 0.908920, V = 0.550103, f = 1, which is the
 *   A → 0 limit of the same equations.
 * Every factor is dimensionless, so both unit branches use the same functions.
 */

export interface RingFactors {
  K: number;
  T: number;
  U: number;
  Y: number;
  Z: number;
}

/** T, U, Y, Z for K = A/B (> 1). Example: K = 19/12.25 → T 1.6886, U 5.0524, Y 4.5977, Z 2.4228. */
export function ringFactors(K: number): RingFactors {
  const K2 = K * K;
  const lg = fm.log10(K);
  const num = K2 * (1 + 8.55246 * lg) - 1;
  return {
    K,
    T: num / ((1.0472 + 1.9448 * K2) * (K - 1)),
    U: num / (1.36136 * (K2 - 1) * (K - 1)),
    Y: (0.66845 + (5.7169 * K2 * lg) / (K2 - 1)) / (K - 1),
    Z: (K2 + 1) / (K2 - 1),
  };
}

export interface HubFactors {
  F: number;
  V: number;
  /** Hub stress correction factor, not below 1. */
  f: number;
  /** f before the "not below 1" rule. */
  fRaw: number;
}

/** Figure values for a hub without taper (g1/g0 = 1) [mem: Fig. 2-7.2 and 2-7.3 notes; the equations' limit agrees]. */
export const NO_TAPER_HUB: HubFactors = { F: 0.90892, V: 0.550103, f: 1, fRaw: 1 };

/**
 * F, V, f of an integral flange from the Table 2-7.1 equations.
 * Example: g1/g0 = 4.26, h/h0 = 1.71429 → F 0.55138, V 0.02868, f 1 (0.1176 before the rule).
 */
export function integralHubFactors(g1OverG0: number, hOverH0: number): HubFactors {
  if (g1OverG0 <= 1 + 1e-9 || hOverH0 <= 0) return NO_TAPER_HUB;
  const A = g1OverG0 - 1;
  const C = 43.68 * fm.pow(hOverH0, 4);
  const A2 = A * A,
    A3 = A2 * A;
  const C1 = 1 / 3 + A / 12;
  const C2 = 5 / 42 + (17 * A) / 336;
  const C3 = 1 / 210 + A / 360;
  const C4 = 11 / 360 + (59 * A) / 5040 + (1 + 3 * A) / C;
  const C5 = 1 / 90 + (5 * A) / 1008 - fm.pow(1 + A, 3) / C;
  const C6 = 1 / 120 + (17 * A) / 5040 + 1 / C;
  const C7 = 215 / 2772 + (51 * A) / 1232 + (60 / 7 + (225 * A) / 14 + (75 * A2) / 7 + (5 * A3) / 2) / C;
  const C8 = 31 / 6930 + (128 * A) / 45045 + (6 / 7 + (15 * A) / 7 + (12 * A2) / 7 + (5 * A3) / 11) / C;
  const C9 = 533 / 30240 + (653 * A) / 73920 + (1 / 2 + (33 * A) / 14 + (39 * A2) / 28 + (25 * A3) / 84) / C;
  const C10 = 29 / 3780 + (3 * A) / 704 - (1 / 2 + (33 * A) / 14 + (81 * A2) / 28 + (13 * A3) / 12) / C;
  const C11 = 31 / 6048 + (1763 * A) / 665280 + (1 / 2 + (6 * A) / 7 + (15 * A2) / 28 + (5 * A3) / 42) / C;
  const C12 = 1 / 2925 + (71 * A) / 300300 + (8 / 35 + (18 * A) / 35 + (156 * A2) / 385 + (6 * A3) / 55) / C;
  const C13 =
    761 / 831600 + (937 * A) / 1663200 + (1 / 35 + (6 * A) / 35 + (11 * A2) / 70 + (3 * A3) / 70) / C;
  const C14 = 197 / 415800 + (103 * A) / 332640 - (1 / 35 + (6 * A) / 35 + (17 * A2) / 70 + A3 / 10) / C;
  const C15 = 233 / 831600 + (97 * A) / 554400 + (1 / 35 + (3 * A) / 35 + A2 / 14 + (2 * A3) / 105) / C;
  const C16 = C1 * C7 * C12 + C2 * C8 * C3 + C3 * C8 * C2 - (C3 * C3 * C7 + C8 * C8 * C1 + C2 * C2 * C12);
  const C17 =
    (C4 * C7 * C12 + C2 * C8 * C13 + C3 * C8 * C9 - (C13 * C7 * C3 + C8 * C8 * C4 + C12 * C2 * C9)) / C16;
  const C18 =
    (C5 * C7 * C12 + C2 * C8 * C14 + C3 * C8 * C10 - (C14 * C7 * C3 + C8 * C8 * C5 + C12 * C2 * C10)) / C16;
  const C19 =
    (C6 * C7 * C12 + C2 * C8 * C15 + C3 * C8 * C11 - (C15 * C7 * C3 + C8 * C8 * C6 + C12 * C2 * C11)) / C16;
  const C20 =
    (C1 * C9 * C12 + C4 * C8 * C3 + C3 * C13 * C2 - (C3 * C3 * C9 + C13 * C8 * C1 + C12 * C4 * C2)) / C16;
  const C21 =
    (C1 * C10 * C12 + C5 * C8 * C3 + C3 * C14 * C2 - (C3 * C3 * C10 + C14 * C8 * C1 + C12 * C5 * C2)) / C16;
  const C22 =
    (C1 * C11 * C12 + C6 * C8 * C3 + C3 * C15 * C2 - (C3 * C3 * C11 + C15 * C8 * C1 + C12 * C6 * C2)) / C16;
  const C23 =
    (C1 * C7 * C13 + C2 * C9 * C3 + C4 * C8 * C2 - (C3 * C7 * C4 + C8 * C9 * C1 + C2 * C2 * C13)) / C16;
  const C24 =
    (C1 * C7 * C14 + C2 * C10 * C3 + C5 * C8 * C2 - (C3 * C7 * C5 + C8 * C10 * C1 + C2 * C2 * C14)) / C16;
  const C25 =
    (C1 * C7 * C15 + C2 * C11 * C3 + C6 * C8 * C2 - (C3 * C7 * C6 + C8 * C11 * C1 + C2 * C2 * C15)) / C16;
  const C26 = -fm.pow(C / 4, 0.25);
  const C27 = C20 - C17 - 5 / 12 + C17 * C26;
  const C28 = C22 - C19 - 1 / 12 + C19 * C26;
  const C29 = -fm.pow(C / 4, 0.5);
  const C30 = -fm.pow(C / 4, 0.75);
  const C31 = (3 * A) / 2 - C17 * C30;
  const C32 = 1 / 2 - C19 * C30;
  const C33 = 0.5 * C26 * C32 + C28 * C31 * C29 - (0.5 * C30 * C28 + C32 * C27 * C29);
  const C34 = 1 / 12 + C18 - C21 - C18 * C26;
  const C35 = C18 * C30;
  const C36 = (C28 * C35 * C29 - C32 * C34 * C29) / C33;
  const C37 = (0.5 * C26 * C35 + C34 * C31 * C29 - (0.5 * C30 * C34 + C35 * C27 * C29)) / C33;
  const E1 = C17 * C36 + C18 + C19 * C37;
  const E2 = C20 * C36 + C21 + C22 * C37;
  const E3 = C23 * C36 + C24 + C25 * C37;
  const E4 = 1 / 4 + C37 / 12 + C36 / 4 - E3 / 5 - (3 * E2) / 2 - E1;
  const E5 = E1 * (1 / 2 + A / 6) + E2 * (1 / 4 + (11 * A) / 84) + E3 * (1 / 70 + A / 105);
  const E6 = E5 - C36 * (7 / 120 + A / 36 + (3 * A) / C) - 1 / 40 - A / 72 - C37 * (1 / 60 + A / 120 + 1 / C);
  const F = -E6 / ((fm.pow(C / 2.73, 0.25) * fm.pow(1 + A, 3)) / C);
  const V = E4 / (fm.pow(2.73 / C, 0.25) * fm.pow(1 + A, 3));
  const fRaw = C36 / (1 + A);
  return { F, V, f: Math.max(1, fRaw), fRaw };
}
