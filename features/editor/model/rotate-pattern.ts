import type { JointDesign } from "@/features/analysis/core/design";
import { getDesignBoltPath, wrapArc } from "./bolt-path";

/**
 * Turns the whole pattern along the bolt path by `deltaMm` of arc (clockwise positive).
 * On a circular path this is a rotation by deltaMm / r radians; on other paths every bolt keeps
 * its pitch to its neighbours, which is what a designer means by "rotate" on a cover.
 */
export function rotatePattern(design: JointDesign, deltaMm: number): JointDesign {
  if (!Number.isFinite(deltaMm) || deltaMm === 0) return design;
  const L = getDesignBoltPath(design).lengthMm;
  return { ...design, bolts: design.bolts.map((b) => ({ ...b, sMm: wrapArc(b.sMm + deltaMm, L) })) };
}

/** Arc length that corresponds to `degrees` of turn, using the path's mean radius L / 2π. */
export function degreesToArcMm(design: JointDesign, degrees: number): number {
  const L = getDesignBoltPath(design).lengthMm;
  return (degrees / 360) * L;
}
