/**
 * Small helpers over the core's bolt path that every edit needs. Lengths in mm, s clockwise
 * from the top centre line (see features/analysis/core/design.ts).
 */
import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPath, type ClosedPath } from "@/features/analysis/core/geometry";

export function getDesignBoltPath(design: Pick<JointDesign, "outline" | "boltPath">): ClosedPath {
  return getBoltPath(design.outline, design.boltPath);
}

/** Wraps s into [0, L). */
export function wrapArc(sMm: number, lengthMm: number): number {
  if (!(lengthMm > 0)) return sMm;
  const w = sMm % lengthMm;
  return w < 0 ? w + lengthMm : w;
}

/** Lowest free id of the form "b<n>" (ids are stable, so a deleted id is not reused while others exist above it). */
export function nextBoltId(design: Pick<JointDesign, "bolts">): string {
  let max = 0;
  for (const b of design.bolts) {
    const m = /^b(\d+)$/.exec(b.id);
    if (m) max = Math.max(max, Number(m[1]));
  }
  let n = max + 1;
  const taken = new Set(design.bolts.map((b) => b.id));
  while (taken.has(`b${n}`)) n++;
  return `b${n}`;
}
