import type { JointDesign } from "@/features/analysis/core/design";
import { MAX_BOLT_COUNT } from "@/features/analysis/core/design";
import { placeBoltsEqually as corePlace } from "@/features/analysis/core/geometry";
import { getDesignBoltPath, wrapArc } from "./bolt-path";

export interface PlaceEquallyOptions {
  /**
   * Where the first bolt sits, as a fraction of one pitch clockwise from the top centre line.
   * 0.5 (the default) straddles the centre lines; 0 puts a bolt on them.
   */
  phase?: number;
}

/**
 * Replaces every bolt by `count` bolts at equal pitch along the bolt path (ids b1…bn, clockwise
 * from the top). Off-path offsets are dropped. A count outside 1…MAX_BOLT_COUNT changes nothing.
 */
export function placeBoltsEqually(
  design: JointDesign,
  count: number,
  options: PlaceEquallyOptions = {},
): JointDesign {
  if (!Number.isInteger(count) || count < 1 || count > MAX_BOLT_COUNT) return design;
  const L = getDesignBoltPath(design).lengthMm;
  if (!(L > 0)) return design;
  const phase = options.phase ?? 0.5;
  const shift = (phase - 0.5) * (L / count);
  const bolts = corePlace(L, count).map((b) => ({ id: b.id, sMm: wrapArc(b.sMm + shift, L) }));
  return { ...design, bolts };
}
