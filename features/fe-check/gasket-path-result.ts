/**
 * Gasket path model (FE cross-check, model 2), reading a run: the plate's bottom-face (gasket
 * plane) displacements from the `.dat`, the gasket pressure of a closed cell p = Eg·(−uz)/tg
 * interpolated bilinearly over the cell (the element's own field), the active-set update, the
 * pressure at any point (a cell locator and the inverse bilinear map), the gasket force
 * integrated over the closed cells (2 × 2 Gauss points, exact for the element's field) and
 * the fixed faces' reaction. Pure: takes the file text. Units: mm, N, MPa.
 */
import { findBlock, nodeVectors, parseDat } from "./dat-parser";
import type { GasketPathMesh } from "./gasket-path-model";

export interface GasketPathRun {
  /** uz of each 2D node on the gasket plane, mm (NaN where there is none). */
  uz: Float64Array;
  /** Sum of the vertical reactions of the gasket's fixed face, N (upward positive). */
  reactionN: number;
}

export function readGasketPathRun(mesh: GasketPathMesh, dat: string): GasketPathRun {
  const blocks = parseDat(dat);
  const u = nodeVectors(findBlock(blocks, "displacements", "NGASKETPLANE"));
  const uz = new Float64Array(mesh.quad.x.length).fill(NaN);
  for (let k = 0; k < uz.length; k++) {
    const v = u.get(mesh.bottomNode(k));
    if (v) uz[k] = v[2];
  }
  let reactionN = 0;
  if (mesh.gasketCells.length) reactionN = findBlock(blocks, "total force", "NFIXED").rows[0]?.[2] ?? NaN;
  return { uz, reactionN };
}

const CORNER_XI = [-1, 1, 1, -1];
const CORNER_ETA = [-1, -1, 1, 1];

/** Approach of the plate to the gasket's fixed face, −uz, at (ξ, η) of a cell, mm. */
export function approachAt(
  mesh: GasketPathMesh,
  uz: Float64Array,
  e: number,
  xi: number,
  eta: number,
): number {
  let w = 0;
  for (let i = 0; i < 4; i++)
    w -= 0.25 * (1 + CORNER_XI[i] * xi) * (1 + CORNER_ETA[i] * eta) * uz[mesh.quad.quads[e * 4 + i]];
  return w;
}

/**
 * Active-set update (as in model 1): a closed cell whose centre pulls on the gasket (approach
 * below −tol) opens; an open cell whose centre penetrates (approach > 0) closes.
 */
export function updateGasketContact(
  mesh: GasketPathMesh,
  uz: Float64Array,
  closed: Uint8Array,
  tolMm: number,
): { closed: Uint8Array; changed: number } {
  const next = Uint8Array.from(closed);
  let changed = 0;
  mesh.gasketCells.forEach((e, g) => {
    const w = approachAt(mesh, uz, e, 0, 0);
    if (closed[g] && w < -tolMm) {
      next[g] = 0;
      changed++;
    } else if (!closed[g] && w > 0) {
      next[g] = 1;
      changed++;
    }
  });
  return { closed: next, changed };
}

const GAUSS2 = [
  [-1 / Math.sqrt(3), 1],
  [1 / Math.sqrt(3), 1],
];

/** Bilinear map of a cell's corners: point and Jacobian determinant at (ξ, η). */
function bilinear(mesh: GasketPathMesh, e: number, xi: number, eta: number) {
  const q = mesh.quad;
  let x = 0,
    y = 0,
    xx = 0,
    xe = 0,
    yx = 0,
    ye = 0;
  for (let i = 0; i < 4; i++) {
    const k = q.quads[e * 4 + i];
    const a = CORNER_XI[i];
    const b = CORNER_ETA[i];
    const n = 0.25 * (1 + a * xi) * (1 + b * eta);
    x += n * q.x[k];
    y += n * q.y[k];
    xx += 0.25 * a * (1 + b * eta) * q.x[k];
    xe += 0.25 * b * (1 + a * xi) * q.x[k];
    yx += 0.25 * a * (1 + b * eta) * q.y[k];
    ye += 0.25 * b * (1 + a * xi) * q.y[k];
  }
  return { x, y, xx, xe, yx, ye, det: xx * ye - xe * yx };
}

/** Gasket force of the closed cells, Σ ∫ Eg/tg·(−uz) dA, N. */
export function gasketForceN(
  mesh: GasketPathMesh,
  uz: Float64Array,
  closed: Uint8Array,
  kPerArea: number,
): number {
  let f = 0;
  mesh.gasketCells.forEach((e, g) => {
    if (!closed[g]) return;
    for (const [xi, wi] of GAUSS2)
      for (const [eta, wj] of GAUSS2)
        f += wi * wj * bilinear(mesh, e, xi, eta).det * kPerArea * approachAt(mesh, uz, e, xi, eta);
  });
  return f;
}

export interface CellLocator {
  /** Cell containing (x, y) and its local coordinates, or the nearest gasket cell (clamped) when none does. */
  find: (x: number, y: number) => { cell: number; xi: number; eta: number; inside: boolean } | null;
}

/** A bucket grid over the gasket cells' bounding boxes. */
export function gasketCellLocator(mesh: GasketPathMesh): CellLocator {
  const q = mesh.quad;
  const cells = mesh.gasketCells;
  if (!cells.length) return { find: () => null };
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity,
    size = 0;
  const boxes = cells.map((e) => {
    let a = Infinity,
      b = Infinity,
      c = -Infinity,
      d = -Infinity;
    for (let i = 0; i < 4; i++) {
      const k = q.quads[e * 4 + i];
      a = Math.min(a, q.x[k]);
      b = Math.min(b, q.y[k]);
      c = Math.max(c, q.x[k]);
      d = Math.max(d, q.y[k]);
    }
    x0 = Math.min(x0, a);
    y0 = Math.min(y0, b);
    x1 = Math.max(x1, c);
    y1 = Math.max(y1, d);
    size += Math.max(c - a, d - b);
    return [a, b, c, d];
  });
  const h = Math.max(size / cells.length, 1e-6);
  const nx = Math.max(1, Math.ceil((x1 - x0) / h));
  const ny = Math.max(1, Math.ceil((y1 - y0) / h));
  const grid: number[][] = Array.from({ length: nx * ny }, () => []);
  const gi = (x: number) => Math.min(nx - 1, Math.max(0, Math.floor((x - x0) / h)));
  const gj = (y: number) => Math.min(ny - 1, Math.max(0, Math.floor((y - y0) / h)));
  boxes.forEach(([a, b, c, d], g) => {
    for (let i = gi(a); i <= gi(c); i++) for (let j = gj(b); j <= gj(d); j++) grid[j * nx + i].push(g);
  });
  const invert = (e: number, x: number, y: number) => {
    let xi = 0,
      eta = 0;
    for (let it = 0; it < 30; it++) {
      const m = bilinear(mesh, e, xi, eta);
      const rx = m.x - x;
      const ry = m.y - y;
      const dxi = (m.ye * rx - m.xe * ry) / m.det;
      const deta = (-m.yx * rx + m.xx * ry) / m.det;
      xi -= dxi;
      eta -= deta;
      if (Math.abs(dxi) + Math.abs(deta) < 1e-12) break;
    }
    return { xi, eta };
  };
  return {
    find(x, y) {
      let best: { cell: number; xi: number; eta: number; inside: boolean } | null = null;
      let bestOut = Infinity;
      for (let ring = 0; ring < Math.max(nx, ny); ring++) {
        const i0 = gi(x) - ring,
          i1 = gi(x) + ring,
          j0 = gj(y) - ring,
          j1 = gj(y) + ring;
        for (let i = Math.max(0, i0); i <= Math.min(nx - 1, i1); i++)
          for (let j = Math.max(0, j0); j <= Math.min(ny - 1, j1); j++) {
            if (ring > 0 && i > i0 && i < i1 && j > j0 && j < j1) continue;
            for (const g of grid[j * nx + i]) {
              const e = cells[g];
              const { xi, eta } = invert(e, x, y);
              const out = Math.max(Math.abs(xi), Math.abs(eta)) - 1;
              if (out <= 1e-9) return { cell: e, xi, eta, inside: true };
              if (out < bestOut) {
                bestOut = out;
                const c = (v: number) => Math.max(-1, Math.min(1, v));
                best = { cell: e, xi: c(xi), eta: c(eta), inside: false };
              }
            }
          }
        if (best) return best;
      }
      return best;
    },
  };
}

/** Gasket pressure at a point: Eg/tg·(−uz) in a closed cell, 0 in an open one or off the gasket. */
export function pressureAtMpa(
  mesh: GasketPathMesh,
  locator: CellLocator,
  uz: Float64Array,
  closed: Uint8Array,
  kPerArea: number,
  x: number,
  y: number,
): number {
  const hit = locator.find(x, y);
  if (!hit) return 0;
  const g = mesh.gasketIndex[hit.cell];
  if (g < 0 || !closed[g]) return 0;
  return Math.max(0, kPerArea * approachAt(mesh, uz, hit.cell, hit.xi, hit.eta));
}
