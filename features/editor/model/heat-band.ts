/**
 * Quads of the gasket-stress heat map along the gasket path: strips across the gasket width,
 * coloured by the stress there. The core samples 64 points per pitch (6 144 for 96 bolts, far
 * finer than the screen); consecutive samples are merged into at most `maxQuads` strips, each
 * coloured by the lowest stress it covers, so an unseated spot never disappears in the merge.
 * Each strip reaches a quarter of its length into the next one, so no hairline seam shows
 * without stroking. Cheap to rebuild and to draw every drag frame. Model coordinates, mm.
 */
import type { JointDesign } from "@/features/analysis/core/design";
import { buildGasketRegion } from "@/features/analysis/core/gasket-region";
import { pointAtArcLength } from "@/features/analysis/core/path";

export interface HeatQuad {
  x: number[];
  y: number[];
  stressMpa: number;
}

/** Width across the path of the coloured band, mm. */
function bandWidthMm(design: JointDesign, region: ReturnType<typeof buildGasketRegion>): number {
  if (region.kind === "annulus") return region.outerRadiusMm - region.innerRadiusMm;
  if (region.kind === "band") return region.bandWidthMm;
  // Full face: the strip either side of the bolt path where neighbouring bolts must overlap.
  return Math.min(region.stripWidthMm, 3 * design.fastener.holeDiameterMm);
}

/** About 3 px a strip along a 1 500 px path; the settled full-area grid replaces the strip. */
export const MAX_HEAT_QUADS = 512;

/** `factor` scales the stresses (minimum over target preload) without copying the array. */
export function buildHeatQuads(
  design: JointDesign,
  sMm: number[],
  stressMpa: number[],
  factor = 1,
  maxQuads = MAX_HEAT_QUADS,
): HeatQuad[] {
  if (sMm.length < 2) return [];
  const region = buildGasketRegion(design);
  const hw = bandWidthMm(design, region) / 2;
  const L = region.path.lengthMm;
  const quads: HeatQuad[] = [];
  const edge = (s: number) => {
    const q = pointAtArcLength(region.path, s);
    const nx = -q.ty,
      ny = q.tx;
    return { ox: q.x + nx * hw, oy: q.y + ny * hw, ix: q.x - nx * hw, iy: q.y - ny * hw };
  };
  const n = sMm.length;
  // Sample i covers [lo(i), hi(i)]: halfway to its neighbours, wrapping round the closed path.
  const lo = (i: number) => (i === 0 ? (sMm[0] + sMm[n - 1] - L) / 2 : (sMm[i - 1] + sMm[i]) / 2);
  const hi = (i: number) => (i === n - 1 ? (sMm[n - 1] + sMm[0] + L) / 2 : (sMm[i] + sMm[i + 1]) / 2);
  const groups = Math.max(1, Math.min(n, maxQuads));
  for (let g = 0; g < groups; g++) {
    const first = Math.floor((g * n) / groups);
    const last = Math.floor(((g + 1) * n) / groups) - 1;
    let low = Infinity;
    for (let i = first; i <= last; i++) low = Math.min(low, stressMpa[i]);
    const s0 = lo(first);
    const s1 = hi(last);
    const a = edge(s0);
    const b = edge(g === groups - 1 ? s1 : s1 + (s1 - s0) / 4);
    quads.push({ x: [a.ox, b.ox, b.ix, a.ix], y: [a.oy, b.oy, b.iy, a.iy], stressMpa: low * factor });
  }
  return quads;
}
