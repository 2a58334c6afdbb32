/**
 * Fits the design's bolt path through imported hole centres (mm, origin at the flange centre).
 *
 * The rule we chose:
 * - Circular pattern: a least-squares circle through the centres (Kåsa fit). If its centre is
 *   within 0.05 mm of the origin and no centre is more than max(0.05 mm, 0.1 % of R) off it, the
 *   path is a circle on the origin of diameter 2R.
 * - Otherwise the path is the outline offset inward by the mean distance of the centres from the
 *   outline (for a cover with bolts at a constant edge distance that is that distance).
 * Either way every bolt keeps its exact drawn position: s is the projection of its centre onto
 * the path and the residual becomes `offPathMm`, so no hole moves by importing.
 */
import type { BoltPath, BoltPlacement, Outline, PointMm } from "@/features/analysis/core/design";
import { getBoltPath, getSignedDistanceToOutline, projectOntoPath } from "@/features/analysis/core/geometry";

export interface CircleFit {
  cx: number;
  cy: number;
  r: number;
  maxResidualMm: number;
}

/** Algebraic least-squares circle (solves x² + y² + Dx + Ey + F = 0). Example: the 4 corners of a 2×2 square → centre (0,0), r = √2. */
export function fitCircle(points: PointMm[]): CircleFit | null {
  if (points.length < 3) return null;
  let sx = 0,
    sy = 0,
    sxx = 0,
    syy = 0,
    sxy = 0,
    sxz = 0,
    syz = 0,
    sz = 0;
  const n = points.length;
  for (const { x, y } of points) {
    const z = x * x + y * y;
    sx += x;
    sy += y;
    sxx += x * x;
    syy += y * y;
    sxy += x * y;
    sxz += x * z;
    syz += y * z;
    sz += z;
  }
  // Normal equations [sxx sxy sx; sxy syy sy; sx sy n]·[D E F] = −[sxz syz sz].
  const m = [
    [sxx, sxy, sx, -sxz],
    [sxy, syy, sy, -syz],
    [sx, sy, n, -sz],
  ];
  for (let c = 0; c < 3; c++) {
    let p = c;
    for (let r = c + 1; r < 3; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (Math.abs(m[p][c]) < 1e-12) return null; // collinear points
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = 0; r < 3; r++) {
      if (r === c) continue;
      const f = m[r][c] / m[c][c];
      for (let k = c; k < 4; k++) m[r][k] -= f * m[c][k];
    }
  }
  const D = m[0][3] / m[0][0];
  const E = m[1][3] / m[1][1];
  const F = m[2][3] / m[2][2];
  const cx = -D / 2;
  const cy = -E / 2;
  const r = Math.sqrt(cx * cx + cy * cy - F);
  if (!Number.isFinite(r)) return null;
  const maxResidualMm = Math.max(...points.map((p) => Math.abs(Math.hypot(p.x - cx, p.y - cy) - r)));
  return { cx, cy, r, maxResidualMm };
}

export interface FittedBolts {
  boltPath: BoltPath;
  bolts: BoltPlacement[];
  rule: "circle-fit" | "outline-offset";
  /** Largest distance of a centre from the fitted path, mm (kept as offPathMm). */
  maxOffPathMm: number;
}

export function fitBoltPath(outline: Outline, centres: PointMm[]): FittedBolts {
  const fit = fitCircle(centres);
  let boltPath: BoltPath;
  let rule: FittedBolts["rule"];
  if (fit && Math.hypot(fit.cx, fit.cy) <= 0.05 && fit.maxResidualMm <= Math.max(0.05, 1e-3 * fit.r)) {
    boltPath = { kind: "circle", diameterMm: 2 * fit.r };
    rule = "circle-fit";
  } else {
    const mean = centres.reduce((a, p) => a - getSignedDistanceToOutline(outline, p), 0) / centres.length;
    boltPath = { kind: "offset", offsetMm: mean };
    rule = "outline-offset";
  }
  const path = getBoltPath(outline, boltPath);
  // Bolts are numbered clockwise from the top centre line, like the editor's own placements.
  const projected = centres.map((p) => projectOntoPath(path, p)).sort((a, b) => a.sMm - b.sMm);
  const bolts = projected.map((p, i) => {
    const off = Math.abs(p.offPathMm) < 1e-9 ? undefined : p.offPathMm;
    return { id: `b${i + 1}`, sMm: p.sMm, ...(off === undefined ? {} : { offPathMm: off }) };
  });
  return { boltPath, bolts, rule, maxOffPathMm: Math.max(0, ...projected.map((p) => Math.abs(p.offPathMm))) };
}
