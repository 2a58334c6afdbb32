import type { JointDesign } from "@/features/analysis/core/design";
import { MAX_BOLT_COUNT } from "@/features/analysis/core/design";
import { getDesignBoltPath, nextBoltId, wrapArc } from "./bolt-path";

/** Adds a bolt on the path at arc position s (double-click on the path). Returns the new id too. */
export function addBolt(design: JointDesign, sMm: number): { design: JointDesign; boltId: string | null } {
  if (!Number.isFinite(sMm) || design.bolts.length >= MAX_BOLT_COUNT) return { design, boltId: null };
  const L = getDesignBoltPath(design).lengthMm;
  const id = nextBoltId(design);
  return { design: { ...design, bolts: [...design.bolts, { id, sMm: wrapArc(sMm, L) }] }, boltId: id };
}
