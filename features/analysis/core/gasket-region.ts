/**
 * The gasket as a plane region and the path along which its stress is reported:
 * - ring annulus: the mean-diameter circle; ring band: its centre line;
 * - full face: the bolt path (where neighbouring bolts' load must overlap to seal).
 * Also the beam strip width used by the flange-on-foundation estimate. Lengths in mm.
 */
import type { JointDesign, PointMm } from "./design";
import { getBoltPath, getBoltPoint } from "./geometry";
import { shapeToPath, type ClosedPath } from "./path";
import { buildPointHash, hasPointNear, type PointHash } from "./point-hash";
import {
  outlineToShape,
  offsetShape,
  shapeAreaMm2,
  shapeBounds,
  signedDistanceToShape,
  type Shape,
} from "./shape";
import { pointAtArcLength } from "./path";

export interface GasketRegion {
  kind: "annulus" | "band" | "full-face";
  outline: Shape;
  bore: Shape | null;
  /** annulus radii (annulus only). */
  innerRadiusMm: number;
  outerRadiusMm: number;
  /** band: region is −(c + w/2) ≤ sdf(outline) ≤ −(c − w/2). */
  bandCentreOffsetMm: number;
  bandWidthMm: number;
  bolts: PointMm[];
  holeRadiusMm: number;
  holeHash: PointHash;
  /** Path along which the stress profile is reported. */
  path: ClosedPath;
  /** Gasket width carried by one unit of path length (foundation width of the beam), mm. */
  foundationWidthMm: number;
  /** Width of the flange strip that bends as a beam along the path, mm. */
  stripWidthMm: number;
  areaMm2: number;
  bounds: { xMinMm: number; xMaxMm: number; yMinMm: number; yMaxMm: number };
}

/**
 * True when the point lies on gasket material (inside the gasket, outside bore and bolt holes).
 * Ring gaskets need no hole test: validation guarantees that no bolt hole overlaps them.
 */
export function isOnGasket(region: GasketRegion, x: number, y: number): boolean {
  if (region.kind === "annulus") {
    const r2 = x * x + y * y;
    return (
      r2 >= region.innerRadiusMm * region.innerRadiusMm && r2 <= region.outerRadiusMm * region.outerRadiusMm
    );
  }
  if (region.kind === "band") {
    const d = -signedDistanceToShape(region.outline, x, y);
    return Math.abs(d - region.bandCentreOffsetMm) <= region.bandWidthMm / 2;
  }
  if (signedDistanceToShape(region.outline, x, y) > 0) return false;
  if (region.bore && signedDistanceToShape(region.bore, x, y) < 0) return false;
  return !hasPointNear(region.holeHash, x, y, region.holeRadiusMm);
}

function meanDistance(path: ClosedPath, f: (p: PointMm) => number): number {
  const n = 64;
  let acc = 0;
  for (let i = 0; i < n; i++) acc += f(pointAtArcLength(path, ((i + 0.5) * path.lengthMm) / n));
  return acc / n;
}

/** Builds the gasket region of a (validated) design. */
export function buildGasketRegion(design: JointDesign): GasketRegion {
  const outline = outlineToShape(design.outline);
  const bore = design.bore ? outlineToShape(design.bore) : null;
  const boltPath = getBoltPath(design.outline, design.boltPath);
  const bolts = design.bolts.map((b) => getBoltPoint(boltPath, b));
  const holeRadiusMm = design.fastener.holeDiameterMm / 2;
  const holeHash = buildPointHash(
    bolts.map((p) => p.x),
    bolts.map((p) => p.y),
    Math.max(holeRadiusMm * 2, 1),
  );
  const g = design.gasket;
  let kind: GasketRegion["kind"] = "full-face";
  let inner = 0,
    outer = 0,
    c = 0,
    w = 0;
  let path: ClosedPath = boltPath;
  let areaMm2: number;
  let bounds = shapeBounds(outline);
  if (g.kind === "ring" && g.geometry.kind === "annulus") {
    kind = "annulus";
    inner = g.geometry.innerDiameterMm / 2;
    outer = g.geometry.outerDiameterMm / 2;
    const rm = (inner + outer) / 2;
    path = shapeToPath({ kind: "rounded-rect", halfWidthMm: rm, halfHeightMm: rm, radiusMm: rm });
    areaMm2 = Math.PI * (outer * outer - inner * inner);
    bounds = { xMinMm: -outer, xMaxMm: outer, yMinMm: -outer, yMaxMm: outer };
  } else if (g.kind === "ring" && g.geometry.kind === "band") {
    kind = "band";
    c = g.geometry.centreOffsetMm;
    w = g.geometry.widthMm;
    path = shapeToPath(offsetShape(outline, c));
    const outerShape = offsetShape(outline, c - w / 2);
    areaMm2 = shapeAreaMm2(outerShape) - shapeAreaMm2(offsetShape(outline, c + w / 2));
    bounds = shapeBounds(outerShape);
  } else {
    areaMm2 =
      shapeAreaMm2(outline) -
      (bore ? shapeAreaMm2(bore) : 0) -
      bolts.length * Math.PI * holeRadiusMm * holeRadiusMm;
  }
  // Strip that bends along the path: from the outline edge to the bore edge (or, with no bore,
  // as far again inward as the outline is outward: a [practice] choice for blind covers).
  const dOut = meanDistance(path, (p) => -signedDistanceToShape(outline, p.x, p.y));
  const dIn = bore ? meanDistance(path, (p) => signedDistanceToShape(bore, p.x, p.y)) : dOut;
  const stripWidthMm = Math.max(dOut + dIn, 1e-3);
  const foundationWidthMm = kind === "annulus" ? outer - inner : kind === "band" ? w : stripWidthMm;
  return {
    kind,
    outline,
    bore,
    innerRadiusMm: inner,
    outerRadiusMm: outer,
    bandCentreOffsetMm: c,
    bandWidthMm: w,
    bolts,
    holeRadiusMm,
    holeHash,
    path,
    foundationWidthMm,
    stripWidthMm,
    areaMm2,
    bounds,
  };
}
