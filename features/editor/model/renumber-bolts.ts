import type { JointDesign } from "@/features/analysis/core/design";
import { getDesignBoltPath, wrapArc } from "./bolt-path";

/**
 * Renames the bolts b1…bn clockwise from the top centre line, and orders the list the same way.
 * `idMap` says what each old id became (so the canvas can keep its selection).
 */
export function renumberBolts(design: JointDesign): { design: JointDesign; idMap: Record<string, string> } {
  const L = getDesignBoltPath(design).lengthMm;
  const sorted = design.bolts
    .map((b, index) => ({ b, index, s: wrapArc(b.sMm, L) }))
    .sort((a, c) => a.s - c.s || a.index - c.index);
  const idMap: Record<string, string> = {};
  let changed = false;
  const bolts = sorted.map(({ b }, i) => {
    const id = `b${i + 1}`;
    idMap[b.id] = id;
    if (id !== b.id || design.bolts[i] !== b) changed = true;
    return { ...b, id };
  });
  return { design: changed ? { ...design, bolts } : design, idMap };
}
