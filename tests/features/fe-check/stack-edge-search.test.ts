import { describe, expect, it } from "vitest";
import { nextEdges, settledEdge, type EdgePoint } from "@/features/fe-check/stack-edge-search";
import sweeps from "./stack-edge-sweeps.json";

/**
 * The contact edge search (pure) replayed on sweeps of the bolt stack model: every band length m
 * of the NPS 6 example, the obround manway and the full-face cover run once through CalculiX
 * (internal: g = σzz of the last closed cell at the clamp force, whether a closed cell is in
 * tension, and the active-set update's band length). The plain active-set loop settled on 12, 22
 * and 53 cells from the first guesses 18, 28 and 7 in 7, 7 and 6 runs.
 */
type Sweep = { cells: number; runs: [number, number, number, number | null][] };

function replay(sweep: Sweep, first: number, parallel: number) {
  const table = new Map(
    sweep.runs.map(([m, g, long, bound]) => [m, { m, g, long: long === 1, bound: bound ?? Infinity }]),
  );
  const points: EdgePoint[] = [];
  const run = (m: number) => {
    const p = table.get(m);
    if (!p) throw new Error(`the sweep has no run at m = ${m}`);
    points.push(p);
  };
  run(first);
  let rounds = 1;
  for (let i = 0; i < 30 && settledEdge(points) === undefined; i++) {
    const next = nextEdges(points, sweep.cells, parallel);
    if (next.length === 0) break;
    next.forEach(run);
    rounds++;
  }
  return { edge: settledEdge(points), runs: points.length, rounds, order: points.map((p) => p.m) };
}

// name, sweep, first guess, the plain loop's edge, its runs, most runs one at a time, most rounds two at a time
const cases: [string, Sweep, number, number, number, number, number][] = [
  ["NPS 6 example", sweeps.nps6 as Sweep, 18, 12, 7, 5, 3],
  ["obround manway", sweeps.obround as Sweep, 28, 22, 7, 5, 4],
  ["full-face cover", sweeps.fullface as Sweep, 7, 53, 6, 6, 4],
];

describe("bolt stack contact edge search (internal)", () => {
  it.each(cases)(
    "%s: one run at a time it finds the plain loop's edge in fewer runs (never more)",
    (_, sweep, first, edge, plainRuns, most) => {
      const r = replay(sweep, first, 1);
      expect(r.edge).toBe(edge);
      expect(r.runs).toBeLessThanOrEqual(Math.min(most, plainRuns));
    },
  );
  it.each(cases)(
    "%s: two runs side by side, the same edge in fewer rounds",
    (_, sweep, first, edge, plainRuns, _most, rounds) => {
      const r = replay(sweep, first, 2);
      expect(r.edge).toBe(edge);
      expect(r.rounds).toBeLessThanOrEqual(rounds);
      expect(r.rounds).toBeLessThan(plainRuns);
    },
  );
  it("a band settles only where a band one cell longer has a closed cell in tension", () => {
    const p = (m: number, g: number, long: boolean): EdgePoint => ({ m, g, long, bound: Infinity });
    expect(settledEdge([p(12, -5, false), p(14, 5, true)])).toBeUndefined();
    expect(settledEdge([p(12, -5, false), p(13, 0.5, true)])).toBe(12);
    expect(settledEdge([p(21, -3, false), p(22, -0.4, false), p(23, 1.8, true)])).toBe(22);
    expect(nextEdges([p(12, -5, false), p(13, 0.5, true)], 55)).toEqual([]);
    // Between the two runs either side of the sign change, none run twice.
    expect(nextEdges([p(10, -24, false), p(14, 5, true)], 55, 2)).toEqual([13, 12]);
  });
});
