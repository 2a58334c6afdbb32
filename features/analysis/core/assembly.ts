/**
 * Assembly plan: cross-pattern ("star") tightening sequence and the passes of the ASME PCC-1
 * legacy method [pub2]: snug (≤ 20 %), about 30 %, about 70 % and 100 % of target torque in the
 * cross pattern, then circular passes at 100 % until the nuts stop turning. Torques in N·mm
 * internally, shown in N·m and ft·lb.
 */
import type { PointMm } from "./design";
import { torqueFromPreloadNmm } from "./torque";
import { nmmToFtLb, nmmToNm } from "./units";
import * as fm from "./fixed-math";

/** Bit reversal of 0…n−1 for n = 2^k. Example: n = 8 → 0, 4, 2, 6, 1, 5, 3, 7 (labels 1-5-3-7-2-6-4-8). */
export function bitReversalOrder(n: number): number[] {
  const bits = Math.round(fm.log2(n));
  return Array.from({ length: n }, (_, i) => {
    let r = 0;
    for (let b = 0; b < bits; b++) if (i & (1 << b)) r |= 1 << (bits - 1 - b);
    return r;
  });
}

export function isPowerOfTwo(n: number): boolean {
  return n > 0 && (n & (n - 1)) === 0;
}

/**
 * Farthest-first order: start at the first bolt, then always take the bolt whose distance to the
 * nearest already-tightened bolt is largest; ties go to the bolt farthest from the last one
 * tightened, then to the lowest label. Points must be in clockwise label order.
 */
export function farthestFirstOrder(points: PointMm[]): number[] {
  const n = points.length;
  if (n === 0) return [];
  const scale = Math.max(1e-9, ...points.map((p) => Math.hypot(p.x, p.y)));
  const tol = 1e-9 * scale;
  const done = new Uint8Array(n);
  const minDist = new Float64Array(n).fill(Infinity);
  const order = [0];
  done[0] = 1;
  let last = 0;
  const dist = (a: number, b: number) => Math.hypot(points[a].x - points[b].x, points[a].y - points[b].y);
  for (let i = 0; i < n; i++) minDist[i] = dist(i, 0);
  for (let step = 1; step < n; step++) {
    let best = -1;
    for (let i = 0; i < n; i++) {
      if (done[i]) continue;
      if (best < 0) {
        best = i;
        continue;
      }
      if (minDist[i] > minDist[best] + tol) best = i;
      else if (Math.abs(minDist[i] - minDist[best]) <= tol && dist(i, last) > dist(best, last) + tol)
        best = i;
    }
    done[best] = 1;
    order.push(best);
    last = best;
    for (let i = 0; i < n; i++) if (!done[i]) minDist[i] = Math.min(minDist[i], dist(i, best));
  }
  return order;
}

/**
 * ASME PCC-1 legacy cross-pattern sequences (PCC-1-2013 Appendix F; PCC-1-2019 Appendix F,
 * Table F-1 "Legacy Cross-Pattern Tightening Sequence"), clockwise labels. [mem: as remembered;
 * not confirmed through a reproduction of the table here: verify against the edition you hold.
 * The 12-bolt order is the one practitioners hold against the printed table, not the farthest-
 * first 1-7-4-10-3-9-2-8-12-6-11-5.] Each group of four is a cross: a bolt, the one opposite,
 * then the two at a quarter turn.
 */
export const PCC1_LEGACY_SEQUENCES: Readonly<Record<number, readonly number[]>> = {
  4: [1, 3, 2, 4],
  8: [1, 5, 3, 7, 2, 6, 4, 8],
  12: [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12],
  16: [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16],
  20: [1, 11, 6, 16, 3, 13, 8, 18, 5, 15, 10, 20, 2, 12, 7, 17, 4, 14, 9, 19],
  24: [1, 13, 7, 19, 4, 16, 10, 22, 2, 14, 8, 20, 5, 17, 11, 23, 3, 15, 9, 21, 6, 18, 12, 24],
};

export const PCC1_LEGACY_SOURCE =
  "ASME PCC-1 legacy cross pattern (PCC-1-2013 / PCC-1-2019 Appendix F, Table F-1) [mem: verify against your edition]";

export type SequenceRule = "pcc1-legacy" | "bit-reversal" | "farthest-first";

/** True when the points sit equally spaced on one circle (a round flange's bolt circle), within 1 %. */
export function isEvenCircle(points: PointMm[]): boolean {
  const n = points.length;
  if (n < 3) return false;
  const cx = points.reduce((a, p) => a + p.x, 0) / n;
  const cy = points.reduce((a, p) => a + p.y, 0) / n;
  const r = points.map((p) => Math.hypot(p.x - cx, p.y - cy));
  const rm = r.reduce((a, v) => a + v, 0) / n;
  const chord = 2 * rm * fm.sin(Math.PI / n);
  return (
    rm > 0 &&
    r.every((v) => Math.abs(v - rm) <= 0.01 * rm) &&
    points.every((p, i) => {
      const q = points[(i + 1) % n];
      return Math.abs(Math.hypot(p.x - q.x, p.y - q.y) - chord) <= 0.01 * chord;
    })
  );
}

/**
 * Which rule orders the bolts: the PCC-1 legacy table where it lists the count and the bolts sit
 * equally spaced on a circle (the table is for round flanges), bit reversal for other 2^k, else
 * farthest first.
 */
export function sequenceRuleFor(n: number, evenCircle = true): SequenceRule {
  if (PCC1_LEGACY_SEQUENCES[n] && evenCircle) return "pcc1-legacy";
  return isPowerOfTwo(n) && n > 2 ? "bit-reversal" : "farthest-first";
}

export function sequenceNote(rule: SequenceRule): string {
  if (rule === "pcc1-legacy") return `cross pattern: ${PCC1_LEGACY_SOURCE}`;
  if (rule === "bit-reversal")
    return "cross pattern by bit reversal of the labels (a bolt count PCC-1's legacy table does not list) [calc]";
  return "farthest-first order: each bolt the farthest from those already tightened (a bolt count PCC-1's legacy table does not list) [practice]";
}

/** Cross-pattern order (indices into `points`, which must be in clockwise label order). */
export function crossPatternOrder(points: PointMm[]): number[] {
  const rule = sequenceRuleFor(points.length, isEvenCircle(points));
  if (rule === "pcc1-legacy") return PCC1_LEGACY_SEQUENCES[points.length].map((l) => l - 1);
  return rule === "bit-reversal" ? bitReversalOrder(points.length) : farthestFirstOrder(points);
}

export interface AssemblyPass {
  pass: number;
  name: string;
  pattern: "cross" | "circular";
  fractionOfTarget: number;
  torqueNm: number;
  torqueFtLb: number;
  note: string;
}

export interface AssemblyPlan {
  /** Bolt ids in tightening order. */
  sequence: string[];
  sequenceRule: SequenceRule;
  /** The rule in words, with its source. */
  sequenceNote: string;
  targetPreloadN: number;
  targetTorqueNm: number;
  targetTorqueFtLb: number;
  nutFactor: number;
  nutFactorSource: string;
  passes: AssemblyPass[];
  source: string;
}

const PASSES: [string, "cross" | "circular", number, string][] = [
  ["snug", "cross", 0.2, "Snug the nuts; do not exceed 20 % of target torque."],
  ["pass 1", "cross", 0.3, "About 20–30 % of target; check the gasket gap is even."],
  ["pass 2", "cross", 0.7, "About 50–70 % of target."],
  ["pass 3", "cross", 1.0, "100 % of target in the cross pattern."],
  ["circular", "circular", 1.0, "Clockwise, bolt after bolt, at 100 %; repeat until the nuts stop turning."],
];

/**
 * Example: 8 bolts 3/4 in, K = 0.2, Fi = 67.1 kN → target 255.7 N·m (188.6 ft·lb), passes at
 * 20/30/70/100 % and a circular pass.
 */
export function buildAssemblyPlan(input: {
  boltIds: string[];
  points: PointMm[];
  targetPreloadN: number;
  nutFactor: number;
  nutFactorSource: string;
  nominalDiameterMm: number;
}): AssemblyPlan {
  const order = crossPatternOrder(input.points);
  const rule = sequenceRuleFor(input.points.length, isEvenCircle(input.points));
  const tNmm = torqueFromPreloadNmm(input.nutFactor, input.targetPreloadN, input.nominalDiameterMm);
  return {
    sequence: order.map((i) => input.boltIds[i]),
    sequenceRule: rule,
    sequenceNote: sequenceNote(rule),
    targetPreloadN: input.targetPreloadN,
    targetTorqueNm: nmmToNm(tNmm),
    targetTorqueFtLb: nmmToFtLb(tNmm),
    nutFactor: input.nutFactor,
    nutFactorSource: input.nutFactorSource,
    passes: PASSES.map(([name, pattern, f, note], i) => ({
      pass: i + 1,
      name,
      pattern,
      fractionOfTarget: f,
      torqueNm: nmmToNm(tNmm * f),
      torqueFtLb: nmmToFtLb(tNmm * f),
      note,
    })),
    source: "ASME PCC-1 legacy cross-pattern method (pass fractions as reproduced) [pub2]; T = K·F·d",
  };
}
