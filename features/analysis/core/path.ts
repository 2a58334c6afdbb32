/**
 * Closed paths made of lines and clockwise arcs, parameterised exactly by arc length s (mm),
 * with s = 0 at the top centre line and s increasing clockwise (y up). Used for bolt paths and
 * gasket centre lines.
 */
import type { PointMm } from "./design";
import { shapeBounds, type Shape } from "./shape";
import * as fm from "./fixed-math";

export type PathSegment =
  | { kind: "line"; x0: number; y0: number; x1: number; y1: number; lengthMm: number }
  /** `sweepRad` is negative (clockwise). */
  | {
      kind: "arc";
      cx: number;
      cy: number;
      radiusMm: number;
      startRad: number;
      sweepRad: number;
      lengthMm: number;
    };

export interface ClosedPath {
  segments: PathSegment[];
  /** Arc length at the start of each segment, measured from the first segment's start. */
  segmentStartMm: number[];
  lengthMm: number;
  /** s (from the top centre) = internal arc length − shiftMm. */
  shiftMm: number;
}

export interface PathPoint {
  x: number;
  y: number;
  /** Unit tangent in the direction of increasing s. */
  tx: number;
  ty: number;
}

const EPS = 1e-9;
/** Scratch for fm.sinCosInto (sin, cos of one angle). */
const sinCos = new Float64Array(2);

function line(x0: number, y0: number, x1: number, y1: number): PathSegment {
  return { kind: "line", x0, y0, x1, y1, lengthMm: Math.hypot(x1 - x0, y1 - y0) };
}

function arc(cx: number, cy: number, r: number, startRad: number, sweepRad: number): PathSegment {
  return { kind: "arc", cx, cy, radiusMm: r, startRad, sweepRad, lengthMm: Math.abs(sweepRad) * r };
}

/** Builds the closed boundary path of a shape. Example: a 100 mm circle → length 314.16 mm. */
export function shapeToPath(shape: Shape): ClosedPath {
  const segs: PathSegment[] = [];
  if (shape.kind === "rounded-rect") {
    const hw = shape.halfWidthMm;
    const hh = shape.halfHeightMm;
    const r = shape.radiusMm;
    const q = -Math.PI / 2;
    segs.push(line(0, hh, hw - r, hh));
    if (r > 0) segs.push(arc(hw - r, hh - r, r, Math.PI / 2, q));
    segs.push(line(hw, hh - r, hw, -hh + r));
    if (r > 0) segs.push(arc(hw - r, -hh + r, r, 0, q));
    segs.push(line(hw - r, -hh, -hw + r, -hh));
    if (r > 0) segs.push(arc(-hw + r, -hh + r, r, -Math.PI / 2, q));
    segs.push(line(-hw, -hh + r, -hw, hh - r));
    if (r > 0) segs.push(arc(-hw + r, hh - r, r, Math.PI, q));
    segs.push(line(-hw + r, hh, 0, hh));
    return finish(
      segs.filter((s) => s.lengthMm > EPS),
      0,
    );
  }
  const pts = shape.points;
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i];
    const b = pts[(i + 1) % pts.length];
    segs.push(line(a.x, a.y, b.x, b.y));
  }
  const path = finish(
    segs.filter((s) => s.lengthMm > EPS),
    0,
  );
  // s = 0 at the topmost point nearest the vertical centre line of the bounding box.
  const bb = shapeBounds(shape);
  const cx = (bb.xMinMm + bb.xMaxMm) / 2;
  const far = { x: cx, y: bb.yMaxMm + 1e6 * Math.max(1, bb.yMaxMm - bb.yMinMm) };
  const u = projectInternal(path, far).uMm;
  return { ...path, shiftMm: u };
}

function finish(segments: PathSegment[], shiftMm: number): ClosedPath {
  const starts: number[] = [];
  let acc = 0;
  for (const s of segments) {
    starts.push(acc);
    acc += s.lengthMm;
  }
  return { segments, segmentStartMm: starts, lengthMm: acc, shiftMm };
}

function wrap(u: number, length: number): number {
  const w = u % length;
  return w < 0 ? w + length : w;
}

function segmentIndexAt(path: ClosedPath, u: number): number {
  const st = path.segmentStartMm;
  let lo = 0;
  let hi = st.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (st[mid] <= u) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Point and unit tangent at arc length s from the top centre (wraps around). */
export function pointAtArcLength(path: ClosedPath, sMm: number): PathPoint {
  const u = wrap(sMm + path.shiftMm, path.lengthMm);
  const i = segmentIndexAt(path, u);
  const seg = path.segments[i];
  const local = u - path.segmentStartMm[i];
  if (seg.kind === "line") {
    const t = seg.lengthMm > 0 ? local / seg.lengthMm : 0;
    const tx = (seg.x1 - seg.x0) / (seg.lengthMm || 1);
    const ty = (seg.y1 - seg.y0) / (seg.lengthMm || 1);
    return { x: seg.x0 + (seg.x1 - seg.x0) * t, y: seg.y0 + (seg.y1 - seg.y0) * t, tx, ty };
  }
  const a = seg.startRad + Math.sign(seg.sweepRad) * (local / seg.radiusMm);
  fm.sinCosInto(a, sinCos);
  const c = sinCos[1];
  const s = sinCos[0];
  const dir = Math.sign(seg.sweepRad);
  return { x: seg.cx + seg.radiusMm * c, y: seg.cy + seg.radiusMm * s, tx: -s * dir, ty: c * dir };
}

function projectInternal(path: ClosedPath, p: PointMm): { uMm: number; dist2: number } {
  let bestU = 0;
  let best = Infinity;
  for (let i = 0; i < path.segments.length; i++) {
    const seg = path.segments[i];
    let local: number;
    let qx: number;
    let qy: number;
    if (seg.kind === "line") {
      const dx = seg.x1 - seg.x0;
      const dy = seg.y1 - seg.y0;
      const len2 = dx * dx + dy * dy || 1;
      let t = ((p.x - seg.x0) * dx + (p.y - seg.y0) * dy) / len2;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
      qx = seg.x0 + t * dx;
      qy = seg.y0 + t * dy;
      local = t * seg.lengthMm;
    } else {
      const phi = fm.atan2(p.y - seg.cy, p.x - seg.cx);
      const sweep = Math.abs(seg.sweepRad);
      const dir = Math.sign(seg.sweepRad);
      let delta = wrap(dir < 0 ? seg.startRad - phi : phi - seg.startRad, 2 * Math.PI);
      if (delta > sweep) delta = delta - sweep < 2 * Math.PI - delta ? sweep : 0;
      const a = seg.startRad + dir * delta;
      fm.sinCosInto(a, sinCos);
      qx = seg.cx + seg.radiusMm * sinCos[1];
      qy = seg.cy + seg.radiusMm * sinCos[0];
      local = delta * seg.radiusMm;
    }
    const d2 = (p.x - qx) * (p.x - qx) + (p.y - qy) * (p.y - qy);
    if (d2 < best) {
      best = d2;
      bestU = path.segmentStartMm[i] + local;
    }
  }
  return { uMm: bestU, dist2: best };
}

/**
 * Nearest point of the path to p: its arc length s and the signed distance (positive outward,
 * i.e. to the left of the clockwise direction of travel). Used when a bolt is dragged.
 * Example: circle of 200 mm, p = (0, 110) → s = 0, offset = +10.
 */
export function projectOntoPath(
  path: ClosedPath,
  p: PointMm,
): { sMm: number; offPathMm: number; x: number; y: number } {
  const { uMm } = projectInternal(path, p);
  const sMm = wrap(uMm - path.shiftMm, path.lengthMm);
  const q = pointAtArcLength(path, sMm);
  const offPathMm = (p.x - q.x) * -q.ty + (p.y - q.y) * q.tx;
  return { sMm, offPathMm, x: q.x, y: q.y };
}

/** Polyline of the path for drawing, starting at s = 0, with at most `maxStepMm` between points. */
export function pathToPolyline(path: ClosedPath, maxStepMm = 2): PointMm[] {
  const n = Math.max(8, Math.ceil(path.lengthMm / Math.max(maxStepMm, 1e-3)));
  const out: PointMm[] = [];
  for (let i = 0; i < n; i++) {
    const q = pointAtArcLength(path, (i * path.lengthMm) / n);
    out.push({ x: q.x, y: q.y });
  }
  return out;
}

/** Fills xs/ys with N points at s = j·L/N (j = 0…N−1), walking the segments once (no search). */
export function samplePathUniform(path: ClosedPath, count: number, xs: Float64Array, ys: Float64Array): void {
  const L = path.lengthMm;
  const step = L / count;
  let seg = segmentIndexAt(path, wrap(path.shiftMm, L));
  for (let j = 0; j < count; j++) {
    const v = j * step + path.shiftMm;
    // wrap() leaves u in [0, L) unchanged; the remainder is only needed past the end.
    const u = v >= 0 && v < L ? v : wrap(v, L);
    // advance (with wrap-around) until u lies in the current segment
    let guard = 0;
    while (
      guard++ <= path.segments.length &&
      !(u >= path.segmentStartMm[seg] && u < path.segmentStartMm[seg] + path.segments[seg].lengthMm + 1e-12)
    ) {
      seg = (seg + 1) % path.segments.length;
    }
    const s = path.segments[seg];
    const local = u - path.segmentStartMm[seg];
    if (s.kind === "line") {
      const t = s.lengthMm > 0 ? local / s.lengthMm : 0;
      xs[j] = s.x0 + (s.x1 - s.x0) * t;
      ys[j] = s.y0 + (s.y1 - s.y0) * t;
    } else {
      const a = s.startRad + Math.sign(s.sweepRad) * (local / s.radiusMm);
      fm.sinCosInto(a, sinCos);
      xs[j] = s.cx + s.radiusMm * sinCos[1];
      ys[j] = s.cy + s.radiusMm * sinCos[0];
    }
  }
}
