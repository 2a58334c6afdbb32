/**
 * Normalised plane shapes behind the outline kinds: every circle, rectangle and obround is a
 * rounded rectangle centred on the origin; anything else is a clockwise polygon. Offsets, signed
 * distances and areas are exact for rounded rectangles (an inward offset of a rounded rectangle is
 * a rounded rectangle with radius max(r − e, 0)) and mitred for polygons. All lengths in mm.
 */
import type { Outline, PointMm } from "./design";

export type Shape =
  | { kind: "rounded-rect"; halfWidthMm: number; halfHeightMm: number; radiusMm: number }
  | { kind: "polygon"; points: PointMm[] };

function signedArea(points: PointMm[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p.x * q.y - q.x * p.y;
  }
  return a / 2;
}

/** Converts a design outline to a shape; polygon points are reordered clockwise (y up). */
export function outlineToShape(outline: Outline): Shape {
  switch (outline.kind) {
    case "circle":
      return {
        kind: "rounded-rect",
        halfWidthMm: outline.diameterMm / 2,
        halfHeightMm: outline.diameterMm / 2,
        radiusMm: outline.diameterMm / 2,
      };
    case "rectangle": {
      const r = Math.min(Math.max(outline.cornerRadiusMm, 0), outline.widthMm / 2, outline.heightMm / 2);
      return {
        kind: "rounded-rect",
        halfWidthMm: outline.widthMm / 2,
        halfHeightMm: outline.heightMm / 2,
        radiusMm: r,
      };
    }
    case "obround":
      return {
        kind: "rounded-rect",
        halfWidthMm: outline.lengthMm / 2,
        halfHeightMm: outline.widthMm / 2,
        radiusMm: Math.min(outline.lengthMm, outline.widthMm) / 2,
      };
    case "polygon": {
      const pts = outline.points.map((p) => ({ x: p.x, y: p.y }));
      return { kind: "polygon", points: signedArea(pts) > 0 ? pts.reverse() : pts };
    }
  }
}

/**
 * Offsets a shape inward by `inwardMm` (negative grows it). Polygons use mitred corners.
 * Example: a 100 mm circle offset inward by 10 mm is an 80 mm circle.
 */
export function offsetShape(shape: Shape, inwardMm: number): Shape {
  if (shape.kind === "rounded-rect") {
    return {
      kind: "rounded-rect",
      halfWidthMm: shape.halfWidthMm - inwardMm,
      halfHeightMm: shape.halfHeightMm - inwardMm,
      radiusMm: Math.max(shape.radiusMm - inwardMm, 0),
    };
  }
  const pts = shape.points;
  const n = pts.length;
  const out: PointMm[] = [];
  for (let i = 0; i < n; i++) {
    const a = pts[(i - 1 + n) % n];
    const b = pts[i];
    const c = pts[(i + 1) % n];
    // Clockwise polygon (y up): the interior lies to the right, normal (dy, −dx)/len.
    const n1 = rightNormal(a, b);
    const n2 = rightNormal(b, c);
    const p1 = { x: a.x + n1.x * inwardMm, y: a.y + n1.y * inwardMm };
    const p2 = { x: b.x + n2.x * inwardMm, y: b.y + n2.y * inwardMm };
    const d1 = { x: b.x - a.x, y: b.y - a.y };
    const d2 = { x: c.x - b.x, y: c.y - b.y };
    const den = d1.x * d2.y - d1.y * d2.x;
    if (Math.abs(den) < 1e-12 * Math.hypot(d1.x, d1.y) * Math.hypot(d2.x, d2.y)) {
      out.push({ x: b.x + n2.x * inwardMm, y: b.y + n2.y * inwardMm });
      continue;
    }
    const t = ((p2.x - p1.x) * d2.y - (p2.y - p1.y) * d2.x) / den;
    out.push({ x: p1.x + d1.x * t, y: p1.y + d1.y * t });
  }
  return { kind: "polygon", points: out };
}

function rightNormal(a: PointMm, b: PointMm): PointMm {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len = Math.hypot(dx, dy) || 1;
  return { x: dy / len, y: -dx / len };
}

/**
 * Signed distance from (x, y) to the shape boundary, mm: negative inside, positive outside.
 * Example: 100 mm circle, point at the origin → −50.
 */
export function signedDistanceToShape(shape: Shape, x: number, y: number): number {
  if (shape.kind === "rounded-rect") {
    const r = shape.radiusMm;
    const qx = Math.abs(x) - (shape.halfWidthMm - r);
    const qy = Math.abs(y) - (shape.halfHeightMm - r);
    const ox = qx > 0 ? qx : 0;
    const oy = qy > 0 ? qy : 0;
    const inside = Math.min(Math.max(qx, qy), 0);
    return Math.sqrt(ox * ox + oy * oy) + inside - r;
  }
  const pts = shape.points;
  let best = Infinity;
  let inside = false;
  for (let i = 0, j = pts.length - 1; i < pts.length; j = i++) {
    const a = pts[j];
    const b = pts[i];
    if (b.y > y !== a.y > y && x < ((a.x - b.x) * (y - b.y)) / (a.y - b.y) + b.x) inside = !inside;
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const len2 = dx * dx + dy * dy || 1;
    let t = ((x - a.x) * dx + (y - a.y) * dy) / len2;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const ex = a.x + t * dx - x;
    const ey = a.y + t * dy - y;
    const d2 = ex * ex + ey * ey;
    if (d2 < best) best = d2;
  }
  const d = Math.sqrt(best);
  return inside ? -d : d;
}

/** Area enclosed by the shape, mm². Example: 100 × 50 rectangle with r = 10 → 5000 − (4 − π)·100. */
export function shapeAreaMm2(shape: Shape): number {
  if (shape.kind === "rounded-rect") {
    const r = shape.radiusMm;
    return 4 * shape.halfWidthMm * shape.halfHeightMm - (4 - Math.PI) * r * r;
  }
  return Math.abs(signedArea(shape.points));
}

/** Axis-aligned bounding box of the shape, mm. */
export function shapeBounds(shape: Shape): {
  xMinMm: number;
  xMaxMm: number;
  yMinMm: number;
  yMaxMm: number;
} {
  if (shape.kind === "rounded-rect") {
    return {
      xMinMm: -shape.halfWidthMm,
      xMaxMm: shape.halfWidthMm,
      yMinMm: -shape.halfHeightMm,
      yMaxMm: shape.halfHeightMm,
    };
  }
  let xMin = Infinity,
    xMax = -Infinity,
    yMin = Infinity,
    yMax = -Infinity;
  for (const p of shape.points) {
    xMin = Math.min(xMin, p.x);
    xMax = Math.max(xMax, p.x);
    yMin = Math.min(yMin, p.y);
    yMax = Math.max(yMax, p.y);
  }
  return { xMinMm: xMin, xMaxMm: xMax, yMinMm: yMin, yMaxMm: yMax };
}
