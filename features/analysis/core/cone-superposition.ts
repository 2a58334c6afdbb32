/**
 * Cone superposition: each bolt's clamp force reaches the gasket plane as an annular footprint
 * from the hole edge ri to the loaded-zone radius rc, with a pressure that is highest near the
 * hole and falls to zero at rc: p = p0·(1 − ξ^a)^b, ξ = (r − ri)/(rc − ri). The calibrated
 * footprint (interface-footprint.ts) gives rc, a and b from FE; a = b = 1 is the linear falloff
 * used with a fixed cone angle. Each footprint is normalised so that its pressure, integrated over
 * the part of it that lies on gasket material (clipped by the outline, the bore, other holes, a
 * ring gasket's edges), equals the bolt force; then all bolts are superposed. Units: N, mm, MPa.
 */
import type { GasketRegion } from "./gasket-region";
import { isOnGasket } from "./gasket-region";
import { buildPointHash, forEachNear, type PointHash } from "./point-hash";
import { signedDistanceToShape } from "./shape";
import { footprintIntegralMm2, footprintShapeValue } from "./interface-footprint";

/** Exponents of the footprint's pressure shape (1 − ξ^a)^b; LINEAR_SHAPE is the linear falloff. */
export interface FootprintShape {
  a: number;
  b: number;
}
export const LINEAR_SHAPE: FootprintShape = { a: 1, b: 1 };
import * as fm from "./fixed-math";

export interface ConeField {
  innerRadiusMm: number;
  outerRadiusMm: number;
  /** Peak pressure at the hole edge for each bolt, MPa (0 when the footprint misses the gasket). */
  peakMpa: Float64Array;
  shape: FootprintShape;
  /** (1 − ξ^a)^b at ξ = k/SHAPE_STEPS, k = 0…SHAPE_STEPS (linear interpolation between). */
  shapeTable: Float64Array;
  /** Fraction of each unclipped footprint integral that lies on gasket material. */
  onGasketFraction: Float64Array;
  hash: PointHash;
}

/** ∫ over the full annulus of (rc − r)/(rc − ri) dA = π·(rc − ri)·(rc + 2ri)/3. Example: ri = 9, rc = 24 → 659.7 mm². */
export function coneFootprintIntegralMm2(innerRadiusMm: number, outerRadiusMm: number): number {
  return (Math.PI * (outerRadiusMm - innerRadiusMm) * (outerRadiusMm + 2 * innerRadiusMm)) / 3;
}

const SHAPE_STEPS = 256;

/**
 * The table and the footprint integral depend on the shape (and the radii) only, so they are kept
 * for the next field of the same joint (every frame of a drag): the same numbers, computed once.
 * Shared tables are never written to after they are made.
 */
const shapeTables = new Map<string, Float64Array>();
const footprintIntegrals = new Map<string, number>();
const SHAPE_MEMO_LIMIT = 64;

function shapeTableOf(shape: FootprintShape): Float64Array {
  const key = `${shape.a}|${shape.b}`;
  const hit = shapeTables.get(key);
  if (hit) return hit;
  const t = new Float64Array(SHAPE_STEPS + 2);
  for (let k = 0; k <= SHAPE_STEPS; k++) t[k] = footprintShapeValue(k / SHAPE_STEPS, shape.a, shape.b);
  t[SHAPE_STEPS] = 0;
  if (shapeTables.size >= SHAPE_MEMO_LIMIT) shapeTables.clear();
  shapeTables.set(key, t);
  return t;
}

function footprintIntegralOf(ri: number, rc: number, shape: FootprintShape): number {
  if (isLinear(shape)) return coneFootprintIntegralMm2(ri, rc);
  const key = `${ri}|${rc}|${shape.a}|${shape.b}`;
  let v = footprintIntegrals.get(key);
  if (v === undefined) {
    v = footprintIntegralMm2(ri, rc, shape.a, shape.b);
    if (footprintIntegrals.size >= SHAPE_MEMO_LIMIT) footprintIntegrals.clear();
    footprintIntegrals.set(key, v);
  }
  return v;
}

function isLinear(shape: FootprintShape): boolean {
  return shape.a === 1 && shape.b === 1;
}

const NR = 20;
const NT = 96;

function clippedFraction(
  region: GasketRegion,
  x: number,
  y: number,
  ri: number,
  rc: number,
  shape: FootprintShape,
): number {
  let full = 0;
  let on = 0;
  const dr = (rc - ri) / NR;
  for (let a = 0; a < NR; a++) {
    const r = ri + (a + 0.5) * dr;
    const wgt = footprintShapeValue((a + 0.5) / NR, shape.a, shape.b) * r;
    for (let b = 0; b < NT; b++) {
      const t = ((b + 0.5) * 2 * Math.PI) / NT;
      full += wgt;
      if (isOnGasket(region, x + r * fm.cos(t), y + r * fm.sin(t))) on += wgt;
    }
  }
  return on / full;
}

/** Quick classification of a footprint: wholly on gasket (1), wholly off it (0), or partly (−1). */
function quickFraction(
  region: GasketRegion,
  x: number,
  y: number,
  ri: number,
  rc: number,
  hash: PointHash,
  self: number,
): number {
  let neighbourHole = false;
  forEachNear(hash, x, y, rc + region.holeRadiusMm, (j) => {
    if (j !== self) neighbourHole = true;
  });
  if (region.kind === "annulus") {
    const r = Math.hypot(x, y);
    if (r - rc > region.outerRadiusMm || r + rc < region.innerRadiusMm) return 0;
    if (!neighbourHole && r - rc >= region.innerRadiusMm && r + rc <= region.outerRadiusMm) return 1;
    return -1;
  }
  const d = -signedDistanceToShape(region.outline, x, y);
  if (region.kind === "band") {
    if (Math.abs(d - region.bandCentreOffsetMm) > region.bandWidthMm / 2 + rc) return 0;
    return -1;
  }
  const boreOk = !region.bore || signedDistanceToShape(region.bore, x, y) >= rc;
  return !neighbourHole && d >= rc && boreOk ? 1 : -1;
}

/**
 * Memo of clipped footprint fractions. The fraction is a pure function of the bolt position, the
 * footprint radii, the gasket region's boundaries and the holes that can reach the footprint, so
 * while one bolt is dragged every other bolt's fraction is reused bit for bit. Without it a bolt
 * moved off a regular circular pattern (no shared fraction any more) cost 96 × 1920 region tests.
 */
const fractionMemo = new Map<string, number>();
const MEMO_LIMIT = 8192;
const regionKeys = new WeakMap<GasketRegion, string>();

function regionKey(region: GasketRegion): string {
  let k = regionKeys.get(region);
  if (k === undefined) {
    k = JSON.stringify([
      region.kind,
      region.innerRadiusMm,
      region.outerRadiusMm,
      region.bandCentreOffsetMm,
      region.bandWidthMm,
      region.outline,
      region.bore,
      region.holeRadiusMm,
    ]);
    regionKeys.set(region, k);
  }
  return k;
}

function memoClippedFraction(
  region: GasketRegion,
  x: number,
  y: number,
  ri: number,
  rc: number,
  hash: PointHash,
  self: number,
  shape: FootprintShape,
): number {
  let key = `${regionKey(region)}|${x}|${y}|${ri}|${rc}|${shape.a}|${shape.b}`;
  // Full-face regions exclude bolt holes: any hole within rc + hole radius can change the result.
  if (region.kind === "full-face")
    forEachNear(hash, x, y, rc + region.holeRadiusMm, (j) => {
      if (j !== self) key += `|${hash.xs[j]},${hash.ys[j]}`;
    });
  const hit = fractionMemo.get(key);
  if (hit !== undefined) return hit;
  const v = clippedFraction(region, x, y, ri, rc, shape);
  if (fractionMemo.size >= MEMO_LIMIT) fractionMemo.clear();
  fractionMemo.set(key, v);
  return v;
}

/**
 * Prepares the superposition for given bolt forces. Regular circular patterns reuse one
 * clipping integral for every bolt (`regular`).
 */
export function buildConeField(
  region: GasketRegion,
  forcesN: ArrayLike<number>,
  innerRadiusMm: number,
  outerRadiusMm: number,
  regular: boolean,
  shape: FootprintShape = LINEAR_SHAPE,
): ConeField {
  const rc = Math.max(outerRadiusMm, innerRadiusMm * 1.0001 + 1e-6);
  const n = region.bolts.length;
  const hash = buildPointHash(
    region.bolts.map((p) => p.x),
    region.bolts.map((p) => p.y),
    rc + region.holeRadiusMm,
  );
  const full = footprintIntegralOf(innerRadiusMm, rc, shape);
  const peak = new Float64Array(n);
  const frac = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = region.bolts[i];
    if (regular && i > 0) frac[i] = frac[0];
    else {
      const q = quickFraction(region, p.x, p.y, innerRadiusMm, rc, hash, i);
      frac[i] = q >= 0 ? q : memoClippedFraction(region, p.x, p.y, innerRadiusMm, rc, hash, i, shape);
    }
    peak[i] = frac[i] > 1e-9 ? forcesN[i] / (full * frac[i]) : 0;
  }
  return {
    innerRadiusMm,
    outerRadiusMm: rc,
    peakMpa: peak,
    shape,
    shapeTable: shapeTableOf(shape),
    onGasketFraction: frac,
    hash,
  };
}

/** Superposed cone pressure at (x, y), MPa (the caller decides whether the point is on gasket). */
export function conePressureAtMpa(field: ConeField, x: number, y: number): number {
  const ri = field.innerRadiusMm;
  const rc = field.outerRadiusMm;
  const h = field.hash;
  const cand = candidatesFor(h.items.length);
  const count = listNeighbours(h, Math.floor((x - h.x0) / h.cellMm), Math.floor((y - h.y0) / h.cellMm), cand);
  return sumFootprints(field, cand, count, x, y, ri, SHAPE_STEPS / (rc - ri), rc * rc, ri * ri);
}

/**
 * `out[j] = conePressureAtMpa(field, xs[j], ys[j])` where `on[j]` is 1 (left as it is elsewhere).
 * Neighbouring path samples mostly fall in the same hash cell, so the bolts of its 3 × 3 cells are
 * listed once per cell (the same list in the same order: the same sum, the same bits).
 */
export function conePressuresInto(
  field: ConeField,
  px: Float64Array,
  py: Float64Array,
  on: Uint8Array,
  out: Float64Array,
): void {
  const ri = field.innerRadiusMm;
  const rc = field.outerRadiusMm;
  const steps = SHAPE_STEPS / (rc - ri);
  const rc2 = rc * rc;
  const ri2 = ri * ri;
  const h = field.hash;
  const cand = candidatesFor(h.items.length);
  let count = 0;
  let lastCx = NaN;
  let lastCy = NaN;
  for (let j = 0; j < px.length; j++) {
    if (!on[j]) continue;
    const x = px[j];
    const y = py[j];
    const cx = Math.floor((x - h.x0) / h.cellMm);
    const cy = Math.floor((y - h.y0) / h.cellMm);
    if (cx !== lastCx || cy !== lastCy) {
      lastCx = cx;
      lastCy = cy;
      count = listNeighbours(h, cx, cy, cand);
    }
    out[j] = sumFootprints(field, cand, count, x, y, ri, steps, rc2, ri2);
  }
}

/** Scratch list of candidate bolts (grown, never shrunk): no allocation per point. */
let candidates = new Int32Array(64);
function candidatesFor(n: number): Int32Array {
  if (candidates.length < n) candidates = new Int32Array(n);
  return candidates;
}

/** The bolts of the 3 × 3 cells around cell (cx, cy), row by row, into `cand`; returns their count. */
function listNeighbours(h: PointHash, cx: number, cy: number, cand: Int32Array): number {
  const nx = h.nx;
  const x0 = cx > 0 ? cx - 1 : 0,
    x1 = cx + 1 < nx ? cx + 1 : nx - 1;
  const y0 = cy > 0 ? cy - 1 : 0,
    y1 = cy + 1 < h.ny ? cy + 1 : h.ny - 1;
  let count = 0;
  for (let iy = y0; iy <= y1; iy++) {
    const row = iy * nx;
    for (let ix = x0; ix <= x1; ix++) {
      const end = h.cellStart[row + ix + 1];
      for (let k = h.cellStart[row + ix]; k < end; k++) cand[count++] = h.items[k];
    }
  }
  return count;
}

/** Σ over the listed bolts whose footprint covers (x, y) of peak × shape, in list order. */
function sumFootprints(
  field: ConeField,
  cand: Int32Array,
  count: number,
  x: number,
  y: number,
  ri: number,
  steps: number,
  rc2: number,
  ri2: number,
): number {
  const table = field.shapeTable;
  const peak = field.peakMpa;
  const xs = field.hash.xs;
  const ys = field.hash.ys;
  let p = 0;
  for (let k = 0; k < count; k++) {
    const i = cand[k];
    const ex = xs[i] - x;
    const ey = ys[i] - y;
    const d2 = ex * ex + ey * ey;
    if (d2 < rc2 && d2 >= ri2) {
      const u = (Math.sqrt(d2) - ri) * steps;
      const t = u | 0;
      const f = u - t;
      p += peak[i] * (table[t] * (1 - f) + table[t + 1] * f);
    }
  }
  return p;
}

/** True when no bolt's footprint touches gasket material (the estimate is then not applicable). */
export function coneMissesGasket(field: ConeField): boolean {
  for (let i = 0; i < field.onGasketFraction.length; i++) if (field.onGasketFraction[i] > 1e-9) return false;
  return true;
}
