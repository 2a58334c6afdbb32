import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPath, getBoltPoint } from "@/features/analysis/core/geometry";

/**
 * One row per bolt, shared by the PDF sheet, the hole list (CSV) and the drilling template (DXF)
 * so the three can never disagree. Positions are the stored result's bolt centres when given
 * (`storedPoints`, by id), else the core's own geometry helper applied to the stored document
 * (the code the analysis itself uses). mm from the flange centre, y up.
 */
export interface BoltRow {
  /** 1-based position in the document's bolt list (the number stamped on the sheet). */
  number: number;
  id: string;
  xMm: number;
  yMm: number;
  /** Angle of the bolt centre seen from the flange centre, clockwise from 12 o'clock, 0 ≤ a < 360. */
  angleDeg: number;
  sMm: number;
  /** To the clockwise neighbour along the bolt path / straight line; null with fewer than 2 bolts. */
  nextNumber: number | null;
  pitchToNextMm: number | null;
  chordToNextMm: number | null;
  /** Position in the tightening sequence of the stored result (1 = first), null if it has none. */
  tighteningOrder: number | null;
}

/** Clockwise angle from the top, degrees. Example: (100, 0) → 90; (0, -100) → 180. */
export function clockwiseAngleDeg(xMm: number, yMm: number): number {
  const a = (Math.atan2(xMm, yMm) * 180) / Math.PI;
  const wrapped = a < 0 ? a + 360 : a;
  return wrapped >= 360 ? 0 : wrapped;
}

export function buildBoltRows(
  design: Pick<JointDesign, "outline" | "boltPath" | "bolts">,
  tighteningSequenceIds: readonly string[] = [],
  storedPoints?: ReadonlyMap<string, { xMm: number; yMm: number }>,
): BoltRow[] {
  const path = getBoltPath(design.outline, design.boltPath);
  const L = path.lengthMm;
  const order = new Map<string, number>();
  tighteningSequenceIds.forEach((id, i) => {
    if (!order.has(id)) order.set(id, i + 1);
  });
  const rows: BoltRow[] = design.bolts.map((b, i) => {
    const stored = storedPoints?.get(b.id);
    const p = stored ? { x: stored.xMm, y: stored.yMm } : getBoltPoint(path, b);
    return {
      number: i + 1,
      id: b.id,
      xMm: p.x,
      yMm: p.y,
      angleDeg: clockwiseAngleDeg(p.x, p.y),
      sMm: L > 0 ? ((b.sMm % L) + L) % L : b.sMm,
      nextNumber: null,
      pitchToNextMm: null,
      chordToNextMm: null,
      tighteningOrder: order.get(b.id) ?? null,
    };
  });
  if (rows.length < 2) return rows;
  const byS = [...rows].sort((a, c) => a.sMm - c.sMm || a.number - c.number);
  byS.forEach((cur, i) => {
    const next = byS[(i + 1) % byS.length];
    let pitch = next.sMm - cur.sMm;
    if (i === byS.length - 1) pitch += L;
    cur.nextNumber = next.number;
    cur.pitchToNextMm = pitch;
    cur.chordToNextMm = Math.hypot(next.xMm - cur.xMm, next.yMm - cur.yMm);
  });
  return rows;
}
