/**
 * Contact edge search of the bolt stack (FE cross-check, model 1), pure: where to put the outer
 * edge of one interface's contact zone next, from the linear runs so far. Every run of the search
 * closes a band of m cells from the hole outwards ("prefix" set) on each interface.
 *
 * Evidence of one run on one interface (an `EdgePoint`):
 * - g: σzz of the last closed cell, scaled to the clamp force (> 0: tension, the band is too long;
 *   well below 0: the band is too short and the cells beyond it penetrate). A sweep over m on the
 *   example designs showed g crossing zero smoothly with m, flat where the band is far too long.
 * - long: some closed cell is in tension (the active-set update would open it).
 * - bound: what the active-set update would do with the band: open from the first cell in
 *   tension (long), or close out past the last penetrating cell (short). On the example designs
 *   the settled edge never lay beyond it, so it caps the next guess.
 *
 * The edge is found when a band of m cells is not long and one of m + 1 cells is (g changes sign
 * between neighbouring cells); the caller still requires that run to be a fixed point of the
 * active-set update (the end test of the plain loop), so the figures are the plain loop's.
 * Between the runs either side of the sign change the next guess is the inverse-quadratic step
 * through the three runs nearest the secant root (the secant step when it leaves the bracket);
 * with runs on the long side only, the secant through the two shortest, capped by the bound; with
 * runs on the short side only, the bound (the active-set step, which closes all penetrating cells).
 */

export interface EdgePoint {
  /** Closed cells from the hole outwards. */
  m: number;
  /** σzz of the last closed cell at the clamp force, MPa (> 0: tension). */
  g: number;
  long: boolean;
  /** The active-set update's band length from this run; Infinity when it would not change the band. */
  bound: number;
}

/** The settled band length: the longest m that is not long while m + 1 is long; undefined when not found yet. */
export function settledEdge(points: EdgePoint[]): number | undefined {
  const longAt = new Map(points.map((p) => [p.m, p.long]));
  let best: number | undefined;
  for (const p of points)
    if (!p.long && longAt.get(p.m + 1) === true && (best === undefined || p.m > best)) best = p.m;
  return best;
}

const secant = (a: EdgePoint, b: EdgePoint) => a.m - (a.g * (b.m - a.m)) / (b.g - a.g);

function inverseQuadratic(a: EdgePoint, b: EdgePoint, c: EdgePoint): number {
  return (
    (a.m * b.g * c.g) / ((a.g - b.g) * (a.g - c.g)) +
    (b.m * a.g * c.g) / ((b.g - a.g) * (b.g - c.g)) +
    (c.m * a.g * b.g) / ((c.g - a.g) * (c.g - b.g))
  );
}

/**
 * Up to `count` band lengths to run next (best first, none run before), between 1 and nCells;
 * empty when the edge is settled or the search has nowhere left to go.
 */
export function nextEdges(points: EdgePoint[], nCells: number, count = 1): number[] {
  if (points.length === 0 || settledEdge(points) !== undefined) return [];
  // g is used with the sign the classification gives it (a long band with a compressive last cell
  // counts as just above zero).
  const pts = points.map((p) => ({
    ...p,
    g: p.long ? Math.max(p.g, Number.MIN_VALUE) : Math.min(p.g, 0),
  }));
  const shortSide = pts.filter((p) => !p.long).sort((a, b) => b.m - a.m);
  const longSide = pts.filter((p) => p.long).sort((a, b) => a.m - b.m);
  const lo = shortSide[0];
  const hi = longSide[0];
  const top = hi ? hi.m - 1 : nCells;
  const bottom = lo ? lo.m : 1;
  let cap = Math.min(...pts.map((p) => p.bound), top);
  if (cap < bottom) cap = top;
  let x: number;
  if (lo && hi) {
    x = secant(lo, hi);
    const near = pts
      .filter((p) => p.m >= lo.m && p.m <= hi.m)
      .sort((a, b) => Math.abs(a.m - x) - Math.abs(b.m - x));
    if (near.length >= 3) {
      const y = inverseQuadratic(near[0], near[1], near[2]);
      if (y > lo.m && y < hi.m) x = y;
    }
  } else if (hi) {
    const next = longSide[1];
    x = next && next.g > hi.g ? Math.min(secant(hi, next), cap) : cap;
  } else x = Number.isFinite(cap) ? cap : lo.m;
  if (!Number.isFinite(x)) x = cap;
  const a = Math.min(Math.max(Math.floor(x), bottom), cap);
  // The bound lies at or beyond the edge: its neighbour below is the better second guess.
  const order = a === cap ? [a, a - 1, a + 1, a + 2] : [a, a + 1, a - 1, a + 2];
  const known = new Set(pts.map((p) => p.m));
  const lowest = lo ? lo.m + 1 : 1;
  const highest = hi ? hi.m - 1 : nCells;
  return order
    .filter((m, i, all) => m >= lowest && m <= highest && !known.has(m) && all.indexOf(m) === i)
    .slice(0, count);
}
