import type { JointDesign } from "@/features/analysis/core/design";

/** Removes bolts by id. The last bolt cannot be removed (a joint needs at least one). */
export function deleteBolts(design: JointDesign, boltIds: readonly string[]): JointDesign {
  const drop = new Set(boltIds);
  const bolts = design.bolts.filter((b) => !drop.has(b.id));
  if (bolts.length === design.bolts.length || bolts.length === 0) return design;
  return { ...design, bolts };
}
