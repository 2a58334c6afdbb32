/**
 * Uniform-grid spatial index over a fixed set of points (compressed rows in typed arrays), so
 * that "which bolts are within r of this point" costs a few array reads instead of a loop over
 * every bolt. The cell size must be at least the largest query radius.
 */
export interface PointHash {
  cellMm: number;
  x0: number;
  y0: number;
  nx: number;
  ny: number;
  /** cellStart[c] … cellStart[c + 1] index into `items`. */
  cellStart: Int32Array;
  items: Int32Array;
  xs: Float64Array;
  ys: Float64Array;
}

const MAX_CELLS_PER_AXIS = 1024;

export function buildPointHash(xs: ArrayLike<number>, ys: ArrayLike<number>, cellMm: number): PointHash {
  const n = xs.length;
  let xMin = Infinity,
    xMax = -Infinity,
    yMin = Infinity,
    yMax = -Infinity;
  for (let i = 0; i < n; i++) {
    xMin = Math.min(xMin, xs[i]);
    xMax = Math.max(xMax, xs[i]);
    yMin = Math.min(yMin, ys[i]);
    yMax = Math.max(yMax, ys[i]);
  }
  if (n === 0) {
    xMin = xMax = yMin = yMax = 0;
  }
  let cell = Math.max(cellMm, 1e-6);
  cell = Math.max(cell, (xMax - xMin) / MAX_CELLS_PER_AXIS, (yMax - yMin) / MAX_CELLS_PER_AXIS);
  const x0 = xMin - cell;
  const y0 = yMin - cell;
  const nx = Math.floor((xMax - x0) / cell) + 2;
  const ny = Math.floor((yMax - y0) / cell) + 2;
  const counts = new Int32Array(nx * ny + 1);
  const cellOf = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor((ys[i] - y0) / cell) * nx + Math.floor((xs[i] - x0) / cell);
    cellOf[i] = c;
    counts[c + 1]++;
  }
  for (let c = 0; c < nx * ny; c++) counts[c + 1] += counts[c];
  const fill = counts.slice(0, nx * ny);
  const items = new Int32Array(n);
  for (let i = 0; i < n; i++) items[fill[cellOf[i]]++] = i;
  return {
    cellMm: cell,
    x0,
    y0,
    nx,
    ny,
    cellStart: counts,
    items,
    xs: Float64Array.from(xs),
    ys: Float64Array.from(ys),
  };
}

/**
 * Calls `test(index, distanceSquared)` for every point in the cells around (x, y) (a cell is at
 * least the search radius wide, so these hold every point within it) until one returns true.
 */
function someInNearCells(
  hash: PointHash,
  x: number,
  y: number,
  test: (i: number, d2: number) => boolean,
): boolean {
  const cx = Math.floor((x - hash.x0) / hash.cellMm);
  const cy = Math.floor((y - hash.y0) / hash.cellMm);
  for (let iy = Math.max(cy - 1, 0); iy <= Math.min(cy + 1, hash.ny - 1); iy++) {
    for (let ix = Math.max(cx - 1, 0); ix <= Math.min(cx + 1, hash.nx - 1); ix++) {
      const c = iy * hash.nx + ix;
      for (let k = hash.cellStart[c]; k < hash.cellStart[c + 1]; k++) {
        const i = hash.items[k];
        const ex = hash.xs[i] - x;
        const ey = hash.ys[i] - y;
        if (test(i, ex * ex + ey * ey)) return true;
      }
    }
  }
  return false;
}

/** Calls `visit(index, distanceSquared)` for every point within `radiusMm` of (x, y). */
export function forEachNear(
  hash: PointHash,
  x: number,
  y: number,
  radiusMm: number,
  visit: (i: number, d2: number) => void,
): void {
  const r2 = radiusMm * radiusMm;
  someInNearCells(hash, x, y, (i, d2) => {
    if (d2 <= r2) visit(i, d2);
    return false;
  });
}

/** True when any point lies strictly within `radiusMm` of (x, y). */
export function hasPointNear(hash: PointHash, x: number, y: number, radiusMm: number): boolean {
  const r2 = radiusMm * radiusMm;
  return someInNearCells(hash, x, y, (_i, d2) => d2 < r2);
}
