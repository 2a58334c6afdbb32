/**
 * The drawable geometry of a design in model coordinates (mm, y up): outline, bore, gasket
 * edges, bolt path, bolt centres and the pitch label positions. Pure; the Konva tree only draws it.
 */
import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import {
  getBoltPoint,
  getNeighbourSpacings,
  outlineToPolyline,
  pointAtArcLength,
} from "@/features/analysis/core/geometry";
import { pathToPolyline, shapeToPath, type ClosedPath } from "@/features/analysis/core/path";
import { offsetShape, outlineToShape, shapeBounds } from "@/features/analysis/core/shape";
import { getDesignBoltPath, wrapArc } from "./bolt-path";
import type { Bounds } from "./view-transform";

export interface PitchLabel {
  fromId: string;
  toId: string;
  pitchMm: number;
  chordMm: number;
  at: PointMm;
}

export interface CanvasScene {
  outline: PointMm[];
  bore: PointMm[] | null;
  /** Gasket edges (closed polylines); a full-face gasket uses the outline and bore. */
  gasketOuter: PointMm[];
  gasketInner: PointMm[] | null;
  boltPath: ClosedPath;
  boltPathLine: PointMm[];
  bolts: { id: string; p: PointMm; offPath: boolean }[];
  holeRadiusMm: number;
  pitches: PitchLabel[];
  bounds: Bounds;
}

function circle(r: number): PointMm[] {
  return pathToPolyline(
    shapeToPath({ kind: "rounded-rect", halfWidthMm: r, halfHeightMm: r, radiusMm: r }),
    Math.max(0.5, r / 90),
  );
}

/** Geometry that does not change while bolts move (memoise on outline, bore, gasket, path). */
export function buildStaticScene(
  design: Pick<JointDesign, "outline" | "bore" | "gasket" | "boltPath">,
): Omit<CanvasScene, "bolts" | "pitches" | "holeRadiusMm"> {
  const shape = outlineToShape(design.outline);
  const bounds = shapeBounds(shape);
  const step = Math.max(0.5, Math.max(bounds.xMaxMm - bounds.xMinMm, bounds.yMaxMm - bounds.yMinMm) / 600);
  const outline = outlineToPolyline(design.outline, step);
  const bore = design.bore ? outlineToPolyline(design.bore, step) : null;
  let gasketOuter = outline;
  let gasketInner = bore;
  const g = design.gasket;
  if (g.kind === "ring" && g.geometry.kind === "annulus") {
    gasketOuter = circle(g.geometry.outerDiameterMm / 2);
    gasketInner = circle(g.geometry.innerDiameterMm / 2);
  } else if (g.kind === "ring" && g.geometry.kind === "band") {
    const { centreOffsetMm: c, widthMm: w } = g.geometry;
    gasketOuter = pathToPolyline(shapeToPath(offsetShape(shape, c - w / 2)), step);
    gasketInner = pathToPolyline(shapeToPath(offsetShape(shape, c + w / 2)), step);
  }
  const boltPath = getDesignBoltPath(design);
  return {
    outline,
    bore,
    gasketOuter,
    gasketInner,
    boltPath,
    boltPathLine: pathToPolyline(boltPath, step),
    bounds,
  };
}

/** Bolt centres and pitch labels (recomputed on every move). */
export function buildBoltScene(design: JointDesign, boltPath: ClosedPath) {
  const bolts = design.bolts.map((b) => ({
    id: b.id,
    p: getBoltPoint(boltPath, b),
    offPath: (b.offPathMm ?? 0) !== 0,
  }));
  const L = boltPath.lengthMm;
  const byId = new Map(design.bolts.map((b) => [b.id, b]));
  const pitches: PitchLabel[] = getNeighbourSpacings(design).map((s) => {
    const a = wrapArc(byId.get(s.fromId)!.sMm, L);
    const q = pointAtArcLength(boltPath, a + s.pitchMm / 2);
    return { ...s, at: { x: q.x, y: q.y } };
  });
  return { bolts, pitches, holeRadiusMm: design.fastener.holeDiameterMm / 2 };
}
