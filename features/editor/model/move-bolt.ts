import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import { projectOntoPath } from "@/features/analysis/core/geometry";
import { getDesignBoltPath, wrapArc } from "./bolt-path";

export interface MoveOptions {
  /** Free move: keep the point where it was dropped, off the path if need be (Alt/Shift drag). */
  free?: boolean;
  /** Snap distance along the path, mm (the canvas passes a few screen pixels in mm). 0 disables snapping. */
  snapMm?: number;
}

export interface MoveTarget {
  sMm: number;
  offPathMm: number;
  /** The equal-pitch position snapped to, if any. */
  snapped: boolean;
}

/**
 * Where a bolt dragged to `point` ends up. On the path (default) the s is snapped to the
 * nearest equal-pitch position within `snapMm`: the slots of an equal pattern of the current
 * count (straddling the centre lines), or the midpoint between the bolt's two neighbours.
 */
export function resolveMoveTarget(
  design: JointDesign,
  boltId: string,
  point: PointMm,
  options: MoveOptions = {},
): MoveTarget {
  const path = getDesignBoltPath(design);
  const proj = projectOntoPath(path, point);
  if (options.free) return { sMm: proj.sMm, offPathMm: proj.offPathMm, snapped: false };
  const snapMm = options.snapMm ?? 0;
  const s = proj.sMm;
  if (snapMm <= 0) return { sMm: s, offPathMm: 0, snapped: false };
  const L = path.lengthMm;
  const n = design.bolts.length;
  const candidates: number[] = [];
  const pitch = L / n;
  const k = Math.round(s / pitch - 0.5);
  for (const kk of [k - 1, k, k + 1]) candidates.push(wrapArc((kk + 0.5) * pitch, L));
  const mid = neighbourMidpoint(design, boltId, s, L);
  if (mid !== null) candidates.push(mid);
  let best = s;
  let bestD = snapMm;
  for (const c of candidates) {
    const d = Math.abs(wrapArc(c - s + L / 2, L) - L / 2);
    if (d <= bestD) {
      bestD = d;
      best = c;
    }
  }
  return { sMm: best, offPathMm: 0, snapped: best !== s };
}

/** Midpoint between the two bolts that would neighbour a bolt at s (the dragged bolt excluded). */
function neighbourMidpoint(design: JointDesign, boltId: string, s: number, L: number): number | null {
  const others = design.bolts
    .filter((b) => b.id !== boltId)
    .map((b) => wrapArc(b.sMm, L))
    .sort((a, b) => a - b);
  if (others.length < 2) return null;
  const before = others.filter((o) => o <= s);
  const after = others.filter((o) => o > s);
  const prev = before.length > 0 ? before[before.length - 1] : others[others.length - 1] - L;
  const next = after.length > 0 ? after[0] : others[0] + L;
  return wrapArc((prev + next) / 2, L);
}

/** Moves one bolt to an arc position (and off-path distance). Unknown ids change nothing. */
export function moveBolt(
  design: JointDesign,
  boltId: string,
  target: { sMm: number; offPathMm?: number },
): JointDesign {
  const i = design.bolts.findIndex((b) => b.id === boltId);
  if (i < 0 || !Number.isFinite(target.sMm)) return design;
  const L = getDesignBoltPath(design).lengthMm;
  const sMm = wrapArc(target.sMm, L);
  const off = target.offPathMm ?? 0;
  if (!Number.isFinite(off)) return design;
  const cur = design.bolts[i];
  if (cur.sMm === sMm && (cur.offPathMm ?? 0) === off) return design;
  const moved = off === 0 ? { id: cur.id, sMm } : { id: cur.id, sMm, offPathMm: off };
  const bolts = design.bolts.slice();
  bolts[i] = moved;
  return { ...design, bolts };
}

/** Moves a bolt along the path by `deltaMm` (arrow-key nudge), keeping its off-path distance. */
export function nudgeBolt(design: JointDesign, boltId: string, deltaMm: number): JointDesign {
  const b = design.bolts.find((x) => x.id === boltId);
  if (!b) return design;
  return moveBolt(design, boltId, { sMm: b.sMm + deltaMm, offPathMm: b.offPathMm ?? 0 });
}
