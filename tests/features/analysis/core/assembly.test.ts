import { describe, expect, it } from "vitest";
import {
  bitReversalOrder,
  buildAssemblyPlan,
  crossPatternOrder,
  farthestFirstOrder,
  isEvenCircle,
  PCC1_LEGACY_SEQUENCES,
  sequenceNote,
  sequenceRuleFor,
} from "@/features/analysis/core/assembly";
import type { PointMm } from "@/features/analysis/core/design";

const ring = (n: number, r = 100): PointMm[] =>
  Array.from({ length: n }, (_, i) => {
    const a = ((i + 0.5) * 2 * Math.PI) / n;
    return { x: r * Math.sin(a), y: r * Math.cos(a) };
  });

describe("cross-pattern sequence", () => {
  it("8 bolts: bit reversal 1-5-3-7-2-6-4-8 (reference 2.5 [calc])", () => {
    expect(bitReversalOrder(8).map((i) => i + 1)).toEqual([1, 5, 3, 7, 2, 6, 4, 8]);
    expect(crossPatternOrder(ring(8)).map((i) => i + 1)).toEqual([1, 5, 3, 7, 2, 6, 4, 8]);
  });
  it("16 bolts: a permutation starting 1-9-5-13", () => {
    const o = crossPatternOrder(ring(16)).map((i) => i + 1);
    expect(o.slice(0, 4)).toEqual([1, 9, 5, 13]);
    expect([...o].sort((a, b) => a - b)).toEqual(Array.from({ length: 16 }, (_, i) => i + 1));
  });
  for (const n of [10, 14, 36, 96]) {
    it(`${n} bolts: every step takes a bolt farthest from those already tightened (property, not a table)`, () => {
      const pts = ring(n);
      const order = crossPatternOrder(pts);
      expect(new Set(order).size).toBe(n);
      const d = (a: number, b: number) => Math.hypot(pts[a].x - pts[b].x, pts[a].y - pts[b].y);
      for (let k = 1; k < n; k++) {
        const done = order.slice(0, k);
        const score = (i: number) => Math.min(...done.map((j) => d(i, j)));
        const chosen = score(order[k]);
        const remaining = order.slice(k);
        const best = Math.max(...remaining.map(score));
        expect(chosen).toBeGreaterThanOrEqual(best - 1e-9);
      }
      expect(d(order[0], order[1])).toBeCloseTo(200, 6); // the second bolt is diametrically opposite
    });
  }
  it("bolt counts the legacy table lists use it and say so; others say farthest first (or bit reversal) and that the table does not list them", () => {
    for (const n of [4, 8, 12, 16, 20, 24]) {
      expect(sequenceRuleFor(n)).toBe("pcc1-legacy");
      expect(sequenceNote("pcc1-legacy")).toMatch(/PCC-1.*Appendix F.*\[mem/);
    }
    expect(sequenceRuleFor(32)).toBe("bit-reversal");
    expect(sequenceRuleFor(10)).toBe("farthest-first");
    expect(sequenceNote("farthest-first")).toMatch(/does not list/);
  });
  it("the table is for round flanges: 12 bolts on a rectangle use farthest first", () => {
    const rect = [
      ...[-150, -50, 50, 150].map((x) => ({ x, y: 100 })),
      { x: 200, y: 50 },
      { x: 200, y: -50 },
      ...[150, 50, -50, -150].map((x) => ({ x, y: -100 })),
      { x: -200, y: -50 },
      { x: -200, y: 50 },
    ];
    expect(isEvenCircle(rect)).toBe(false);
    expect(isEvenCircle(ring(12))).toBe(true);
    expect(crossPatternOrder(rect)).toEqual(farthestFirstOrder(rect));
  });
  // The table is [mem] (not confirmed through a reproduction here), so it is checked for the
  // properties of a cross pattern, not against remembered numbers.
  for (const [n, seq] of Object.entries(PCC1_LEGACY_SEQUENCES)) {
    it(`${n} bolts, PCC-1 legacy table: a permutation; in each group of four a bolt, the one opposite, then the two a quarter turn away`, () => {
      const count = Number(n);
      expect([...seq].sort((a, b) => a - b)).toEqual(Array.from({ length: count }, (_, i) => i + 1));
      const at = (l: number) => ((l - 1) * 360) / count;
      const gap = (a: number, b: number) => {
        const g = Math.abs(at(a) - at(b)) % 360;
        return Math.min(g, 360 - g);
      };
      for (let k = 0; k < count; k += 4) {
        const [a, b, c, d] = seq.slice(k, k + 4);
        expect(gap(a, b)).toBeCloseTo(180, 9);
        expect(gap(c, d)).toBeCloseTo(180, 9);
        expect(gap(a, c)).toBeCloseTo(90, 9);
      }
      expect(crossPatternOrder(ring(count)).map((i) => i + 1)).toEqual([...seq]);
    });
  }
  it("12 bolts: not the farthest-first 1-7-4-10-3-9-2-8-12-6-11-5 that practitioners reject against the printed table (issue report)", () => {
    expect(crossPatternOrder(ring(12)).map((i) => i + 1)).not.toEqual([
      1, 7, 4, 10, 3, 9, 2, 8, 12, 6, 11, 5,
    ]);
  });
  it("works for odd and irregular patterns", () => {
    const pts = [
      { x: 0, y: 10 },
      { x: 3, y: 9 },
      { x: 10, y: 0 },
      { x: 0, y: -10 },
      { x: -7, y: -7 },
    ];
    expect(new Set(farthestFirstOrder(pts)).size).toBe(5);
    expect(farthestFirstOrder([])).toEqual([]);
  });
});

describe("assembly passes (ASME PCC-1 legacy method [pub2])", () => {
  it("snug ≤ 20 %, ~30 %, ~70 %, 100 % cross, then circular 100 %, torque in N·m and ft·lb", () => {
    const plan = buildAssemblyPlan({
      boltIds: ring(8).map((_, i) => `b${i + 1}`),
      points: ring(8),
      targetPreloadN: 100_000,
      nutFactor: 0.2,
      nutFactorSource: "test",
      nominalDiameterMm: 20,
    });
    expect(plan.passes.map((p) => p.fractionOfTarget)).toEqual([0.2, 0.3, 0.7, 1, 1]);
    expect(plan.passes.map((p) => p.pattern)).toEqual(["cross", "cross", "cross", "cross", "circular"]);
    expect(plan.targetTorqueNm).toBeCloseTo(400, 9);
    expect(plan.targetTorqueFtLb).toBeCloseTo(295.02, 1);
    expect(plan.sequence).toEqual(["b1", "b5", "b3", "b7", "b2", "b6", "b4", "b8"]);
  });
});
