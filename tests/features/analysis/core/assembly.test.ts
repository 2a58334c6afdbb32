import { describe, expect, it } from "vitest";
import {
  bitReversalOrder,
  buildAssemblyPlan,
  crossPatternOrder,
  farthestFirstOrder,
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
  for (const n of [12, 20, 36, 96]) {
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
