/**
 * Uniform-grid spatial hash over a fixed set of points, so that "which bolts are within r of
 * this point" costs a few bucket lookups instead of a loop over every bolt. Cell size should be
 * at least the largest query radius.
 */
export interface PointHash {
  cellMm: number;
  xs: Float64Array;
  ys: Float64Array;
  buckets: Map<number, number[]>;
}

function key(ix: number, iy: number): number {
  return (ix + 32768) * 65536 + (iy + 32768);
}

export function buildPointHash(xs: ArrayLike<number>, ys: ArrayLike<number>, cellMm: number): PointHash {
  const cell = Math.max(cellMm, 1e-6);
  const buckets = new Map<number, number[]>();
  for (let i = 0; i < xs.length; i++) {
    const k = key(Math.floor(xs[i] / cell), Math.floor(ys[i] / cell));
    const b = buckets.get(k);
    if (b) b.push(i);
    else buckets.set(k, [i]);
  }
  return { cellMm: cell, xs: Float64Array.from(xs), ys: Float64Array.from(ys), buckets };
}

/**
 * Calls `visit(index, distanceSquared)` for every point within `radiusMm` of (x, y).
 * `radiusMm` must not exceed the cell size.
 */
export function forEachNear(hash: PointHash, x: number, y: number, radiusMm: number, visit: (i: number, d2: number) => void): void {
  const ix = Math.floor(x / hash.cellMm);
  const iy = Math.floor(y / hash.cellMm);
  const r2 = radiusMm * radiusMm;
  for (let dx = -1; dx <= 1; dx++) {
    for (let dy = -1; dy <= 1; dy++) {
      const b = hash.buckets.get(key(ix + dx, iy + dy));
      if (!b) continue;
      for (let j = 0; j < b.length; j++) {
        const i = b[j];
        const ex = hash.xs[i] - x;
        const ey = hash.ys[i] - y;
        const d2 = ex * ex + ey * ey;
        if (d2 <= r2) visit(i, d2);
      }
    }
  }
}

/** True when any point lies within `radiusMm` of (x, y). */
export function hasPointNear(hash: PointHash, x: number, y: number, radiusMm: number): boolean {
  const ix = Math.floor(x / hash.cellMm);
  const iy = Math.floor(y / hash.cellMm);
  const r2 = radiusMm * radiusMm;
  for (let dx = -1; dx <= 1; dx++) {
    for (let dy = -1; dy <= 1; dy++) {
      const b = hash.buckets.get(key(ix + dx, iy + dy));
      if (!b) continue;
      for (let j = 0; j < b.length; j++) {
        const ex = hash.xs[b[j]] - x;
        const ey = hash.ys[b[j]] - y;
        if (ex * ex + ey * ey < r2) return true;
      }
    }
  }
  return false;
}
