import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPoint, pointAtArcLength, projectOntoPath } from "@/features/analysis/core/geometry";
import { getDesignBoltPath } from "./bolt-path";
import { moveBolt } from "./move-bolt";

/** What the side panel shows and edits for one bolt: model coordinates, mm and degrees. */
export interface BoltCoordinates {
  xMm: number;
  yMm: number;
  /** Angle clockwise from the top centre line (12 o'clock), degrees in [0, 360). */
  angleDeg: number;
  sMm: number;
  offPathMm: number;
}

export function getBoltCoordinates(design: JointDesign, boltId: string): BoltCoordinates | null {
  const b = design.bolts.find((x) => x.id === boltId);
  if (!b) return null;
  const p = getBoltPoint(getDesignBoltPath(design), b);
  return { xMm: p.x, yMm: p.y, angleDeg: angleOf(p.x, p.y), sMm: b.sMm, offPathMm: b.offPathMm ?? 0 };
}

function angleOf(x: number, y: number): number {
  const a = (Math.atan2(x, y) * 180) / Math.PI;
  return a < 0 ? a + 360 : a;
}

export type CoordinateEdit =
  | { kind: "xy"; xMm: number; yMm: number }
  | { kind: "angle"; angleDeg: number }
  | { kind: "arc"; sMm: number }
  | { kind: "off-path"; offPathMm: number };

/**
 * Applies a typed-in coordinate. x/y keep the point exactly (off the path if it is off);
 * an angle puts the bolt where the ray from the centre at that angle meets the path, keeping its
 * off-path distance; an arc position moves along the path.
 */
export function setBoltCoordinates(design: JointDesign, boltId: string, edit: CoordinateEdit): JointDesign {
  const b = design.bolts.find((x) => x.id === boltId);
  if (!b) return design;
  const path = getDesignBoltPath(design);
  switch (edit.kind) {
    case "xy": {
      if (!Number.isFinite(edit.xMm) || !Number.isFinite(edit.yMm)) return design;
      const r = projectOntoPath(path, { x: edit.xMm, y: edit.yMm });
      return moveBolt(design, boltId, {
        sMm: r.sMm,
        offPathMm: Math.abs(r.offPathMm) < 1e-9 ? 0 : r.offPathMm,
      });
    }
    case "angle": {
      if (!Number.isFinite(edit.angleDeg)) return design;
      return moveBolt(design, boltId, { sMm: arcAtAngle(path, edit.angleDeg), offPathMm: b.offPathMm ?? 0 });
    }
    case "arc":
      return moveBolt(design, boltId, { sMm: edit.sMm, offPathMm: b.offPathMm ?? 0 });
    case "off-path":
      return moveBolt(design, boltId, { sMm: b.sMm, offPathMm: edit.offPathMm });
  }
}

/**
 * Arc position where the ray at `angleDeg` (clockwise from the top) crosses the path. The path is
 * star-shaped about the centre for every outline we offer, so the angle grows monotonically with s
 * and a bisection on s finds it.
 */
function arcAtAngle(path: ReturnType<typeof getDesignBoltPath>, angleDeg: number): number {
  const target = ((angleDeg % 360) + 360) % 360;
  const L = path.lengthMm;
  let lo = 0;
  let hi = L;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    const q = pointAtArcLength(path, mid);
    const a = angleOf(q.x, q.y);
    // Near s = 0 the angle may read just under 360; treat it as 0.
    const aa = mid < L / 2 && a > 270 ? a - 360 : a;
    if (aa < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
