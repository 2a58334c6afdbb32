/**
 * Geometry helpers for the design document and the canvas editor: outline polylines, the bolt
 * path, bolt coordinates, equal placement and neighbour spacing. All lengths in mm, model
 * coordinates (origin at the flange centre, y up), s clockwise from the top centre line.
 */
import type { BoltPath, BoltPlacement, JointDesign, Outline, PointMm } from "./design";
import { pathToPolyline, pointAtArcLength, projectOntoPath, shapeToPath, type ClosedPath } from "./path";
import { offsetShape, outlineToShape, signedDistanceToShape } from "./shape";

export { pointAtArcLength, projectOntoPath, type ClosedPath } from "./path";

/** Polyline of an outline for drawing. Example: `outlineToPolyline({kind:"circle",diameterMm:100}, 1)` → 315 points. */
/** How far the bore's nearest point lies inside the outline, mm (infinite without a bore). */
export function boreDepthBelowOutlineMm(outline: Outline, bore: Outline | null): number {
  if (!bore) return Infinity;
  const shape = outlineToShape(outline);
  return Math.min(...outlineToPolyline(bore).map((p) => -signedDistanceToShape(shape, p.x, p.y)));
}

/**
 * Width of a new band gasket whose outer edge lies `outerEdgeDepthMm` below the outline: the
 * preferred width, narrowed to the face left before the bore (less `gapMm`); the preferred width
 * when not even `minWidthMm` fits, so the validator names the band that reaches over the bore.
 */
export function bandWidthOnFaceMm(
  outline: Outline,
  bore: Outline | null,
  outerEdgeDepthMm: number,
  o: { preferredMm: number; minMm: number; gapMm: number },
): number {
  const room = boreDepthBelowOutlineMm(outline, bore) - o.gapMm - outerEdgeDepthMm;
  return room >= o.minMm ? Math.min(o.preferredMm, room) : o.preferredMm;
}

export function outlineToPolyline(outline: Outline, maxStepMm = 2): PointMm[] {
  const shape = outlineToShape(outline);
  if (shape.kind === "polygon") return shape.points;
  return pathToPolyline(shapeToPath(shape), maxStepMm);
}

/** The bolt path as a closed path: a circle on the origin, or the outline offset inward. */
export function getBoltPath(outline: Outline, boltPath: BoltPath): ClosedPath {
  if (boltPath.kind === "circle") {
    const r = boltPath.diameterMm / 2;
    return shapeToPath({ kind: "rounded-rect", halfWidthMm: r, halfHeightMm: r, radiusMm: r });
  }
  return shapeToPath(offsetShape(outlineToShape(outline), boltPath.offsetMm));
}

/** Length of the bolt path, mm. Example: bolt circle 241.3 mm → 758.1 mm. */
export function getBoltPathLengthMm(design: Pick<JointDesign, "outline" | "boltPath">): number {
  return getBoltPath(design.outline, design.boltPath).lengthMm;
}

/** Coordinates of a placed bolt (its point on the path, moved off the path along the outward normal). */
export function getBoltPoint(path: ClosedPath, bolt: BoltPlacement): PointMm {
  const q = pointAtArcLength(path, bolt.sMm);
  const off = bolt.offPathMm ?? 0;
  return { x: q.x - q.ty * off, y: q.y + q.tx * off };
}

/** Coordinates of all bolts of a design, in the order of `design.bolts`. */
export function getBoltPoints(design: Pick<JointDesign, "outline" | "boltPath" | "bolts">): PointMm[] {
  const path = getBoltPath(design.outline, design.boltPath);
  return design.bolts.map((b) => getBoltPoint(path, b));
}

/**
 * Places n bolts at equal pitch along a path of the given length, straddling the centre lines:
 * the first bolt sits half a pitch clockwise from the top centre line. Ids are "b1" … "bn".
 * Example: n = 4 on a circle → bolts at 45°, 135°, 225°, 315° from the top.
 */
export function placeBoltsEqually(pathLengthMm: number, count: number, idPrefix = "b"): BoltPlacement[] {
  const pitch = pathLengthMm / count;
  return Array.from({ length: count }, (_, i) => ({ id: `${idPrefix}${i + 1}`, sMm: (i + 0.5) * pitch }));
}

export interface NeighbourSpacing {
  fromId: string;
  toId: string;
  /** Along the bolt path, mm (from the first bolt's s to the next, clockwise). */
  pitchMm: number;
  /** Straight-line distance between the bolt centres, mm. */
  chordMm: number;
}

/** Pitch and chord between each bolt and its clockwise neighbour, sorted by s. */
export function getNeighbourSpacings(
  design: Pick<JointDesign, "outline" | "boltPath" | "bolts">,
): NeighbourSpacing[] {
  const path = getBoltPath(design.outline, design.boltPath);
  const L = path.lengthMm;
  const sorted = design.bolts
    .map((b) => ({ b, s: ((b.sMm % L) + L) % L, p: getBoltPoint(path, b) }))
    .sort((a, c) => a.s - c.s);
  if (sorted.length < 2) return [];
  return sorted.map((cur, i) => {
    const next = sorted[(i + 1) % sorted.length];
    let pitch = next.s - cur.s;
    if (i === sorted.length - 1) pitch += L;
    return {
      fromId: cur.b.id,
      toId: next.b.id,
      pitchMm: pitch,
      chordMm: Math.hypot(next.p.x - cur.p.x, next.p.y - cur.p.y),
    };
  });
}

/** Signed distance to the outline boundary, mm (negative inside). */
export function getSignedDistanceToOutline(outline: Outline, p: PointMm): number {
  return signedDistanceToShape(outlineToShape(outline), p.x, p.y);
}

/** True when p lies inside (or on) the outline. */
export function isPointInOutline(outline: Outline, p: PointMm): boolean {
  return getSignedDistanceToOutline(outline, p) <= 0;
}

/** Nearest arc position on the bolt path for a dragged point (s and off-path distance). */
export function snapToBoltPath(
  design: Pick<JointDesign, "outline" | "boltPath">,
  p: PointMm,
): { sMm: number; offPathMm: number } {
  const r = projectOntoPath(getBoltPath(design.outline, design.boltPath), p);
  return { sMm: r.sMm, offPathMm: r.offPathMm };
}
