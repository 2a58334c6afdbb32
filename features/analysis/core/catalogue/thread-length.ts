/**
 * Standard thread length of hex bolts (the shank is the rest). Studs are threaded full length.
 * ASME B18.2.1: LT = 2D + 1/4 in for L ≤ 6 in, 2D + 1/2 in for L > 6 in [pub2].
 * ISO 4014: b = 2d + 6 mm (l ≤ 125), 2d + 12 (125 < l ≤ 200), 2d + 25 (l > 200) [pub2: the ISO 888 rule
 * as reproduced by fastener distributors; M20 46 / 52 / 65 mm in reproduced tables].
 */
import { inToMm, mmToIn } from "../units";
import type { Provenance } from "./confidence";

export interface ThreadLengthRule extends Provenance {
  id: "asme-b18.2.1" | "iso-4014";
  description: string;
}

/**
 * The provenance of the two rules below. Not yet read by the result's editions, so the ISO 4014
 * rule's [mem] tag does not reach the unverified values list.
 * @public (kept for that; knip's unused-export check skips it)
 */
export const THREAD_LENGTH_RULES: readonly ThreadLengthRule[] = [
  {
    id: "asme-b18.2.1",
    description: "LT = 2D + 1/4 in (L ≤ 6 in), 2D + 1/2 in (L > 6 in)",
    source: "ASME B18.2.1 hex bolts",
    edition: "ASME B18.2.1 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
  {
    id: "iso-4014",
    description: "b = 2d + 6 (l ≤ 125), 2d + 12 (125 < l ≤ 200), 2d + 25 mm (l > 200)",
    source: "ISO 4014 hexagon head bolts, reference thread length b",
    edition: "ISO 4014 (reproduced/remembered; verify)",
    confidence: "mem",
  },
];

/** Inch hex bolt thread length, mm. Example: 3/4 × 4 in → 2·0.75 + 0.25 = 1.75 in = 44.45 mm. */
export function inchBoltThreadLengthMm(nominalDiameterMm: number, lengthMm: number): number {
  const d = mmToIn(nominalDiameterMm);
  const l = mmToIn(lengthMm);
  return inToMm(2 * d + (l <= 6 ? 0.25 : 0.5));
}

/** Metric hex bolt thread length, mm. Example: M20 × 100 → 46 mm. */
export function metricBoltThreadLengthMm(nominalDiameterMm: number, lengthMm: number): number {
  const add = lengthMm <= 125 ? 6 : lengthMm <= 200 ? 12 : 25;
  return 2 * nominalDiameterMm + add;
}

/** Threaded length of a fastener: full length for studs, the standard rule (capped at L) for bolts. */
export function fastenerThreadLengthMm(
  form: "stud" | "hex-bolt",
  metric: boolean,
  nominalDiameterMm: number,
  lengthMm: number,
): number {
  if (form === "stud") return lengthMm;
  const lt = metric
    ? metricBoltThreadLengthMm(nominalDiameterMm, lengthMm)
    : inchBoltThreadLengthMm(nominalDiameterMm, lengthMm);
  return Math.min(lt, lengthMm);
}
